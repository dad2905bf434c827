import type { MultiPolygon, Polygon } from 'geojson';
import type { VerifyResult } from '../../shared/api/review.schema.js';
import type { SignOff } from '../entities/index.js';
import type { AuditEngine } from '../jobs/audit-engine.js';
import { readSettings, type AuditCandidateSnapshot } from '../jobs/audit-settings.js';
import { canonicalJson, canonicalSha256 } from '../regions/canonical-json.js';
import { diffMetrics } from './compare-metrics.js';
import { sealRecord, sha256Hex, type SignOffRecord } from './record.js';

/**
 * Re-runs the audit of the approved candidate from nothing but the stored record: the region
 * geometry, the definition as the audit saw it, the sample count and the sampling seed. Then rebuilds the
 * record with the fresh scorecard and hashes it again. Reproducible numbers give the same hash.
 */
export async function verifyRecord(signOff: SignOff, engine: AuditEngine, currentEngineVersion: string): Promise<VerifyResult> {
  const t0 = performance.now();
  const record = JSON.parse(signOff.recordJson) as SignOffRecord;
  // Intact: the stored text hashes to the stored hash and is still in canonical form.
  const recordIntact = sha256Hex(signOff.recordJson) === signOff.recordHash && canonicalJson(record) === signOff.recordJson;
  const regionHashMatches = canonicalSha256(record.region.geometry) === record.region.sha256;

  const settings = readSettings(record.audit.settings);
  const snapshot: AuditCandidateSnapshot = settings.candidates.find((c) => c.id === record.candidate.id) ?? {
    id: record.candidate.id,
    label: record.candidate.label,
    family: record.candidate.family,
    definition: record.candidate.definition,
    resolved: record.candidate.resolved,
  };
  const result = await engine.scoreCandidates(
    { geometry: record.region.geometry as Polygon | MultiPolygon, candidates: [snapshot], samples: settings.samples, seed: settings.seed },
    async () => {},
  );
  const fresh = result.candidates.find((c) => c.candidateId === snapshot.id);
  if (!fresh) throw new Error('the engine returned no scorecard for the approved candidate');
  // Stored metrics went through a JSON column; put the fresh ones through JSON too before comparing.
  const recomputed: unknown = JSON.parse(JSON.stringify(fresh.metrics));
  const differences = diffMetrics(record.scorecard, recomputed);
  const recomputedHash = sealRecord({ ...record, scorecard: recomputed }).hash;

  return {
    signOffId: signOff.id,
    storedHash: signOff.recordHash,
    recomputedHash,
    recordIntact,
    regionHashMatches,
    metricsMatch: differences.length === 0,
    hashMatches: recordIntact && recomputedHash === signOff.recordHash,
    engineVersion: { stored: record.audit.engineVersion, current: currentEngineVersion },
    differences: differences.slice(0, 100),
    elapsedMs: Math.round(performance.now() - t0),
    checkedAt: new Date().toISOString(),
  };
}
