import { Link } from 'react-router';
import { signInSchema } from '@shared/api/auth.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { TextField } from '@/components/ui/form-field.js';
import { useZodForm } from '@/lib/use-zod-form.js';
import { useSignIn } from '../api/sign-in.js';

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const signIn = useSignIn();
  const form = useZodForm(signInSchema, { email: '', password: '' });
  return (
    <form noValidate onSubmit={form.handleSubmit(async (input) => {
      await signIn.mutateAsync(input);
      onSignedIn();
    })} className="flex flex-col gap-4">
      {form.formError && <Alert tone="error">{form.formError}</Alert>}
      <TextField label="E-mail" type="email" autoComplete="email" required {...form.field('email')} />
      <TextField label="Password" type="password" autoComplete="current-password" required {...form.field('password')} />
      <div className="-mt-1 text-right text-sm">
        <Link to="/reset-password" className="font-medium text-mulberry-700 hover:underline">
          Forgot your password?
        </Link>
      </div>
      <Button type="submit" loading={form.submitting}>
        Sign in
      </Button>
    </form>
  );
}
