import { describe, expect, it } from 'vitest';
import { safeNext } from './safe-next.js';

describe('safeNext', () => {
  it('keeps paths on this site, with their query', () => {
    expect(safeNext('/studio/people')).toBe('/studio/people');
    expect(safeNext('/projects/7?tab=audits')).toBe('/projects/7?tab=audits');
  });
  it('refuses other sites and odd forms', () => {
    for (const bad of ['//evil.example/x', 'https://evil.example', '/\\evil.example', 'javascript:alert(1)', '', null, undefined]) {
      expect(safeNext(bad)).toBe('/projects');
    }
  });
  it('does not loop back to the sign-in pages', () => {
    expect(safeNext('/sign-in?next=/x')).toBe('/projects');
    expect(safeNext('/sign-up', '/home')).toBe('/home');
  });
});
