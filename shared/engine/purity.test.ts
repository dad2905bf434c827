/** The engine stays pure: no Node built-ins, file system, server or client frameworks in its modules. */
import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

const dir = new URL('./', import.meta.url);
const sources = (sub = ''): string[] =>
  readdirSync(new URL(sub, dir), { withFileTypes: true }).flatMap((d) =>
    d.isDirectory() ? sources(`${sub}${d.name}/`) : d.name.endsWith('.ts') && !d.name.endsWith('.test.ts') ? [`${sub}${d.name}`] : [],
  );
const FORBIDDEN = /from\s+'(node:[^']+|fs|path|os|child_process|worker_threads|express|react[^']*|typeorm|mysql2|bullmq|ioredis|sharp)'/;

describe('shared/engine purity', () => {
  it.each(sources())('%s imports nothing impure and keeps no module-level mutable state', (file) => {
    const text = readFileSync(new URL(file, dir), 'utf8');
    expect(text).not.toMatch(FORBIDDEN);
    expect(text).not.toMatch(/^(let|var)\s/m);
    expect(text.split('\n').length).toBeLessThan(300);
  });
});
