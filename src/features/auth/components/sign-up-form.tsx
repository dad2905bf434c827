import { signUpSchema } from '@shared/api/auth.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { TextField } from '@/components/ui/form-field.js';
import { useZodForm } from '@/lib/use-zod-form.js';
import { useSignUp } from '../api/sign-up.js';

/** Creates a new studio; the person signing up becomes its first admin. */
export function SignUpForm({ onSignedUp }: { onSignedUp: () => void }) {
  const signUp = useSignUp();
  const form = useZodForm(signUpSchema, { studioName: '', name: '', email: '', password: '' });
  return (
    <form noValidate onSubmit={form.handleSubmit(async (input) => {
      await signUp.mutateAsync(input);
      onSignedUp();
    })} className="flex flex-col gap-4">
      {form.formError && <Alert tone="error">{form.formError}</Alert>}
      <TextField label="Studio name" autoComplete="organization" required {...form.field('studioName')} />
      <TextField label="Your name" autoComplete="name" required {...form.field('name')} />
      <TextField label="Work e-mail" type="email" autoComplete="email" required {...form.field('email')} />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        required
        hint="A short phrase of a few words is easier to remember than a jumble of symbols."
        {...form.field('password')}
      />
      <Button type="submit" loading={form.submitting}>
        Create studio
      </Button>
    </form>
  );
}
