import type { AppDeps } from '../deps.js';
import type { RouteSpec } from '../http/route-table.js';
import { definitionProj, definitionWkt, samplesGeoJson } from '../services/exports.service.js';
import { loadCandidateContext } from '../services/heatmaps.service.js';
import { idParam } from '../services/project-guard.js';

const READ = ['admin', 'cartographer', 'editor', 'client'] as const;

/** Downloads: a candidate's PROJ string and WKT, and an audit's sample fields as GeoJSON. */
export function exportsRoutes(deps: AppDeps): RouteSpec[] {
  const ds = deps.dataSource;
  const ids = (p: Record<string, string>) => [idParam(p.projectId, 'That project'), idParam(p.candidateId, 'That candidate')] as const;
  return [
    {
      method: 'get',
      path: '/projects/:projectId/candidates/:candidateId/definition.proj',
      access: READ,
      summary: 'The candidate’s PROJ string as a text file',
      handler: async (req, res) => {
        const out = await definitionProj(ds, req.actor!, ...ids(req.params as Record<string, string>));
        res.attachment(out.fileName).type('text/plain; charset=utf-8').send(out.text);
      },
    },
    {
      method: 'get',
      path: '/projects/:projectId/candidates/:candidateId/definition.wkt',
      access: READ,
      summary: 'The candidate’s WKT (EPSG text, as entered, or WKT1 written from its parameters)',
      handler: async (req, res) => {
        const out = await definitionWkt(ds, req.actor!, ...ids(req.params as Record<string, string>));
        res.attachment(out.fileName).type('text/plain; charset=utf-8').send(out.text);
      },
    },
    {
      method: 'get',
      path: '/audits/:auditId/candidates/:candidateId/samples.geojson',
      access: READ,
      summary: 'The audit’s sample points with h, k, s, ω, a, b for one candidate (GeoJSON)',
      handler: async (req, res) => {
        const ctx = await loadCandidateContext(ds, req.actor!, idParam(req.params.auditId, 'That audit'), idParam(req.params.candidateId, 'That candidate in this audit'));
        res.attachment(`audit-${ctx.audit.id}-candidate-${ctx.candidate.id}-samples.geojson`).type('application/geo+json');
        res.send(JSON.stringify(samplesGeoJson(ctx)));
      },
    },
  ];
}
