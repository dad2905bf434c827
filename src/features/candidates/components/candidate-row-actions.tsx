import { useState } from 'react';
import type { CandidateView } from '@shared/api/candidates.schema.js';
import { Button } from '@/components/ui/button.js';
import { Input } from '@/components/ui/input.js';
import { useToast } from '@/components/ui/toast.js';
import { isApiError } from '@/lib/api-client.js';
import { useRemoveCandidate } from '../api/remove-candidate.js';
import { useUpdateCandidate } from '../api/update-candidate.js';

/** The label cell: text, or an inline editor for people who may change candidates. */
export function CandidateLabel({ projectId, candidate, canEdit }: { projectId: number; candidate: CandidateView; canEdit: boolean }) {
  const [editing, setEditing] = useState(false);
  const [value, setValue] = useState(candidate.label);
  const update = useUpdateCandidate(projectId);
  const { notify } = useToast();
  if (!editing) {
    return (
      <span className="inline-flex items-center gap-2">
        {candidate.label}
        {canEdit && (
          <button type="button" className="text-xs text-mulberry-800 underline" aria-label={`Rename ${candidate.label}`} onClick={() => setEditing(true)}>
            rename
          </button>
        )}
      </span>
    );
  }
  return (
    <form
      className="flex items-center gap-2"
      onSubmit={async (e) => {
        e.preventDefault();
        try {
          await update.mutateAsync({ candidateId: candidate.id, label: value });
          setEditing(false);
        } catch (err) {
          notify(isApiError(err) ? (err.fields?.label ?? err.message) : 'The label was not saved.', 'error');
        }
      }}
    >
      <Input aria-label="New label" value={value} maxLength={160} autoFocus onChange={(e) => setValue(e.target.value)} className="h-8 min-w-48" />
      <Button size="sm" type="submit" loading={update.isPending}>
        Save
      </Button>
      <Button size="sm" variant="ghost" onClick={() => (setValue(candidate.label), setEditing(false))}>
        Cancel
      </Button>
    </form>
  );
}

/** Remove, after a confirmation; a refusal (an audit used it) is shown as the server words it. */
export function RemoveCandidateButton({ projectId, candidate }: { projectId: number; candidate: CandidateView }) {
  const remove = useRemoveCandidate(projectId);
  const { notify } = useToast();
  return (
    <Button
      size="sm"
      variant="danger"
      aria-label={`Remove ${candidate.label}`}
      loading={remove.isPending}
      onClick={async () => {
        if (!window.confirm(`Remove “${candidate.label}” from the candidates?`)) return;
        try {
          await remove.mutateAsync(candidate.id);
          notify(`${candidate.label} removed.`);
        } catch (err) {
          notify(isApiError(err) ? err.message : 'The candidate was not removed.', 'error');
        }
      }}
    >
      Remove
    </Button>
  );
}
