import { resolveDefinition } from '../candidates/resolve-definition';
import { createFactorLineProcessor, type FactorLinesResult } from '../engine-pool/factor-lines';
import { FactorPool } from '../engine-pool/pool';
import { intOption, optionValue, parseArgs, UsageError } from './args';
import { writeAll, type CliIo } from './io';

const BATCH_CHARS = 1 << 18;
const MAX_IN_FLIGHT = 6;

/**
 * `warpmeter factors --proj <def> [--threads N]`: "lon lat" lines on stdin → "h k s omega a b" lines
 * on stdout. Streams with a bounded number of batches in flight, so memory stays constant.
 * Batches go to a worker pool once it has started; until then (and with --threads 1) they are
 * computed in this thread. Returns the exit status: 0, or 1 when some lines were malformed.
 */
export async function factorsCommand(argv: string[], io: CliIo): Promise<number> {
  const args = parseArgs(argv, ['proj', 'threads'], []);
  if (args.positional.length) throw new UsageError(`unexpected argument "${args.positional[0]}"`);
  const definition = optionValue(args, 'proj');
  if (!definition) throw new UsageError('factors needs --proj <PROJ string | EPSG:n | WKT>');
  if ((args.options.get('proj') ?? []).length > 1) throw new UsageError('factors takes a single --proj');
  const threads = intOption(args, 'threads', 2, 1, 64);
  const resolved = resolveDefinition(definition);
  const local = createFactorLineProcessor(resolved);

  let pool: FactorPool | undefined;
  // The pool starts with the first full batch: small inputs never pay for booting workers.
  let poolStart: Promise<unknown> | undefined;
  const startPool = () => {
    if (threads > 1 && !poolStart) poolStart = FactorPool.start(threads).then((p) => (pool = p)).catch(() => undefined);
  };
  const inFlight: Promise<FactorLinesResult>[] = [];
  let lineBase = 0;
  let errorCount = 0;

  const submit = (text: string) => {
    inFlight.push(pool ? pool.factorLines(resolved, text) : Promise.resolve(local(text)));
  };
  const drainOne = async () => {
    const r = await inFlight.shift()!;
    await writeAll(io.stdout, r.out);
    for (const e of r.errors) io.stderr.write(`line ${lineBase + e.line}: ${e.message}\n`);
    errorCount += r.errors.length;
    lineBase += r.lines;
  };

  io.stdin.setEncoding('utf8');
  let carry = '';
  try {
    for await (const chunk of io.stdin as AsyncIterable<string>) {
      carry += chunk;
      if (carry.length < BATCH_CHARS) continue;
      const cut = carry.lastIndexOf('\n');
      if (cut < 0) continue;
      startPool();
      submit(carry.slice(0, cut + 1));
      carry = carry.slice(cut + 1);
      while (inFlight.length >= MAX_IN_FLIGHT) await drainOne();
    }
    if (carry) submit(carry);
    while (inFlight.length) await drainOne();
  } finally {
    if (poolStart) await poolStart;
    await pool?.close();
  }
  if (errorCount) io.stderr.write(`warpmeter factors: ${errorCount} malformed line(s)\n`);
  return errorCount ? 1 : 0;
}
