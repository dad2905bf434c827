import { createHash } from 'node:crypto';
import type { Audit, Candidate, MapProject, Region, ReviewRound, Scorecard } from '../entities/index.js';
import { canonicalJson } from '../regions/canonical-json.js';

export const RECORD_FORMAT = 'warpmeter.sign-off';
export const RECORD_VERSION = 1;

/**
 * Everything needed to reproduce and identify what the client approved. Numbers are the same
 * doubles the database returned (JSON keeps finite doubles exactly in their shortest round-trip
 * form), so writing, reading back and re-hashing the record gives the same SHA-256.
 */
export interface SignOffRecord {
  format: string;
  version: number;
  project: { id: number; title: string; clientName: string; purpose: string; scaleBand: string };
  region: { id: number; name: string; sourceFileName: string; sourceFormat: string; sourceCrs: string; sha256: string; geometry: unknown };
  candidate: { id: number; label: string; family: string; origin: string; definition: string; resolved: string };
  audit: { id: number; engineVersion: string; settings: unknown; inputHash: string };
  scorecard: unknown;
  round: { id: number; number: number; shortlist: number[] };
  reviewer: { userId: number; name: string; email: string; signature: string; comment: string | null };
  approvedAt: string;
}

export interface RecordInputs {
  project: MapProject;
  region: Region;
  candidate: Candidate;
  audit: Audit;
  scorecard: Scorecard;
  round: ReviewRound;
  reviewer: { userId: number; name: string; email: string; signature: string; comment: string | null };
  approvedAt: Date;
}

export function buildRecord(i: RecordInputs): SignOffRecord {
  return {
    format: RECORD_FORMAT,
    version: RECORD_VERSION,
    project: { id: i.project.id, title: i.project.title, clientName: i.project.clientName, purpose: i.project.purpose, scaleBand: i.project.scaleBand },
    region: {
      id: i.region.id, name: i.region.name, sourceFileName: i.region.sourceFileName, sourceFormat: i.region.sourceFormat,
      sourceCrs: i.region.sourceCrs, sha256: i.region.sha256, geometry: i.region.geometry,
    },
    candidate: {
      id: i.candidate.id, label: i.candidate.label, family: i.candidate.family, origin: i.candidate.origin,
      definition: i.candidate.definition, resolved: i.candidate.resolved,
    },
    audit: { id: i.audit.id, engineVersion: i.audit.engineVersion, settings: i.audit.settings, inputHash: i.audit.inputHash },
    scorecard: i.scorecard.metrics,
    round: { id: i.round.id, number: i.round.roundNumber, shortlist: i.round.candidateIds },
    reviewer: i.reviewer,
    approvedAt: i.approvedAt.toISOString(),
  };
}

export const sha256Hex = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');

/** The record's canonical JSON text and its SHA-256, the two things stored. */
export function sealRecord(record: SignOffRecord): { json: string; hash: string } {
  const json = canonicalJson(record);
  return { json, hash: sha256Hex(json) };
}
