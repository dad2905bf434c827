import { useQuery, useSuspenseQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router';
import { PURPOSE_LABELS, SCALE_BAND_LABELS, STATUS_LABELS } from '@shared/api/projects.schema.js';
import { PageHeader } from '@/components/layouts/page-header.js';
import { Badge } from '@/components/ui/badge.js';
import { Button } from '@/components/ui/button.js';
import { Card, CardBody } from '@/components/ui/card.js';
import { AuditsPanel } from '@/features/audits/components/audits-panel.js';
import { hasRole, sessionQueryOptions } from '@/features/auth/api/get-session.js';
import { CandidatesPanel } from '@/features/candidates/components/candidates-panel.js';
import { projectQueryOptions } from '@/features/projects/api/get-project.js';
import { ProjectDetailsForm } from '@/features/projects/components/project-details-form.js';
import { formatAreaKm2, STATUS_TONES } from '@/features/projects/components/project-options.js';
import { ProjectTabs, type ProjectTab } from '@/features/projects/components/project-tabs.js';
import { RegionPanel } from '@/features/regions/components/region-panel.js';
import { HistoryPanel } from '@/features/review/components/history-panel.js';
import { ReviewPanel } from '@/features/review/components/review-panel.js';
import type { MemberPage } from '../../route-types.js';

const projectIdOf = (raw: string | undefined) => {
  const id = Number(raw);
  // A malformed id is the same as an unknown one: the page answers "not found".
  if (!Number.isInteger(id) || id <= 0) throw new Response('Not found', { status: 404 });
  return id;
};

/** `/projects/:projectId?tab=…`: the project's details and its sections as tabs. */
function ProjectPage() {
  const projectId = projectIdOf(useParams().projectId);
  const { data: project } = useSuspenseQuery(projectQueryOptions(projectId));
  const { data: session } = useQuery(sessionQueryOptions());
  const canEdit = hasRole(session, ['admin', 'cartographer']);
  const [search, setSearch] = useSearchParams();
  const [editing, setEditing] = useState(false);

  // Add a section here: one entry, rendered only while its tab is open.
  const tabs: ProjectTab[] = [
    { id: 'region', label: 'Region', render: () => <RegionPanel projectId={projectId} canEdit={canEdit} /> },
    { id: 'candidates', label: `Candidates (${project.candidateCount})`, render: () => <CandidatesPanel projectId={projectId} canEdit={canEdit} /> },
    { id: 'audits', label: `Audits (${project.auditCount})`, render: () => <AuditsPanel projectId={projectId} /> },
    { id: 'review', label: 'Review', render: () => <ReviewPanel projectId={projectId} /> },
    // The history is the studio's own record of work; reviewers see the review and comments instead.
    ...(hasRole(session, ['admin', 'cartographer', 'editor'])
      ? [{ id: 'history', label: 'History', render: () => <HistoryPanel projectId={projectId} /> }]
      : []),
  ];
  // Without a ?tab=, open where the work is: the region first, then the candidates. Decided once,
  // so storing the first region does not switch the tab away from its report.
  const [defaultTab] = useState(project.region ? 'candidates' : 'region');
  const selected = search.get('tab') ?? defaultTab;

  return (
    <>
      <PageHeader
        title={project.title}
        description={
          <span className="flex flex-wrap items-center gap-2">
            <Badge tone={STATUS_TONES[project.status]}>{STATUS_LABELS[project.status]}</Badge>
            <span>For {project.clientName}</span>
            <span aria-hidden="true">·</span>
            <span>{PURPOSE_LABELS[project.purpose]}</span>
            <span aria-hidden="true">·</span>
            <span>{SCALE_BAND_LABELS[project.scaleBand]} scale</span>
            {project.region && (
              <>
                <span aria-hidden="true">·</span>
                <span>
                  {project.region.name}, {formatAreaKm2(project.region.areaKm2)}
                </span>
              </>
            )}
          </span>
        }
        actions={
          <>
            <Link to="/projects" className="text-sm text-mulberry-800 underline">
              All projects
            </Link>
            {canEdit && !editing && (
              <Button variant="secondary" onClick={() => setEditing(true)}>
                Edit details
              </Button>
            )}
          </>
        }
      />
      {editing && (
        <Card className="mb-6" aria-label="Edit project details">
          <CardBody>
            <ProjectDetailsForm project={project} onDone={() => setEditing(false)} />
          </CardBody>
        </Card>
      )}
      {project.notes && !editing && <p className="mb-6 max-w-3xl text-sm whitespace-pre-line text-ink-800">{project.notes}</p>}
      <ProjectTabs tabs={tabs} selected={selected} onSelect={(id) => setSearch({ tab: id }, { replace: true })} />
    </>
  );
}

export const projectPage: MemberPage = {
  path: 'projects/:projectId',
  Component: ProjectPage,
  load: ({ params, queryClient }) => queryClient.ensureQueryData(projectQueryOptions(projectIdOf(params.projectId))),
};
