import type { DataSource, EntityTarget, ObjectLiteral } from 'typeorm';

/**
 * The busiest reads (the project list, an audit with its project, its scorecards) go straight to
 * the connection pool and hydrate entities from the metadata, column by column, with the driver's
 * own conversions (JSON, dates). Under load the ORM's query building and result transformation
 * cost more than the queries; everything else keeps using repositories.
 */

/** Runs one query on the data source's pool (no query runner), resolving with the rows. */
export function poolQuery<T = Record<string, unknown>>(ds: DataSource, sql: string, params: unknown[]): Promise<T[]> {
  const pool = (ds.driver as unknown as { pool: { query(sql: string, params: unknown[], cb: (err: Error | null, rows: unknown) => void): void } }).pool;
  return new Promise((resolve, reject) => pool.query(sql, params, (err, rows) => (err ? reject(err) : resolve(rows as T[]))));
}

/** The entity's columns, or only the named properties. */
const columnsOf = (ds: DataSource, entity: EntityTarget<ObjectLiteral>, only?: readonly string[]) =>
  ds.getMetadata(entity).columns.filter((c) => !only || only.includes(c.propertyName));

/** Select lists already built, per data source (they depend only on the metadata). */
const selectLists = new WeakMap<DataSource, Map<string, string>>();

/** `alias.col AS alias_col, …` for every column of an entity (or only the named properties). */
export function selectColumns(ds: DataSource, entity: EntityTarget<ObjectLiteral>, alias: string, only?: readonly string[]): string {
  let lists = selectLists.get(ds);
  if (!lists) selectLists.set(ds, (lists = new Map()));
  const key = `${ds.getMetadata(entity).name}|${alias}|${only?.join(',') ?? ''}`;
  let list = lists.get(key);
  if (list === undefined) {
    const q = (s: string) => ds.driver.escape(s);
    list = columnsOf(ds, entity, only)
      .map((c) => `${alias}.${q(c.databaseName)} AS ${q(`${alias}_${c.databaseName}`)}`)
      .join(', ');
    lists.set(key, list);
  }
  return list;
}

/**
 * An entity from the `alias_col` fields of a row (see selectColumns), converted as the ORM would
 * (JSON columns arrive parsed or as text depending on the server's metadata; the driver copes).
 */
export function hydrate<T extends ObjectLiteral>(ds: DataSource, entity: EntityTarget<T>, row: Record<string, unknown>, alias: string, only?: readonly string[]): T {
  const out = ds.getMetadata(entity).create() as Record<string, unknown>;
  for (const c of columnsOf(ds, entity, only)) out[c.propertyName] = ds.driver.prepareHydratedValue(row[`${alias}_${c.databaseName}`], c);
  return out as T;
}

/** The quoted table name of an entity (through its repository, like every other data access). */
export const tableOf = (ds: DataSource, entity: EntityTarget<ObjectLiteral>) => ds.driver.escape(ds.getRepository(entity).metadata.tablePath);
