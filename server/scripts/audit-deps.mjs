#!/usr/bin/env node
// `npm run audit:deps`: the dependency audit. Runs `npm audit --omit=dev --json` (add
// `--include-dev` to audit the dev tools too) and fails on any high or critical advisory that
// SECURITY.md does not explain under its "Dependency advisories" heading, one line per package:
//   - `package-name` (GHSA-xxxx-xxxx-xxxx): why it does not affect Warpmeter, or what is planned.
// Exit codes: 0 nothing unexplained, 1 unexplained high/critical advisories, 2 no answer from the
// advisory service (the result is unknown, never a pass). Needs the npm registry; the test suite
// never runs it.
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const SEVERE = new Set(['high', 'critical']);

/** Packages explained in SECURITY.md's "Dependency advisories" section (backticked names). */
export function explainedPackages(securityMd) {
  const section = securityMd.split(/^## /m).find((s) => s.startsWith('Dependency advisories'));
  if (!section) return new Set();
  return new Set([...section.matchAll(/^\s*[-*]\s+`([^`]+)`/gm)].map((m) => m[1]));
}

/**
 * Judges `npm audit --json` output: { status: 'ok' | 'unexplained' | 'unknown', lines }.
 * `unknown` when npm could not get an answer (it then prints an error object, not a report).
 */
export function judgeAudit(report, explained) {
  if (!report || typeof report !== 'object' || !report.vulnerabilities) {
    const why = report?.error?.summary || report?.message || 'npm audit gave no report';
    return { status: 'unknown', lines: [`The advisory service gave no answer: ${why}`] };
  }
  const lines = [];
  const unexplained = [];
  const counts = report.metadata?.vulnerabilities ?? {};
  lines.push(`Advisories by severity: ${JSON.stringify(counts)}`);
  for (const [name, v] of Object.entries(report.vulnerabilities)) {
    if (!SEVERE.has(v.severity)) continue;
    const ids = (v.via ?? []).filter((x) => typeof x === 'object').map((x) => x.url ?? x.title).join(', ');
    if (explained.has(name)) lines.push(`explained in SECURITY.md: ${name} (${v.severity}) ${ids}`);
    else unexplained.push(`${name} (${v.severity}${v.isDirect ? ', direct' : ''}) ${ids}${v.fixAvailable ? ' — a fix is available' : ''}`);
  }
  for (const u of unexplained) lines.push(`NOT EXPLAINED: ${u}`);
  return { status: unexplained.length ? 'unexplained' : 'ok', lines };
}

function main() {
  const args = ['audit', '--json', ...(process.argv.includes('--include-dev') ? [] : ['--omit=dev'])];
  const run = spawnSync('npm', args, { cwd: ROOT, encoding: 'utf8', timeout: 180_000, env: { ...process.env, npm_config_audit: 'true' } });
  let report;
  try {
    report = JSON.parse(run.stdout || 'null');
  } catch {
    report = { message: (run.stderr || run.stdout || String(run.error ?? '')).trim().split('\n').slice(-3).join(' ') };
  }
  if (!report && run.error) report = { message: String(run.error) };
  const { status, lines } = judgeAudit(report, explainedPackages(readFileSync(path.join(ROOT, 'SECURITY.md'), 'utf8')));
  for (const l of lines) console.log(l);
  if (status === 'unknown') {
    console.log('Result unknown: run `npm run audit:deps` again where the npm registry answers audit requests.');
    process.exit(2);
  }
  console.log(status === 'ok' ? 'No unexplained high or critical advisories.' : 'Explain or fix the advisories above (SECURITY.md, "Dependency advisories").');
  process.exit(status === 'ok' ? 0 : 1);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === path.resolve(process.argv[1])) main();
