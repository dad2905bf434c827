/**
 * `npm run bench`: runs every section exported (as `sections`) by tests/bench/*.bench.ts and prints
 * one table per section. Speeds are reported as ratios against a reference measured in the same
 * run on the same input; nothing here asserts a time. Pass section names to run only those:
 * `npm run bench -- engine`.
 */
import { readdirSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';

/** One line of a section's table: label → value columns (already formatted). */
export type BenchRow = Record<string, string | number>;

export interface BenchSection {
  name: string;
  run(): Promise<BenchRow[]>;
}

function printTable(title: string, rows: BenchRow[]): void {
  console.log(`\n## ${title}`);
  if (!rows.length) return void console.log('(no rows)');
  const cols = [...new Set(rows.flatMap((r) => Object.keys(r)))];
  const text = rows.map((r) => cols.map((c) => String(r[c] ?? '')));
  const widths = cols.map((c, i) => Math.max(c.length, ...text.map((t) => t[i].length)));
  const line = (cells: string[]) => `| ${cells.map((c, i) => c.padEnd(widths[i])).join(' | ')} |`;
  console.log(line(cols));
  console.log(`|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`);
  for (const t of text) console.log(line(t));
}

async function main(): Promise<void> {
  const dir = fileURLToPath(new URL('.', import.meta.url));
  const wanted = process.argv.slice(2);
  const files = readdirSync(dir).filter((f) => f.endsWith('.bench.ts')).sort();
  for (const file of files) {
    const mod = (await import(pathToFileURL(`${dir}${file}`).href)) as { sections?: BenchSection[] };
    for (const section of mod.sections ?? []) {
      if (wanted.length && !wanted.some((w) => section.name.includes(w) || file.includes(w))) continue;
      const t0 = performance.now();
      const rows = await section.run();
      printTable(`${section.name} (${file}, ${((performance.now() - t0) / 1000).toFixed(1)} s)`, rows);
    }
  }
}

await main();
