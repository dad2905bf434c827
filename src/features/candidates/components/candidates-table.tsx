import type { CandidateView } from '@shared/api/candidates.schema.js';
import { Badge, type BadgeTone } from '@/components/ui/badge.js';
import { DataTable, type Column } from '@/components/ui/data-table.js';
import { CandidateLabel, RemoveCandidateButton } from './candidate-row-actions.js';

const ORIGIN: Record<CandidateView['origin'], { label: string; tone: BadgeTone }> = {
  proposed: { label: 'proposed', tone: 'brand' },
  optimised: { label: 'optimised', tone: 'highlight' },
  entered: { label: 'entered', tone: 'neutral' },
};

/** The project's candidates: label (renameable), family, where it came from, its definition. */
export function CandidatesTable({ projectId, candidates, canEdit }: { projectId: number; candidates: readonly CandidateView[]; canEdit: boolean }) {
  const columns: Column<CandidateView>[] = [
    { key: 'label', header: 'Candidate', rowHeader: true, sortValue: (c) => c.label, cell: (c) => <CandidateLabel projectId={projectId} candidate={c} canEdit={canEdit} /> },
    { key: 'family', header: 'Family', sortValue: (c) => c.familyTitle, cell: (c) => c.familyTitle },
    { key: 'origin', header: 'Origin', sortValue: (c) => c.origin, cell: (c) => <Badge tone={ORIGIN[c.origin].tone}>{ORIGIN[c.origin].label}</Badge> },
    {
      key: 'definition',
      header: 'Definition',
      cell: (c) => (
        <details className="max-w-md text-xs">
          <summary className="cursor-pointer truncate text-ink-600">{c.definition.length > 60 ? `${c.definition.slice(0, 60)}…` : c.definition}</summary>
          {c.reason && <p className="mt-1 text-ink-600">{c.reason}</p>}
          <code className="mt-1 block break-all">{c.resolved}</code>
        </details>
      ),
    },
    ...(canEdit ? [{ key: 'actions', header: <span className="sr-only">Actions</span>, cell: (c: CandidateView) => <RemoveCandidateButton projectId={projectId} candidate={c} /> }] : []),
  ];
  return (
    <DataTable
      rows={candidates}
      columns={columns}
      rowKey={(c) => c.id}
      caption={`${candidates.length} candidate${candidates.length === 1 ? '' : 's'}`}
      empty="No candidates yet: add proposals, enter a projection or optimise a family."
    />
  );
}
