import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp } from '../support/test-app.js';

const ROOT = path.resolve(import.meta.dirname, '../..');

describe('backup and restore scripts', () => {
  let t: Awaited<ReturnType<typeof createTestApp>>;
  const restored = `${process.env.WARPMETER_DB_NAME}_restored`;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t.dataSource().query(`DROP DATABASE IF EXISTS \`${restored}\``);
    await t.close();
  });

  it('dumps the database and restores it into a new one with the same tables and rows', async () => {
    const ds = t.dataSource();
    await ds.query('INSERT INTO studios (name, seatCount) VALUES (?, 2)', [`Backup check ${Date.now()} – Ünïcode`]);
    const out = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'wm-backup-')), 'dump.sql.gz');
    execFileSync('bash', [path.join(ROOT, 'server/scripts/backup.sh'), out], { env: process.env });
    expect(fs.statSync(out).size).toBeGreaterThan(100);
    execFileSync('bash', [path.join(ROOT, 'server/scripts/restore.sh'), out, restored], { env: process.env });

    const tables = (rows: Array<Record<string, string>>) => rows.map((r) => Object.values(r)[0]).sort();
    const before = tables(await ds.query('SHOW TABLES'));
    const after = tables(await ds.query(`SHOW TABLES FROM \`${restored}\``));
    expect(after).toEqual(before);
    for (const table of ['studios', 'users', 'memberships', 'migrations']) {
      const [a] = await ds.query(`SELECT COUNT(*) AS n FROM \`${table}\``);
      const [b] = await ds.query(`SELECT COUNT(*) AS n FROM \`${restored}\`.\`${table}\``);
      expect(Number(b.n)).toBe(Number(a.n));
    }
    const [latest] = await ds.query(`SELECT name FROM \`${restored}\`.studios ORDER BY id DESC LIMIT 1`);
    expect(latest.name).toContain('Ünïcode');
  });
});
