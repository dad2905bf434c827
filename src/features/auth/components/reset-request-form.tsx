import { useState } from 'react';
import { resetRequestSchema } from '@shared/api/auth.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { TextField } from '@/components/ui/form-field.js';
import { useZodForm } from '@/lib/use-zod-form.js';
import { useRequestReset } from '../api/request-reset.js';

export function ResetRequestForm() {
  const request = useRequestReset();
  const form = useZodForm(resetRequestSchema, { email: '' });
  const [sentTo, setSentTo] = useState<string | null>(null);
  if (sentTo) {
    return (
      <Alert tone="success" title="Check your inbox">
        If <strong>{sentTo}</strong> belongs to a Warpmeter account, a link to set a new password is on its way. The link
        works once and expires after a short while.
      </Alert>
    );
  }
  return (
    <form noValidate onSubmit={form.handleSubmit(async (input) => {
      await request.mutateAsync(input);
      setSentTo(input.email);
    })} className="flex flex-col gap-4">
      {form.formError && <Alert tone="error">{form.formError}</Alert>}
      <TextField label="E-mail" type="email" autoComplete="email" required {...form.field('email')} />
      <Button type="submit" loading={form.submitting}>
        Send reset link
      </Button>
    </form>
  );
}
