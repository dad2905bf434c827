import { useState, type FormEvent } from 'react';
import type { AuditDetail } from '@shared/api/audits.schema.js';
import { SHORTLIST_MAX, requestSignOffSchema } from '@shared/api/review.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { FormField, SelectField } from '@/components/ui/form-field.js';
import { useToast } from '@/components/ui/toast.js';
import { isApiError } from '@/lib/api-client.js';
import { formatDate } from '@/lib/format.js';
import { fieldErrors } from '@/lib/zod-fields.js';
import { useRequestSignOff } from '../api/request-signoff.js';
import { RecommendationText } from './recommendation-text.js';
import { ShortlistPicker } from './shortlist-picker.js';
import { TextArea } from './text-area.js';

const splitEmails = (text: string) => text.split(/[\s,;]+/).map((e) => e.trim()).filter(Boolean);

/**
 * The editor's sign-off request: a finished audit, 1–4 of its candidates, the recommendation
 * (paragraphs and "- " lists, previewed as the client will read it) and the reviewers' addresses.
 */
export function RequestForm({ projectId, audits }: { projectId: number; audits: AuditDetail[] }) {
  const request = useRequestSignOff(projectId);
  const { notify } = useToast();
  const [auditId, setAuditId] = useState(String(audits[0]?.id ?? ''));
  const [picked, setPicked] = useState<number[]>([]);
  const [recommendation, setRecommendation] = useState('');
  const [emails, setEmails] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const audit = audits.find((a) => String(a.id) === auditId);

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    setFormError(null);
    const parsed = requestSignOffSchema.safeParse({ auditId: Number(auditId), candidateIds: picked, recommendation, reviewerEmails: splitEmails(emails) });
    if (!parsed.success) return setErrors(fieldErrors(parsed.error));
    setErrors({});
    try {
      const round = await request.mutateAsync(parsed.data);
      notify(`Round ${round.roundNumber} sent to ${parsed.data.reviewerEmails.join(', ')}.`);
      setPicked([]);
      setRecommendation('');
      setEmails('');
    } catch (err) {
      if (isApiError(err) && err.fields) setErrors(err.fields);
      setFormError(isApiError(err) ? err.message : 'The shortlist could not be sent. Please try again.');
    }
  };

  return (
    <form noValidate aria-label="Request sign-off" onSubmit={submit} className="flex flex-col gap-5">
      {formError && <Alert tone="error" title="The shortlist was not sent">{formError}</Alert>}
      <SelectField
        label="Audit"
        options={audits.map((a) => ({ value: String(a.id), label: `Audit ${a.id} · ${formatDate(a.createdAt)} · ${a.scorecards.length} candidates` }))}
        value={auditId}
        error={errors.auditId}
        onChange={(e) => {
          setAuditId(e.target.value);
          setPicked([]);
        }}
      />
      {audit && (
        <ShortlistPicker audit={audit} picked={picked} onChange={setPicked} error={errors.candidateIds} max={SHORTLIST_MAX} />
      )}
      <FormField label="Recommendation" error={errors.recommendation} hint='Blank lines separate paragraphs; lines starting with "- " become a list.'>
        {(control) => (
          <TextArea {...control} name="recommendation" rows={6} value={recommendation} onChange={(e) => setRecommendation(e.target.value)} />
        )}
      </FormField>
      {recommendation.trim() && (
        <div className="rounded-md border border-dashed border-rule-strong bg-paper px-4 py-3">
          <p className="mb-2 text-xs font-medium tracking-wide text-ink-600 uppercase">As the client will read it</p>
          <RecommendationText text={recommendation} />
        </div>
      )}
      <FormField
        label="Reviewers’ e-mail addresses"
        error={errors.reviewerEmails}
        hint="One or more, separated by commas or new lines. Reviewers without an account get an invitation to set a password."
      >
        {(control) => <TextArea {...control} name="reviewerEmails" rows={2} value={emails} onChange={(e) => setEmails(e.target.value)} />}
      </FormField>
      <div>
        <Button type="submit" loading={request.isPending}>
          Send for sign-off
        </Button>
      </div>
    </form>
  );
}
