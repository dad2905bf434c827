import { describe, expect, it } from 'vitest';
// @ts-expect-error a plain .mjs script without type declarations
import { explainedPackages, judgeAudit } from './audit-deps.mjs';

// Shapes follow `npm audit --json` (npm 7 and later): metadata.vulnerabilities counts and one
// entry per vulnerable package with its severity and the advisories it comes "via".
const report = (vulns: Record<string, { severity: string; isDirect?: boolean }>) => ({
  auditReportVersion: 2,
  vulnerabilities: Object.fromEntries(
    Object.entries(vulns).map(([name, v]) => [name, { name, ...v, via: [{ url: `https://github.com/advisories/GHSA-${name}`, title: 't' }] }]),
  ),
  metadata: { vulnerabilities: { high: 1 } },
});

describe('dependency audit judgement', () => {
  const md = '# Security\n\n## Dependency advisories\n- `left-pad` (GHSA-x): only used by the build.\n\n## Other\n- `not-here`: outside the section\n';

  it('reads only the backticked names of the "Dependency advisories" section', () => {
    expect([...explainedPackages(md)]).toEqual(['left-pad']);
    expect([...explainedPackages('# nothing')]).toEqual([]);
  });

  it('passes moderate advisories and explained high ones; fails unexplained high or critical ones', () => {
    const explained = explainedPackages(md);
    expect(judgeAudit(report({ a: { severity: 'moderate' } }), explained).status).toBe('ok');
    expect(judgeAudit(report({ 'left-pad': { severity: 'critical' } }), explained).status).toBe('ok');
    const bad = judgeAudit(report({ 'not-here': { severity: 'high', isDirect: true } }), explained);
    expect(bad.status).toBe('unexplained');
    expect(bad.lines.join('\n')).toContain('NOT EXPLAINED: not-here (high, direct)');
  });

  it('never calls an unanswered audit a pass', () => {
    const refused = { message: '405 Method Not Allowed - POST https://registry.example/-/npm/v1/security/advisories/bulk', statusCode: 405 };
    expect(judgeAudit(refused, new Set()).status).toBe('unknown');
    expect(judgeAudit(null, new Set()).status).toBe('unknown');
  });
});
