import type { MultiPolygon, Polygon } from 'geojson';
import type { AuditCandidateSnapshot } from './audit-settings.js';
import type { SampleFields } from './fields-codec.js';

export interface AuditInput {
  geometry: Polygon | MultiPolygon;
  candidates: AuditCandidateSnapshot[];
  samples: number;
  seed: number;
}

export interface CandidateResult {
  candidateId: number;
  /** The engine's scorecard for this candidate, stored as given. */
  metrics: Record<string, unknown>;
  fields: SampleFields;
}

export interface AuditResult {
  candidates: CandidateResult[];
  timingsMs: Record<string, number>;
}

/**
 * The computation behind an audit, kept behind this seam so the job code does not depend on how
 * the engine spreads its work (worker threads) and tests can substitute a failing engine.
 */
export interface AuditEngine {
  scoreCandidates(input: AuditInput, onProgress: (fraction: number) => Promise<void>): Promise<AuditResult>;
  close(): Promise<void>;
}
