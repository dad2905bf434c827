import type { HeatmapField } from '@shared/api/audits.schema.js';

/** Addresses of the files the browser fetches itself (images and downloads, not JSON requests). */
export const heatmapUrl = (auditId: number, candidateId: number, field: HeatmapField, sizePx: number) =>
  `/api/audits/${auditId}/candidates/${candidateId}/heatmap/${field}.png?size=${sizePx}`;
export const scorecardsCsvUrl = (auditId: number) => `/api/audits/${auditId}/scorecards.csv`;
export const scorecardsJsonUrl = (auditId: number) => `/api/audits/${auditId}/scorecards.json`;
export const samplesGeoJsonUrl = (auditId: number, candidateId: number) => `/api/audits/${auditId}/candidates/${candidateId}/samples.geojson`;
export const definitionUrl = (projectId: number, candidateId: number, format: 'proj' | 'wkt') =>
  `/api/projects/${projectId}/candidates/${candidateId}/definition.${format}`;
export const compareUrl = (projectId: number, auditId: number, candidateIds: number[]) =>
  `/projects/${projectId}/compare?audit=${auditId}&candidates=${candidateIds.join(',')}`;
