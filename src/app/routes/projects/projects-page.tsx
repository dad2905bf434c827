import { useQuery } from '@tanstack/react-query';
import { useCallback, useState } from 'react';
import { useSearchParams } from 'react-router';
import { listProjectsQuerySchema, type ListProjectsQuery } from '@shared/api/projects.schema.js';
import { PageHeader } from '@/components/layouts/page-header.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { Card, CardBody, CardHeader } from '@/components/ui/card.js';
import { Spinner } from '@/components/ui/spinner.js';
import { hasRole, sessionQueryOptions } from '@/features/auth/api/get-session.js';
import { projectsQueryOptions } from '@/features/projects/api/get-projects.js';
import { CreateProjectForm } from '@/features/projects/components/create-project-form.js';
import { ProjectFilters } from '@/features/projects/components/project-filters.js';
import { ProjectsTable } from '@/features/projects/components/projects-table.js';
import type { MemberPage } from '../../route-types.js';

/** The list's search, filters and sort live in the URL, so a filtered list can be shared or reloaded. */
function queryFromSearch(search: URLSearchParams): ListProjectsQuery {
  const parsed = listProjectsQuerySchema.safeParse(Object.fromEntries(search));
  return parsed.success ? { ...parsed.data, sort: parsed.data.sort === 'updated' ? undefined : parsed.data.sort } : {};
}

function ProjectsPage() {
  const [search, setSearch] = useSearchParams();
  const query = queryFromSearch(search);
  const projects = useQuery(projectsQueryOptions(query));
  const { data: session } = useQuery(sessionQueryOptions());
  const canCreate = hasRole(session, ['admin', 'cartographer']);
  const [creating, setCreating] = useState(false);
  const onChange = useCallback(
    (next: ListProjectsQuery) => {
      const params = new URLSearchParams();
      for (const [k, v] of Object.entries(next)) if (v && !(k === 'sort' && v === 'updated')) params.set(k, String(v));
      setSearch(params, { replace: true });
    },
    [setSearch],
  );
  const count = projects.data?.projects.length ?? 0;
  return (
    <>
      <PageHeader
        title="Projects"
        description="Map projects of your studio: their regions, candidate projections and audits."
        actions={canCreate && !creating ? <Button onClick={() => setCreating(true)}>New project</Button> : undefined}
      />
      <div className="flex flex-col gap-6">
        {creating && (
          <Card aria-labelledby="new-project">
            <CardHeader id="new-project" title="New map project" />
            <CardBody>
              <CreateProjectForm onDone={() => setCreating(false)} />
            </CardBody>
          </Card>
        )}
        <Card aria-labelledby="project-list">
          <CardHeader id="project-list" title="All projects" description={projects.data ? `${count} shown` : undefined} />
          <CardBody>
            <ProjectFilters query={query} onChange={onChange} />
          </CardBody>
          {projects.isPending ? (
            <CardBody>
              <Spinner label="Loading projects…" />
            </CardBody>
          ) : projects.isError ? (
            <CardBody>
              <Alert tone="error">The projects could not be loaded: {projects.error.message}</Alert>
            </CardBody>
          ) : (
            <ProjectsTable projects={projects.data.projects} caption={count ? `Projects, ${count} shown` : 'Projects'} />
          )}
        </Card>
      </div>
    </>
  );
}

export const projectsPage: MemberPage = {
  path: 'projects',
  Component: ProjectsPage,
  load: ({ request, queryClient }) => queryClient.prefetchQuery(projectsQueryOptions(queryFromSearch(new URL(request.url).searchParams))),
};
