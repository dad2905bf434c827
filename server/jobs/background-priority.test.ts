/** The worker process's own session goes to the background, and only its session. */
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import os from 'node:os';
import { describe, expect, it } from 'vitest';
import { parseWorkerNice } from './background-priority';

describe('parseWorkerNice', () => {
  it('takes 0–19, defaults to 19, and refuses anything else with a message', () => {
    expect(parseWorkerNice(undefined)).toBe(19);
    expect(parseWorkerNice('0')).toBe(0);
    expect(parseWorkerNice('7')).toBe(7);
    for (const bad of ['20', '-1', 'low', '1.5', '19x']) expect(() => parseWorkerNice(bad)).toThrow(/whole number from 0 .* to 19/);
  });
});

/** This process's autogroup line, or '' where the kernel shows none. */
function readAutogroup(): string {
  try {
    return existsSync('/proc/self/autogroup') ? readFileSync('/proc/self/autogroup', 'utf8') : '';
  } catch {
    return '';
  }
}

describe('lowerSessionPriority', () => {
  it('sets the autogroup nice of a process leading a session of its own, leaving the caller’s session alone', () => {
    const before = readAutogroup();
    const niceBefore = os.getPriority(0);
    // setsid: the child leads a new session, so its autogroup is its own (sched(7)).
    const script = "import('./server/jobs/background-priority.ts').then((m) => { const ok = m.lowerSessionPriority(19); let g = ''; try { g = require('fs').readFileSync('/proc/self/autogroup', 'utf8'); } catch {} console.log(JSON.stringify({ ok, g, nice: require('os').getPriority(0) })); })";
    const r = spawnSync('setsid', ['-w', process.execPath, '--import', 'tsx', '-e', script], { encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    const { ok, g, nice } = JSON.parse(r.stdout.trim().split('\n').pop()!) as { ok: string; g: string; nice: number };
    if (/nice -?\d+/.test(g)) {
      // Autogroups in effect for the child: its session's nice was set, not its thread's.
      expect(ok).toBe('session');
      expect(g).toMatch(/nice 19/);
      expect(nice).toBe(niceBefore);
    } else {
      // No autogroup schedules it (autogroups off, or a cgroup of its own): only its thread's nice changes.
      expect(ok).toBe('thread');
      expect(nice).toBe(19);
    }
    expect(readAutogroup()).toBe(before);
    expect(os.getPriority(0)).toBe(niceBefore);
  });
  it('in a session shared with others, lowers only its own thread', () => {
    const before = readAutogroup();
    const script = "import('./server/jobs/background-priority.ts').then((m) => console.log(JSON.stringify({ ok: m.lowerSessionPriority(19), nice: require('os').getPriority(0) })))";
    const r = spawnSync(process.execPath, ['--import', 'tsx', '-e', script], { encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    expect(JSON.parse(r.stdout.trim().split('\n').pop()!)).toEqual({ ok: 'thread', nice: 19 });
    expect(readAutogroup()).toBe(before);
  });
});
