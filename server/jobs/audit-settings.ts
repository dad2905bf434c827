/**
 * What an audit row's `settings` JSON holds. The candidates are copied in when the audit starts,
 * so a later edit or removal of a candidate never changes what an audit measured.
 */
export interface AuditCandidateSnapshot {
  id: number;
  label: string;
  family: string;
  /** As entered or proposed (PROJ string, EPSG:n or WKT). */
  definition: string;
  /** The PROJ string it resolved to. */
  resolved: string;
}

export interface StoredAuditSettings {
  samples: number;
  seed: number;
  candidates: AuditCandidateSnapshot[];
}

export function readSettings(settings: unknown): StoredAuditSettings {
  const s = (settings ?? {}) as Partial<StoredAuditSettings>;
  return {
    samples: Number(s.samples ?? 0),
    seed: Number(s.seed ?? 0),
    candidates: Array.isArray(s.candidates) ? s.candidates : [],
  };
}
