import { storeRegionFieldsSchema } from '../../shared/api/regions.schema.js';
import type { AppDeps } from '../deps.js';
import { sharedEngineThread } from '../engine-tasks/engine-thread.js';
import type { RouteSpec } from '../http/route-table.js';
import { regionUpload, uploadedFile } from '../regions/upload-middleware.js';
import { idParam } from '../services/project-guard.js';
import { currentRegion, inspectRegion, listRegions, storeRegion } from '../services/regions.service.js';

const READ = ['admin', 'cartographer', 'editor', 'client'] as const;
const WRITE = ['admin', 'cartographer'] as const;
const project = (v: unknown) => idParam(v, 'That project');

/** Region upload (inspect, then store the picked features), history and the current region. */
export function regionsRoutes(deps: AppDeps): RouteSpec[] {
  const ds = deps.dataSource;
  // Reading and checking a file takes up to seconds for a detailed boundary: done in the engine thread.
  const engine = sharedEngineThread(deps.services);
  return [
    {
      method: 'post',
      path: '/projects/:projectId/regions/inspect',
      access: WRITE,
      before: [regionUpload],
      summary: 'Read and check a region file (multipart field "file"); lists its features; stores nothing',
      handler: (req) => inspectRegion(ds, engine, req.actor!, project(req.params.projectId), uploadedFile(req.file)),
    },
    {
      method: 'post',
      path: '/projects/:projectId/regions',
      access: WRITE,
      before: [regionUpload],
      summary: 'Upload a region file (field "file"; "features" = all or indexes to merge; optional "name") as the current region',
      handler: async (req, res) => {
        const projectId = project(req.params.projectId);
        const fields = storeRegionFieldsSchema.parse({ features: req.body?.features ?? 'all', name: req.body?.name || undefined });
        const region = await storeRegion(ds, engine, req.actor!, projectId, uploadedFile(req.file), fields.features, fields.name);
        res.status(201);
        return region;
      },
    },
    {
      method: 'get',
      path: '/projects/:projectId/regions',
      access: READ,
      summary: 'Every region uploaded to the project, newest first',
      handler: async (req) => ({ regions: await listRegions(ds, req.actor!, project(req.params.projectId)) }),
    },
    {
      method: 'get',
      path: '/projects/:projectId/region',
      access: READ,
      summary: 'The current region with its geometry (null before the first upload)',
      handler: async (req) => ({ region: await currentRegion(ds, req.actor!, project(req.params.projectId)) }),
    },
  ];
}
