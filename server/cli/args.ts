/** Command-line options: repeated flags collect into arrays; "--flag=value" and "--flag value" both work. */
export interface ParsedArgs {
  positional: string[];
  options: Map<string, string[]>;
  flags: Set<string>;
}

/** Thrown for a bad command line; the CLI prints the message and exits with status 2. */
export class UsageError extends Error {}

/**
 * Parses argv against the options that take a value and the boolean flags a command accepts.
 * Example: parseArgs(['a.geojson', '--proj', 'EPSG:3035', '--json'], ['proj'], ['json']).
 */
export function parseArgs(argv: string[], valued: string[], booleans: string[]): ParsedArgs {
  const positional: string[] = [];
  const options = new Map<string, string[]>();
  const flags = new Set<string>();
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (!arg.startsWith('--') || arg === '--') {
      positional.push(arg);
      continue;
    }
    const eq = arg.indexOf('=');
    const name = arg.slice(2, eq < 0 ? undefined : eq);
    if (booleans.includes(name)) {
      if (eq >= 0) throw new UsageError(`option --${name} takes no value`);
      flags.add(name);
    } else if (valued.includes(name)) {
      let value: string | undefined;
      if (eq >= 0) value = arg.slice(eq + 1);
      else value = argv[++i];
      if (value === undefined) throw new UsageError(`option --${name} needs a value`);
      options.set(name, [...(options.get(name) ?? []), value]);
    } else {
      throw new UsageError(`unknown option --${name}`);
    }
  }
  return { positional, options, flags };
}

/** The last value of a valued option, or undefined. */
export function optionValue(args: ParsedArgs, name: string): string | undefined {
  const v = args.options.get(name);
  return v ? v[v.length - 1] : undefined;
}

/** An integer option within [min, max], or the default. */
export function intOption(args: ParsedArgs, name: string, fallback: number, min: number, max: number): number {
  const text = optionValue(args, name);
  if (text === undefined) return fallback;
  const value = Number(text);
  if (!Number.isInteger(value) || value < min || value > max) {
    throw new UsageError(`--${name} must be an integer from ${min} to ${max}, got "${text}"`);
  }
  return value;
}
