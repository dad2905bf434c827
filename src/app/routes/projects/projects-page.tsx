import { PageHeader } from '@/components/layouts/page-header.js';
import { Card } from '@/components/ui/card.js';
import { EmptyState } from '@/components/ui/empty-state.js';
import type { MemberPage } from '../../route-types.js';

/** The studio's map projects. The list itself arrives with the projects feature. */
function ProjectsPage() {
  return (
    <>
      <PageHeader title="Projects" description="Map projects of your studio: their regions, candidate projections and audits." />
      <Card>
        <EmptyState
          title="No map projects yet"
          description="A project holds the region you are mapping, the candidate projections fitted to it, their distortion audits and the client's sign-off."
        />
      </Card>
    </>
  );
}

export const projectsPage: MemberPage = { path: 'projects', Component: ProjectsPage };
