import { useState, type FormEvent } from 'react';
import { returnRoundSchema, type RoundView } from '@shared/api/review.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { FormField } from '@/components/ui/form-field.js';
import { useToast } from '@/components/ui/toast.js';
import { isApiError } from '@/lib/api-client.js';
import { fieldErrors } from '@/lib/zod-fields.js';
import { useReturnRound } from '../api/return-round.js';
import { TextArea } from './text-area.js';

/** Sends the shortlist back to the studio; the comment saying what should change is required. */
export function ReturnForm({ round }: { round: RoundView }) {
  const ret = useReturnRound(round.projectId, round.id);
  const { notify } = useToast();
  const [comment, setComment] = useState('');
  const [error, setError] = useState<string | undefined>();
  const [formError, setFormError] = useState<string | null>(null);

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    setFormError(null);
    const parsed = returnRoundSchema.safeParse({ comment });
    if (!parsed.success) return setError(fieldErrors(parsed.error).comment);
    setError(undefined);
    try {
      await ret.mutateAsync(parsed.data);
      notify('The shortlist went back to the studio with your comment.');
    } catch (err) {
      setError(isApiError(err) ? err.fields?.comment : undefined);
      setFormError(isApiError(err) ? err.message : 'The shortlist was not returned. Please try again.');
    }
  };

  return (
    <form noValidate aria-label="Return the shortlist" onSubmit={submit} className="flex flex-col gap-4">
      {formError && <Alert tone="error" title="Not returned">{formError}</Alert>}
      <FormField label="What should change?" error={error} hint="The studio’s editor and cartographer get this by e-mail.">
        {(control) => <TextArea {...control} name="returnComment" rows={3} value={comment} onChange={(e) => setComment(e.target.value)} />}
      </FormField>
      <div>
        <Button type="submit" variant="secondary" loading={ret.isPending}>
          Return the shortlist
        </Button>
      </div>
    </form>
  );
}
