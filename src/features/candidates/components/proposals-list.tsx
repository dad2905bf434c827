import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Alert } from '@/components/ui/alert.js';
import { Badge } from '@/components/ui/badge.js';
import { Button } from '@/components/ui/button.js';
import { Spinner } from '@/components/ui/spinner.js';
import { useToast } from '@/components/ui/toast.js';
import { isApiError } from '@/lib/api-client.js';
import { useAddCandidate } from '../api/add-candidate.js';
import { proposalsQueryOptions } from '../api/get-proposals.js';

/** The engine's proposals for the region and purpose, each with its reason and a one-click add. */
export function ProposalsList({ projectId, canEdit }: { projectId: number; canEdit: boolean }) {
  const proposals = useQuery(proposalsQueryOptions(projectId));
  const add = useAddCandidate(projectId);
  const { notify } = useToast();
  const [adding, setAdding] = useState<string | null>(null);
  if (proposals.isPending) return <Spinner label="Fitting proposals to the region…" />;
  if (proposals.isError) return <Alert tone="error">The proposals could not be loaded: {proposals.error.message}</Alert>;
  if (proposals.data.regionId === null) return <p className="text-sm text-ink-600">Upload the region first: proposals are fitted to its extent, shape and latitude.</p>;
  return (
    <ul className="flex flex-col divide-y divide-rule" aria-label="Proposed candidates">
      {proposals.data.proposals.map((p) => (
        <li key={p.definition} className="flex flex-wrap items-start justify-between gap-3 py-3">
          <div className="min-w-0 flex-1">
            <p className="font-medium text-ink-950">{p.label}</p>
            <p className="text-sm text-ink-600">{p.reason}</p>
            <code className="mt-1 block text-xs break-all text-ink-600">{p.definition}</code>
          </div>
          {p.candidateId !== null ? (
            <Badge tone="success">Added</Badge>
          ) : canEdit ? (
            <Button
              size="sm"
              variant="secondary"
              aria-label={`Add ${p.label}`}
              loading={adding === p.definition}
              onClick={async () => {
                setAdding(p.definition);
                try {
                  await add.mutateAsync({ definition: p.definition, label: p.label, origin: 'proposed', reason: p.reason });
                  notify(`${p.label} added.`);
                } catch (err) {
                  notify(isApiError(err) ? err.message : 'The candidate was not added.', 'error');
                } finally {
                  setAdding(null);
                }
              }}
            >
              Add
            </Button>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
