import { useState } from 'react';
import {
  CRITERION_LABELS,
  OPTIMISABLE_FAMILIES,
  OPTIMISABLE_FAMILY_LABELS,
  OPTIMISE_CRITERIA,
  type OptimisableFamily,
  type OptimiseCriterion,
  type OptimiseResultView,
} from '@shared/api/candidates.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { SelectField } from '@/components/ui/form-field.js';
import { useToast } from '@/components/ui/toast.js';
import { isApiError } from '@/lib/api-client.js';
import { useAddCandidate } from '../api/add-candidate.js';
import { useOptimiseFamily } from '../api/optimise-family.js';

const FAMILY_OPTIONS = OPTIMISABLE_FAMILIES.map((value) => ({ value, label: OPTIMISABLE_FAMILY_LABELS[value] }));
const CRITERION_OPTIONS = OPTIMISE_CRITERIA.map((value) => ({ value, label: CRITERION_LABELS[value].label }));
const fmt = (v: number, unit: string) => `${v.toPrecision(4)}${unit}`;

/** Tunes a family's parameters to the region for a criterion, shows the gain, and offers the optimum as a candidate. */
export function OptimiseForm({ projectId }: { projectId: number }) {
  const [family, setFamily] = useState<OptimisableFamily>('lcc');
  const [criterion, setCriterion] = useState<OptimiseCriterion>('airy-kavrayskiy');
  const [result, setResult] = useState<OptimiseResultView | null>(null);
  const [error, setError] = useState<string | null>(null);
  const optimise = useOptimiseFamily(projectId);
  const add = useAddCandidate(projectId);
  const { notify } = useToast();
  const unit = CRITERION_LABELS[criterion].unit;

  return (
    <div className="flex flex-col gap-4">
      <form
        noValidate
        aria-label="Optimise a family"
        className="grid gap-4 sm:grid-cols-[1fr_1fr_auto] sm:items-end"
        onSubmit={async (e) => {
          e.preventDefault();
          setError(null);
          setResult(null);
          try {
            setResult(await optimise.mutateAsync({ family, criterion }));
          } catch (err) {
            setError(isApiError(err) ? err.message : 'The optimiser did not answer.');
          }
        }}
      >
        <SelectField label="Family" options={FAMILY_OPTIONS} value={family} onChange={(e) => setFamily(e.target.value as OptimisableFamily)} />
        <SelectField
          label="Minimise"
          options={CRITERION_OPTIONS}
          hint={CRITERION_LABELS[criterion].explain}
          value={criterion}
          onChange={(e) => setCriterion(e.target.value as OptimiseCriterion)}
        />
        <Button type="submit" loading={optimise.isPending} className="sm:mb-[1.3rem]">
          Optimise
        </Button>
      </form>
      {error && <Alert tone="error">{error}</Alert>}
      {result && (
        <div className="flex flex-col gap-2 rounded-md border border-rule p-4 text-sm" aria-live="polite">
          <p className="font-semibold text-ink-950">
            {result.gainPct > 0.05 ? `${result.gainPct.toFixed(1)} % better than the rule of thumb` : 'The rule-of-thumb parameters are already about optimal'}
          </p>
          <p className="text-ink-600">
            {CRITERION_LABELS[result.criterion].label}: {fmt(result.baseline.metric, unit)} with the usual parameters → {fmt(result.metric, unit)} tuned ({result.evaluations} trials on{' '}
            {result.samples} samples).
          </p>
          <p className="text-ink-800 tabular">{Object.entries(result.params).map(([k, v]) => `${k} = ${v}`).join(', ')}</p>
          <code className="block text-xs break-all text-ink-600">{result.definition}</code>
          <div>
            <Button
              size="sm"
              loading={add.isPending}
              onClick={async () => {
                try {
                  const c = await add.mutateAsync({ definition: result.definition, label: result.label, origin: 'optimised', params: result.params });
                  notify(`${c.label} added.`);
                  setResult(null);
                } catch (err) {
                  setError(isApiError(err) ? err.message : 'The candidate was not added.');
                }
              }}
            >
              Add the tuned projection
            </Button>
          </div>
        </div>
      )}
    </div>
  );
}
