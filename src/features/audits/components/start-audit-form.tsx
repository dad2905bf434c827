import { useQuery } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { SAMPLES_DEFAULT, SAMPLES_MAX, SAMPLES_MIN, startAuditSchema } from '@shared/api/audits.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { TextField } from '@/components/ui/form-field.js';
import { isApiError } from '@/lib/api-client.js';
import { candidatesQueryOptions } from '@/features/candidates/api/get-candidates.js';
import { useStartAudit } from '../api/start-audit.js';

/** Chooses candidates, sample count and seed, and queues an audit. */
export function StartAuditForm({ projectId, onStarted }: { projectId: number; onStarted?: (auditId: number) => void }) {
  const candidates = useQuery(candidatesQueryOptions(projectId));
  const start = useStartAudit(projectId);
  const [unchecked, setUnchecked] = useState<Set<number>>(new Set());
  const [samples, setSamples] = useState(String(SAMPLES_DEFAULT));
  const [seed, setSeed] = useState('1');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const list = candidates.data?.candidates ?? [];
  const chosen = list.filter((c) => !unchecked.has(c.id)).map((c) => c.id);

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    setFormError(null);
    const parsed = startAuditSchema.safeParse({ candidateIds: chosen, samples: Number(samples), seed: Number(seed) });
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0] ?? '_'), i.message])));
      return;
    }
    setErrors({});
    try {
      const audit = await start.mutateAsync(parsed.data);
      onStarted?.(audit.id);
    } catch (err) {
      if (isApiError(err) && err.fields) setErrors(err.fields);
      setFormError(isApiError(err) ? err.message : 'The audit could not be started. Please try again.');
    }
  };

  if (candidates.isSuccess && list.length === 0) {
    return <p className="text-sm text-ink-600">Add candidate projections first; an audit measures each of them over the region.</p>;
  }
  return (
    <form noValidate aria-label="Start an audit" onSubmit={submit} className="flex flex-col gap-4">
      {formError && <Alert tone="error" title="The audit was not started">{formError}</Alert>}
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-medium text-ink-950">Candidates to audit</legend>
        {list.map((c) => (
          <label key={c.id} className="flex items-center gap-2 text-sm">
            <input
              type="checkbox"
              checked={!unchecked.has(c.id)}
              onChange={(e) => {
                const next = new Set(unchecked);
                if (e.target.checked) next.delete(c.id);
                else next.add(c.id);
                setUnchecked(next);
              }}
            />
            <span className="font-medium text-ink-950">{c.label}</span>
            <span className="text-ink-600">{c.familyTitle}</span>
          </label>
        ))}
        {errors.candidateIds && <p className="text-sm text-vermilion-700">{errors.candidateIds}</p>}
      </fieldset>
      <div className="grid gap-4 sm:grid-cols-[12rem_10rem_auto] sm:items-start">
        <TextField
          label="Samples"
          name="samples"
          inputMode="numeric"
          value={samples}
          onChange={(e) => setSamples(e.target.value)}
          error={errors.samples}
          hint={`Equal-area points, ${SAMPLES_MIN.toLocaleString()}–${SAMPLES_MAX.toLocaleString()}`}
        />
        <TextField label="Seed" name="seed" inputMode="numeric" value={seed} onChange={(e) => setSeed(e.target.value)} error={errors.seed} hint="Same seed, same points" />
        <Button type="submit" loading={start.isPending} disabled={!chosen.length} className="sm:mt-[1.625rem]">
          Run audit
        </Button>
      </div>
    </form>
  );
}
