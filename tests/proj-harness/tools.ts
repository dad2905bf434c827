/**
 * Test-side access to Debian's PROJ: installs proj-bin / libproj-dev when missing (through the
 * project's ensure-debian script), compiles factors.c into tests/.tmp/ on first use, and runs
 * proj_factors(), `proj`, `geod` and the warpmeter CLI on lines of text.
 */
import { execFileSync, spawn } from 'node:child_process';
import { existsSync, mkdirSync, statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../../', import.meta.url));
const source = `${root}tests/proj-harness/factors.c`;
const binary = `${root}tests/.tmp/proj-factors`;

/** Ensures proj, geod and the PROJ headers exist, and returns the path of the compiled harness. */
export function ensureProjHarness(): string {
  // The script treats a path as present only when it is executable, so a header always looks
  // missing to it: call it only when something really is.
  const have = (cmd: string) => {
    try {
      execFileSync('sh', ['-c', `command -v ${cmd}`], { stdio: 'ignore' });
      return true;
    } catch {
      return false;
    }
  };
  if (!have('proj') || !have('geod') || !existsSync('/usr/include/proj.h')) {
    execFileSync('bash', [`${root}server/scripts/ensure-debian.sh`, 'proj:proj-bin', '/usr/include/proj.h:libproj-dev', 'geod:proj-bin'], {
      stdio: 'inherit',
    });
  }
  if (!existsSync(binary) || statSync(binary).mtimeMs < statSync(source).mtimeMs) {
    mkdirSync(`${root}tests/.tmp`, { recursive: true });
    execFileSync('gcc', ['-O2', '-o', binary, source, '-lproj', '-lm']);
  }
  return binary;
}

/** Runs a command with text on stdin; resolves with stdout, stderr and the exit status. */
export function runWithInput(cmd: string, args: string[], input: string): Promise<{ stdout: string; stderr: string; status: number }> {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { cwd: root });
    const out: Buffer[] = [];
    const err: Buffer[] = [];
    child.stdout.on('data', (d) => out.push(d));
    child.stderr.on('data', (d) => err.push(d));
    child.on('error', reject);
    child.on('close', (status) => resolve({ stdout: Buffer.concat(out).toString(), stderr: Buffer.concat(err).toString(), status: status ?? -1 }));
    child.stdin.end(input);
  });
}

/** Runs `warpmeter` (server/cli/bin.mjs) with arguments and stdin. */
export function runWarpmeter(args: string[], input = '') {
  return runWithInput(process.execPath, [`${root}server/cli/bin.mjs`, ...args], input);
}

/** Parses tab/space-separated numeric lines ("nan" → NaN). */
export function parseRows(text: string): number[][] {
  return text
    .trim()
    .split('\n')
    .filter((l) => l.length)
    .map((l) => l.trim().split(/\s+/).map((v) => (v === 'nan' || v === '*' ? NaN : Number(v))));
}

export const repoRoot = root;
