import { prepareRegion } from '../../shared/engine/region/prepare';
import { regionSummary } from '../../shared/engine/region/summary';
import { MAP_PURPOSES, suggestCandidates, type MapPurpose } from '../../shared/engine/suggest';
import { optionValue, parseArgs, UsageError } from './args';
import type { CliIo } from './io';
import { loadRegionFile } from './region-file';

/** `warpmeter suggest <region> [--purpose equal-area|conformal|reference|equidistant] [--json]`. */
export async function suggestCommand(argv: string[], io: CliIo): Promise<number> {
  const args = parseArgs(argv, ['purpose'], ['json']);
  if (args.positional.length !== 1) throw new UsageError('suggest needs exactly one region file');
  const purpose = (optionValue(args, 'purpose') ?? 'reference') as MapPurpose;
  if (!MAP_PURPOSES.includes(purpose)) throw new UsageError(`--purpose must be one of ${MAP_PURPOSES.join(', ')}`);
  const summary = regionSummary(prepareRegion(await loadRegionFile(args.positional[0])));
  const proposals = suggestCandidates(summary, purpose);
  if (args.flags.has('json')) {
    io.stdout.write(`${JSON.stringify({ purpose, region: summary, candidates: proposals }, null, 2)}\n`);
    return 0;
  }
  io.stdout.write(`${proposals.length} candidates for ${/^[aeiou]/.test(purpose) ? "an" : "a"} ${purpose} map of a region of ${Math.round(summary.areaKm2)} km² centred on ${summary.centreLatDeg.toFixed(2)}°, ${summary.centreLonDeg.toFixed(2)}°:\n\n`);
  proposals.forEach((p, i) => io.stdout.write(`${i + 1}. ${p.label}\n   ${p.definition}\n   ${p.reason}\n\n`));
  return 0;
}
