import { useState, type FormEvent } from 'react';
import { approveRoundSchema, type RoundView } from '@shared/api/review.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { FormField, TextField } from '@/components/ui/form-field.js';
import { isApiError } from '@/lib/api-client.js';
import { fieldErrors } from '@/lib/zod-fields.js';
import { useApproveRound } from '../api/approve-round.js';
import { TextArea } from './text-area.js';

/**
 * The reviewer picks exactly one shortlisted candidate and signs by typing their own name. The
 * server compares the signature with the account's name (case and spacing aside) and seals the record.
 */
export function ApproveForm({ round, reviewerName }: { round: RoundView; reviewerName: string }) {
  const approve = useApproveRound(round.projectId, round.id);
  const [candidateId, setCandidateId] = useState<number | null>(round.shortlist.length === 1 ? round.shortlist[0].candidateId : null);
  const [signature, setSignature] = useState('');
  const [comment, setComment] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    setFormError(null);
    const parsed = approveRoundSchema.safeParse({ candidateId: candidateId ?? undefined, signature, comment: comment.trim() || undefined });
    const local = parsed.success ? {} : fieldErrors(parsed.error);
    if (parsed.success && signature.trim().replace(/\s+/g, ' ').toLowerCase() !== reviewerName.trim().replace(/\s+/g, ' ').toLowerCase()) {
      local.signature = `Type your name as on your account: ${reviewerName}.`;
    }
    setErrors(local);
    if (!parsed.success || Object.keys(local).length) return;
    try {
      await approve.mutateAsync(parsed.data);
    } catch (err) {
      if (isApiError(err) && err.fields) setErrors(err.fields);
      setFormError(isApiError(err) ? err.message : 'The approval was not recorded. Please try again.');
    }
  };

  return (
    <form noValidate aria-label="Approve a candidate" onSubmit={submit} className="flex flex-col gap-4">
      {formError && <Alert tone="error" title="Not approved">{formError}</Alert>}
      <fieldset aria-describedby={errors.candidateId ? 'approve-candidate-error' : undefined}>
        <legend className="text-sm font-medium text-ink-950">Candidate you approve</legend>
        <div className="mt-2 flex flex-col gap-2">
          {round.shortlist.map((c) => (
            <label key={c.candidateId} className="flex cursor-pointer items-start gap-3 rounded-md border border-rule px-3 py-2 text-sm has-[:checked]:border-mulberry-600 has-[:checked]:bg-mulberry-50">
              <input type="radio" name="candidateId" className="mt-0.5 size-4 accent-mulberry-700" checked={candidateId === c.candidateId} onChange={() => setCandidateId(c.candidateId)} />
              <span>
                <span className="font-medium">{c.label}</span>
                <span className="block font-mono text-xs break-all text-ink-600">{c.resolved}</span>
              </span>
            </label>
          ))}
        </div>
        {errors.candidateId && <p id="approve-candidate-error" className="mt-1.5 text-sm text-vermilion-700">{errors.candidateId}</p>}
      </fieldset>
      <TextField
        label="Signature"
        name="signature"
        autoComplete="off"
        hint={`Type your full name (${reviewerName}) to sign. The record, with this signature and the time, cannot be changed afterwards.`}
        value={signature}
        error={errors.signature}
        onChange={(e) => setSignature(e.target.value)}
      />
      <FormField label="Comment (optional)" error={errors.comment}>
        {(control) => <TextArea {...control} name="comment" rows={3} value={comment} onChange={(e) => setComment(e.target.value)} />}
      </FormField>
      <div>
        <Button type="submit" loading={approve.isPending}>
          Approve and sign
        </Button>
      </div>
    </form>
  );
}
