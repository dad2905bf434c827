import { useQuery } from '@tanstack/react-query';
import { Alert } from '@/components/ui/alert.js';
import { Card, CardBody, CardHeader } from '@/components/ui/card.js';
import { Spinner } from '@/components/ui/spinner.js';
import { candidatesQueryOptions } from '../api/get-candidates.js';
import { CandidatesTable } from './candidates-table.js';
import { DefinitionEntry } from './definition-entry.js';
import { OptimiseForm } from './optimise-form.js';
import { ProposalsList } from './proposals-list.js';

/** The Candidates tab: the list, the engine's proposals, manual entry and the optimiser. */
export function CandidatesPanel({ projectId, canEdit }: { projectId: number; canEdit: boolean }) {
  const candidates = useQuery(candidatesQueryOptions(projectId));
  return (
    <div className="flex flex-col gap-6">
      <Card aria-labelledby="candidates-list">
        <CardHeader id="candidates-list" title="Candidates" description="The projections the audits will measure over the region." />
        {candidates.isPending ? (
          <CardBody>
            <Spinner label="Loading candidates…" />
          </CardBody>
        ) : candidates.isError ? (
          <CardBody>
            <Alert tone="error">The candidates could not be loaded: {candidates.error.message}</Alert>
          </CardBody>
        ) : (
          <CandidatesTable projectId={projectId} candidates={candidates.data.candidates} canEdit={canEdit} />
        )}
      </Card>
      <Card aria-labelledby="candidates-proposed">
        <CardHeader id="candidates-proposed" title="Proposed for this region" description="Fitted to the region's extent, shape and latitude, and to the map's purpose." />
        <CardBody>
          <ProposalsList projectId={projectId} canEdit={canEdit} />
        </CardBody>
      </Card>
      {canEdit && (
        <div className="grid gap-6 xl:grid-cols-2">
          <Card aria-labelledby="candidates-enter">
            <CardHeader id="candidates-enter" title="Enter a projection" />
            <CardBody>
              <DefinitionEntry projectId={projectId} />
            </CardBody>
          </Card>
          <Card aria-labelledby="candidates-optimise">
            <CardHeader id="candidates-optimise" title="Optimise a family" description="Searches the family's parameters for the least distortion over the region." />
            <CardBody>
              <OptimiseForm projectId={projectId} />
            </CardBody>
          </Card>
        </div>
      )}
    </div>
  );
}
