import { UsageError } from './args';
import { factorsCommand } from './factors-command';
import type { CliIo } from './io';

const USAGE = `usage:
  warpmeter factors --proj '<PROJ string | EPSG:n | WKT>' [--threads N]   < lon-lat lines
  warpmeter audit <region.geojson|.topojson|.zip> --proj '<def>' [--proj '<def>' …] [--samples N] [--seed S] [--json]
  warpmeter suggest <region file> [--purpose equal-area|conformal|reference|equidistant] [--json]
See server/cli/README.md.`;

type Command = (argv: string[], io: CliIo) => Promise<number>;

const COMMANDS: Record<string, () => Promise<Command>> = {
  factors: async () => factorsCommand,
  audit: async () => (await import('./audit-command')).auditCommand,
  suggest: async () => (await import('./suggest-command')).suggestCommand,
};

/** Runs the CLI; returns the exit status (0 ok, 1 some input rejected, 2 usage or file error). */
export async function main(argv: string[], io: CliIo): Promise<number> {
  const [name, ...rest] = argv;
  if (!name || name === '--help' || name === '-h' || name === 'help') {
    (name ? io.stdout : io.stderr).write(`${USAGE}\n`);
    return name ? 0 : 2;
  }
  const load = COMMANDS[name];
  if (!load) {
    io.stderr.write(`warpmeter: unknown command "${name}"\n${USAGE}\n`);
    return 2;
  }
  try {
    return await (await load())(rest, io);
  } catch (err) {
    const message = err instanceof Error ? err.message : String(err);
    io.stderr.write(`warpmeter ${name}: ${message}\n`);
    if (err instanceof UsageError) io.stderr.write(`${USAGE}\n`);
    return 2;
  }
}
