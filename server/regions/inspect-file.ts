import type { FeaturePick, RegionInspection, RegionReport } from '../../shared/api/regions.schema.js';
import { readUploadedRegion, type ParsedRegionFile } from './read-upload.js';
import { buildReport, cleanFeatures, summariseFeature, type CleanFeature } from './region-report.js';
import { invalidRegion } from './region-errors.js';

/** A region file read, checked and cleaned: everything the picker and the store step need. */
export interface CheckedRegionFile {
  fileName: string;
  file: ParsedRegionFile;
  features: CleanFeature[];
  tally: ReturnType<typeof cleanFeatures>['tally'];
}

export async function checkRegionFile(buffer: Buffer, fileName: string): Promise<CheckedRegionFile> {
  const file = await readUploadedRegion(buffer, fileName);
  const { features, tally } = cleanFeatures(file, fileName);
  return { fileName, file, features, tally };
}

/** The picker's view: each feature in brief, and the report for all of them together. */
export function inspection(checked: CheckedRegionFile): RegionInspection {
  return {
    fileName: checked.fileName,
    format: checked.file.format,
    sourceCrs: checked.file.sourceCrs,
    features: checked.features.map(summariseFeature),
    report: buildReport(checked.file, checked.features, checked.file.features.length, checked.tally),
  };
}

/** The features a pick names; an index the file does not have is refused, listing the valid ones. */
export function pickFeatures(checked: CheckedRegionFile, pick: FeaturePick): CleanFeature[] {
  if (pick === 'all') return checked.features;
  const byIndex = new Map(checked.features.map((f) => [f.index, f]));
  const missing = pick.filter((i) => !byIndex.has(i));
  if (missing.length) {
    const valid = checked.features.map((f) => f.index);
    const shown = valid.length > 12 ? `${valid.slice(0, 12).join(', ')}, …` : valid.join(', ');
    throw invalidRegion(`Feature ${missing.join(', ')} is not a polygon feature of ${checked.fileName} (its polygon features are ${shown}).`);
  }
  if (!pick.length) throw invalidRegion('Pick at least one feature.');
  return pick.map((i) => byIndex.get(i)!);
}

export function pickedReport(checked: CheckedRegionFile, picked: CleanFeature[]): RegionReport {
  return buildReport(checked.file, picked, checked.file.features.length, checked.tally);
}

/** A name for the picked features: the one name, a few joined, or the first and a count. */
export function regionName(picked: CleanFeature[]): string {
  const names = picked.map((f) => f.name);
  const text = names.length <= 3 ? names.join(' + ') : `${names[0]} + ${names.length - 1} more`;
  return text.slice(0, 200);
}
