import { useState } from 'react';
import { Link } from 'react-router';
import { resetPasswordSchema } from '@shared/api/auth.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { TextField } from '@/components/ui/form-field.js';
import { useZodForm } from '@/lib/use-zod-form.js';
import { useResetPassword } from '../api/reset-password.js';

const formSchema = resetPasswordSchema.omit({ token: true });

export function ResetPasswordForm({ token, email }: { token: string; email?: string }) {
  const reset = useResetPassword();
  const form = useZodForm(formSchema, { password: '' });
  const [done, setDone] = useState(false);
  if (done) {
    return (
      <Alert tone="success" title="Password changed">
        You can now <Link to="/sign-in" className="font-semibold underline">sign in</Link> with your new password.
      </Alert>
    );
  }
  return (
    <form noValidate onSubmit={form.handleSubmit(async ({ password }) => {
      await reset.mutateAsync({ token, password });
      setDone(true);
    })} className="flex flex-col gap-4">
      {form.formError && <Alert tone="error">{form.formError}</Alert>}
      {email && (
        // Lets password managers file the new password under the right account.
        <input type="email" name="username" autoComplete="username" value={email} readOnly hidden />
      )}
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        required
        hint="At least 10 characters."
        {...form.field('password')}
      />
      <Button type="submit" loading={form.submitting}>
        Set new password
      </Button>
    </form>
  );
}
