import {
  createProjectSchema,
  listProjectsQuerySchema,
  updateProjectSchema,
} from '../../shared/api/projects.schema.js';
import type { AppDeps } from '../deps.js';
import type { RouteSpec } from '../http/route-table.js';
import { idParam } from '../services/project-guard.js';
import { createProject, getProject, listProjects, updateProject } from '../services/projects.service.js';

const READ = ['admin', 'cartographer', 'editor', 'client'] as const;
const WRITE = ['admin', 'cartographer'] as const;

/** Map projects: list (search, filters, sort), create, read, edit. */
export function projectsRoutes(deps: AppDeps): RouteSpec[] {
  const ds = deps.dataSource;
  return [
    {
      method: 'get',
      path: '/projects',
      access: READ,
      summary: 'The projects the signed-in person may see, searched, filtered and sorted',
      handler: async (req) => ({ projects: await listProjects(ds, req.actor!, listProjectsQuerySchema.parse(req.query)) }),
    },
    {
      method: 'post',
      path: '/projects',
      access: WRITE,
      summary: 'Create a map project',
      handler: async (req, res) => {
        const project = await createProject(ds, req.actor!, createProjectSchema.parse(req.body ?? {}));
        res.status(201);
        return project;
      },
    },
    {
      method: 'get',
      path: '/projects/:projectId',
      access: READ,
      summary: 'One project with its current region and counts',
      handler: (req) => getProject(ds, req.actor!, idParam(req.params.projectId, 'That project')),
    },
    {
      method: 'patch',
      path: '/projects/:projectId',
      access: WRITE,
      summary: 'Edit a project’s title, client, purpose, scale band or notes',
      handler: (req) =>
        updateProject(ds, req.actor!, idParam(req.params.projectId, 'That project'), updateProjectSchema.parse(req.body ?? {})),
    },
  ];
}
