import {
  createCandidateSchema,
  optimiseSchema,
  resolveDefinitionSchema,
  updateCandidateSchema,
} from '../../shared/api/candidates.schema.js';
import { sharedEngineThread } from '../engine-tasks/engine-thread.js';
import type { AppDeps } from '../deps.js';
import type { RouteSpec } from '../http/route-table.js';
import { idParam } from '../services/project-guard.js';
import {
  addCandidate,
  describeDefinition,
  listCandidates,
  listProposals,
  optimiseFamily,
  relabelCandidate,
  removeCandidate,
} from '../services/candidates.service.js';

const READ = ['admin', 'cartographer', 'editor', 'client'] as const;
const WRITE = ['admin', 'cartographer'] as const;
const STAFF = ['admin', 'cartographer', 'editor'] as const;
const project = (v: unknown) => idParam(v, 'That project');
const candidate = (v: unknown) => idParam(v, 'That candidate');

/** Candidates: the engine's proposals, manual entry with live validation, optimisation, edits. */
export function candidatesRoutes(deps: AppDeps): RouteSpec[] {
  const ds = deps.dataSource;
  // Proposals and optimisation run in the app's engine thread (kept: it takes ~1 s to start).
  const engine = sharedEngineThread(deps.services);
  return [
    {
      method: 'post',
      path: '/definitions/resolve',
      access: STAFF,
      summary: 'Resolve an EPSG code, PROJ string or WKT: family, ellipsoid, parameters, or a 422 saying what is wrong',
      handler: (req) => describeDefinition(resolveDefinitionSchema.parse(req.body ?? {}).definition),
    },
    {
      method: 'get',
      path: '/projects/:projectId/proposals',
      access: READ,
      summary: 'The engine’s proposed candidates for the current region and the project’s purpose, with reasons',
      handler: (req) => listProposals(ds, engine, req.actor!, project(req.params.projectId)),
    },
    {
      method: 'get',
      path: '/projects/:projectId/candidates',
      access: READ,
      summary: 'The project’s candidates',
      handler: async (req) => ({ candidates: await listCandidates(ds, req.actor!, project(req.params.projectId)) }),
    },
    {
      method: 'post',
      path: '/projects/:projectId/candidates',
      access: WRITE,
      summary: 'Add a candidate (definition resolved by the engine; origin proposed, optimised or entered)',
      handler: async (req, res) => {
        const input = createCandidateSchema.parse(req.body ?? {});
        const created = await addCandidate(ds, req.actor!, project(req.params.projectId), input);
        res.status(201);
        return created;
      },
    },
    {
      method: 'patch',
      path: '/projects/:projectId/candidates/:candidateId',
      access: WRITE,
      summary: 'Rename a candidate',
      handler: (req) =>
        relabelCandidate(ds, req.actor!, project(req.params.projectId), candidate(req.params.candidateId), updateCandidateSchema.parse(req.body ?? {})),
    },
    {
      method: 'delete',
      path: '/projects/:projectId/candidates/:candidateId',
      access: WRITE,
      summary: 'Remove a candidate no audit has used',
      handler: async (req) => {
        await removeCandidate(ds, req.actor!, project(req.params.projectId), candidate(req.params.candidateId));
      },
    },
    {
      method: 'post',
      path: '/projects/:projectId/optimise',
      access: WRITE,
      summary: 'Tune a family’s parameters for the current region by a criterion; returns the optimum and its gain',
      handler: (req) => optimiseFamily(ds, engine, req.actor!, project(req.params.projectId), optimiseSchema.parse(req.body ?? {})),
    },
  ];
}
