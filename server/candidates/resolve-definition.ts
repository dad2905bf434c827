import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { resolveDefinitionWith, type ResolvedDefinition } from '../../shared/engine/definition-core.js';
import type { EpsgEntry } from '../../shared/engine/epsg.js';

/**
 * EPSG codes for the server's processes, read one code at a time from epsg-index's per-code files
 * (`epsg-index/s/<code>.json`, the same entries as its `all.json`).
 *
 * The engine's own `resolveDefinition` imports the whole index: 8 MB of JSON that becomes ~18 MB
 * of heap in every process and thread that loads it (the module's source text and the parsed
 * table). In the web server that was a fifth of the live heap, which every full garbage
 * collection has to mark, for a lookup made only when someone types an EPSG code.
 */
const PER_CODE_DIR = path.join(path.dirname(createRequire(import.meta.url).resolve('epsg-index/all.json')), 's');

/** Codes looked up recently (found or not); a studio works with a few dozen. */
const recent = new Map<number, EpsgEntry | undefined>();
const RECENT_LIMIT = 512;

/** The EPSG index entry for `code`, or undefined when the index has none. Example: lookupEpsgCode(5070)?.name. */
export function lookupEpsgCode(code: number): EpsgEntry | undefined {
  // Only plain positive integers name a file; anything else is simply not a code.
  if (!Number.isSafeInteger(code) || code <= 0) return undefined;
  if (recent.has(code)) return recent.get(code);
  let entry: EpsgEntry | undefined;
  try {
    entry = JSON.parse(readFileSync(path.join(PER_CODE_DIR, `${code}.json`), 'utf8')) as EpsgEntry;
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== 'ENOENT') throw err;
  }
  if (recent.size >= RECENT_LIMIT) recent.delete(recent.keys().next().value!);
  recent.set(code, entry);
  return entry;
}

/** The index's own WKT for an "EPSG:n" definition, or null (not an EPSG code, unknown, or no WKT in the index). */
export function epsgWkt(definition: string): string | null {
  const code = /^\s*epsg:\s*(\d+)\s*$/i.exec(definition)?.[1];
  return code ? (lookupEpsgCode(Number(code))?.wkt ?? null) : null;
}

/**
 * The engine's `resolveDefinition` (PROJ string, "EPSG:n" or WKT → the engine's description of a
 * projection; throws an Error naming what is wrong), with EPSG codes looked up as above.
 */
export function resolveDefinition(definition: string): ResolvedDefinition {
  return resolveDefinitionWith(definition, lookupEpsgCode);
}
