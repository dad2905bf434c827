import {
  heatmapFieldSchema,
  heatmapQuerySchema,
  routeQuerySchema,
  startAuditSchema,
} from '../../shared/api/audits.schema.js';
import type { AppDeps } from '../deps.js';
import type { RouteSpec } from '../http/route-table.js';
import { auditJobs } from '../jobs/runner.js';
import { getAudit, listAudits, startAudit } from '../services/audits.service.js';
import { heatmapLegend, heatmapPng, loadCandidateContext } from '../services/heatmaps.service.js';
import { idParam } from '../services/project-guard.js';
import { overlay, routeBetween } from '../services/routes-overlay.service.js';
import { scorecardsCsv, scorecardsJson } from '../services/scorecards.service.js';

const READ = ['admin', 'cartographer', 'editor', 'client'] as const;
const WRITE = ['admin', 'cartographer'] as const;

/** Audits (background jobs), their scorecards and exports, heatmaps, overlays and routes. */
export function auditsRoutes(deps: AppDeps): RouteSpec[] {
  const ds = deps.dataSource;
  const auditId = (v: unknown) => idParam(v, 'That audit');
  const candidateId = (v: unknown) => idParam(v, 'That candidate in this audit');
  return [
    {
      method: 'post',
      path: '/projects/:projectId/audits',
      access: WRITE,
      summary: 'Start an audit of the current region over the chosen candidates (runs in the background)',
      handler: async (req, res) => {
        const input = startAuditSchema.parse(req.body ?? {});
        const audit = await startAudit(ds, req.actor!, idParam(req.params.projectId, 'That project'), input, (id) => auditJobs(deps).enqueue(id));
        res.status(202);
        return audit;
      },
    },
    {
      method: 'get',
      path: '/projects/:projectId/audits',
      access: READ,
      summary: 'The project’s audits, newest first, with status and progress',
      handler: async (req) => ({ audits: await listAudits(ds, req.actor!, idParam(req.params.projectId, 'That project')) }),
    },
    {
      method: 'get',
      path: '/audits/:auditId',
      access: READ,
      summary: 'One audit: status, progress, error, settings and scorecards',
      handler: (req) => getAudit(ds, req.actor!, auditId(req.params.auditId)),
    },
    {
      method: 'get',
      path: '/audits/:auditId/scorecards.json',
      access: READ,
      summary: 'Scorecards of a finished audit as JSON',
      handler: async (req, res) => {
        const body = await scorecardsJson(ds, req.actor!, auditId(req.params.auditId));
        res.attachment(`audit-${body.audit.auditId}-scorecards.json`);
        return body;
      },
    },
    {
      method: 'get',
      path: '/audits/:auditId/scorecards.csv',
      access: READ,
      summary: 'Scorecards of a finished audit as CSV',
      handler: async (req, res) => {
        const id = auditId(req.params.auditId);
        const csv = await scorecardsCsv(ds, req.actor!, id);
        res.attachment(`audit-${id}-scorecards.csv`).type('text/csv; charset=utf-8').send(csv);
      },
    },
    {
      method: 'get',
      path: '/audits/:auditId/candidates/:candidateId/heatmap/:field.png',
      access: READ,
      summary: 'Heatmap of a field over the region (PNG, transparent outside the region, cached)',
      handler: async (req, res) => {
        const field = heatmapFieldSchema.parse(req.params.field);
        const { size } = heatmapQuerySchema.parse(req.query);
        const out = await heatmapPng(ds, deps.config.dataDir, req.actor!, auditId(req.params.auditId), candidateId(req.params.candidateId), field, size);
        res.set({ ETag: out.etag, 'Cache-Control': 'private, max-age=86400', 'X-Heatmap-Cache': out.cached ? 'hit' : 'miss' });
        if (req.headers['if-none-match'] === out.etag) return void res.status(304).end();
        res.type('image/png').send(out.png);
      },
    },
    {
      method: 'get',
      path: '/audits/:auditId/candidates/:candidateId/heatmap/:field/legend',
      access: READ,
      summary: 'Legend of a heatmap field: colour stops, domain, units and label',
      handler: (req) =>
        heatmapLegend(ds, req.actor!, auditId(req.params.auditId), candidateId(req.params.candidateId), heatmapFieldSchema.parse(req.params.field)),
    },
    {
      method: 'get',
      path: '/audits/:auditId/candidates/:candidateId/overlay',
      access: READ,
      summary: 'Region outline, graticule, Tissot ellipses and worst points in the heatmap’s frame',
      handler: async (req) => {
        const ctx = await loadCandidateContext(ds, req.actor!, auditId(req.params.auditId), candidateId(req.params.candidateId));
        return overlay(ctx);
      },
    },
    {
      method: 'get',
      path: '/audits/:auditId/candidates/:candidateId/route',
      access: READ,
      summary: 'Great circle and rhumb line between two places on the candidate, with distance errors',
      handler: async (req) => {
        const { from, to } = routeQuerySchema.parse(req.query);
        const ctx = await loadCandidateContext(ds, req.actor!, auditId(req.params.auditId), candidateId(req.params.candidateId));
        return routeBetween(ctx, from, to);
      },
    },
  ];
}
