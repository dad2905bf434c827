import { acceptInviteSchema, type InvitationPreview } from '@shared/api/auth.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { TextField } from '@/components/ui/form-field.js';
import { useZodForm } from '@/lib/use-zod-form.js';
import { useAcceptInvitation } from '../api/accept-invitation.js';

const formSchema = acceptInviteSchema.omit({ token: true });

export function AcceptInviteForm({ token, invitation, onAccepted }: { token: string; invitation: InvitationPreview; onAccepted: () => void }) {
  const accept = useAcceptInvitation();
  const form = useZodForm(formSchema, { name: '', password: '' });
  return (
    <form noValidate onSubmit={form.handleSubmit(async (input) => {
      await accept.mutateAsync({ token, ...input });
      onAccepted();
    })} className="flex flex-col gap-4">
      {form.formError && <Alert tone="error">{form.formError}</Alert>}
      <TextField label="E-mail" type="email" name="username" autoComplete="username" value={invitation.email} readOnly disabled />
      <TextField label="Your name" autoComplete="name" required {...form.field('name')} />
      <TextField
        label={invitation.hasAccount ? 'Your Warpmeter password' : 'Choose a password'}
        type="password"
        autoComplete={invitation.hasAccount ? 'current-password' : 'new-password'}
        required
        hint={
          invitation.hasAccount
            ? 'This address already has a Warpmeter account: confirm with its password.'
            : 'At least 10 characters.'
        }
        {...form.field('password')}
      />
      <Button type="submit" loading={form.submitting}>
        Join {invitation.studioName ?? 'the studio'}
      </Button>
    </form>
  );
}
