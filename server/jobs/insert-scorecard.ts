import type { EntityManager } from 'typeorm';
import { Scorecard } from '../entities/index.js';
import { tableOf } from '../services/raw-rows.js';

export interface ScorecardRow {
  auditId: number;
  candidateId: number;
  studioId: number;
  metrics: Record<string, unknown>;
  fields: Buffer;
}

interface PreparedConnection {
  execute(sql: string, params: unknown[], cb: (err: Error | null) => void): void;
}

/**
 * Inserts one scorecard inside the caller's transaction as a prepared statement, so the field
 * blob travels as binary. Through the ORM's insert it would be written into the SQL text as hex:
 * twice the bytes, built on the event loop and parsed again by the database.
 */
export async function insertScorecard(tx: EntityManager, row: ScorecardRow): Promise<void> {
  const runner = tx.queryRunner;
  if (!runner) throw new Error('insertScorecard needs a transaction’s entity manager');
  const conn = (await runner.connect()) as PreparedConnection;
  const table = tableOf(tx.connection, Scorecard);
  const sql = `INSERT INTO ${table} (auditId, candidateId, studioId, metrics, fields) VALUES (?, ?, ?, ?, ?)`;
  await new Promise<void>((resolve, reject) =>
    conn.execute(sql, [row.auditId, row.candidateId, row.studioId, JSON.stringify(row.metrics), row.fields], (err) => (err ? reject(err) : resolve())),
  );
}
