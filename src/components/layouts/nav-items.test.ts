import { describe, expect, it } from 'vitest';
import { navFor } from './nav-items.js';

describe('navFor', () => {
  it('gives admins the studio pages', () => {
    expect(navFor('admin').map((i) => i.label)).toEqual(['Projects', 'People', 'Billing']);
  });
  it('keeps people and billing from every other role', () => {
    for (const role of ['cartographer', 'editor'] as const) {
      expect(navFor(role).map((i) => i.label)).toEqual(['Projects']);
    }
    expect(navFor('client').map((i) => i.label)).not.toContain('People');
  });
  it('gives client reviewers their review requests', () => {
    expect(navFor('client').map((i) => i.label)).toEqual(['Projects', 'Reviews']);
  });
});
