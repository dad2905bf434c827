import { describe, expect, it } from 'vitest';
import { navFor } from './nav-items.js';

describe('navFor', () => {
  it('gives admins the studio pages', () => {
    expect(navFor('admin').map((i) => i.label)).toEqual(['Projects', 'People', 'Billing']);
  });
  it('keeps people and billing from every other role', () => {
    for (const role of ['cartographer', 'editor', 'client'] as const) {
      expect(navFor(role).map((i) => i.label)).toEqual(['Projects']);
    }
  });
});
