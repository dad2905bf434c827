import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Button } from '@/components/ui/button.js';
import { FormField, TextField } from '@/components/ui/form-field.js';
import { controlClasses } from '@/components/ui/input.js';
import { Spinner } from '@/components/ui/spinner.js';
import { useToast } from '@/components/ui/toast.js';
import { isApiError } from '@/lib/api-client.js';
import { useAddCandidate } from '../api/add-candidate.js';
import { resolveDefinitionQueryOptions } from '../api/resolve-definition.js';
import { ResolvedDefinitionCard } from './resolved-definition.js';
import { useDebouncedValue } from './use-debounced-value.js';

/**
 * Manual entry of an EPSG code, PROJ string or WKT. The text is checked by the server's resolver
 * as the person types (after a pause), showing what it resolves to, or what is wrong with it.
 */
export function DefinitionEntry({ projectId }: { projectId: number }) {
  const [text, setText] = useState('');
  const [label, setLabel] = useState('');
  const [formError, setFormError] = useState<string | null>(null);
  const settled = useDebouncedValue(text.trim(), 450);
  const resolved = useQuery(resolveDefinitionQueryOptions(settled));
  const add = useAddCandidate(projectId);
  const { notify } = useToast();
  const waiting = text.trim() !== settled || resolved.isFetching;
  const problem = resolved.isError ? (isApiError(resolved.error) ? (resolved.error.fields?.definition ?? resolved.error.message) : 'The definition could not be checked.') : undefined;

  return (
    <form
      noValidate
      aria-label="Enter a projection"
      className="flex flex-col gap-4"
      onSubmit={async (e) => {
        e.preventDefault();
        setFormError(null);
        if (!resolved.data || waiting) return;
        try {
          const c = await add.mutateAsync({ definition: settled, label: label.trim() || undefined, origin: 'entered' });
          notify(`${c.label} added.`);
          setText('');
          setLabel('');
        } catch (err) {
          setFormError(isApiError(err) ? (err.fields?.definition ?? err.message) : 'The candidate was not added.');
        }
      }}
    >
      <FormField label="EPSG code, PROJ string or WKT" hint="For example EPSG:3035, or +proj=lcc +lat_1=33 +lat_2=45 +lon_0=-96" error={problem ?? formError ?? undefined}>
        {(control) => (
          <textarea
            {...control}
            name="definition"
            rows={3}
            spellCheck={false}
            value={text}
            onChange={(e) => setText(e.target.value)}
            className={controlClasses(Boolean(problem), 'py-2 font-mono text-xs leading-relaxed')}
          />
        )}
      </FormField>
      <div aria-live="polite">
        {settled && waiting && <Spinner label="Checking…" />}
        {!waiting && resolved.data && <ResolvedDefinitionCard resolved={resolved.data} />}
      </div>
      <div className="grid gap-4 sm:grid-cols-[minmax(0,1fr)_auto] sm:items-end">
        <TextField label="Label (optional)" placeholder={resolved.data?.label ?? 'Named after the projection'} value={label} onChange={(e) => setLabel(e.target.value)} />
        <Button type="submit" loading={add.isPending} disabled={!resolved.data || waiting}>
          Add candidate
        </Button>
      </div>
    </form>
  );
}
