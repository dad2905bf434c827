import { inviteSchema } from '@shared/api/people.schema.js';
import { Alert } from '@/components/ui/alert.js';
import { Button } from '@/components/ui/button.js';
import { SelectField, TextField } from '@/components/ui/form-field.js';
import { useToast } from '@/components/ui/toast.js';
import { ROLE_DESCRIPTIONS, ROLE_OPTIONS } from '@/lib/role-labels.js';
import { useZodForm } from '@/lib/use-zod-form.js';
import type { Role } from '@shared/api/roles.js';
import { useInvitePerson } from '../api/invite-person.js';

/** Invites one person by e-mail; a refusal (no free seat, already a member) is shown above the fields. */
export function InviteForm() {
  const invite = useInvitePerson();
  const { notify } = useToast();
  const form = useZodForm(inviteSchema, { email: '', role: 'cartographer' });
  return (
    <form
      noValidate
      aria-label="Invite someone"
      onSubmit={form.handleSubmit(async (input) => {
        await invite.mutateAsync(input);
        notify(`Invitation sent to ${input.email}.`);
        form.reset({ email: '', role: input.role });
      })}
      className="flex flex-col gap-4"
    >
      {form.formError && <Alert tone="error" title="The invitation was not sent">{form.formError}</Alert>}
      <div className="grid gap-4 sm:grid-cols-[minmax(0,1fr)_12rem_auto] sm:items-start">
        <TextField label="E-mail" type="email" autoComplete="off" placeholder="name@example.com" {...form.field('email')} />
        <SelectField
          label="Role"
          options={ROLE_OPTIONS}
          hint={ROLE_DESCRIPTIONS[form.values.role as Role]}
          {...form.field('role')}
        />
        <Button type="submit" loading={form.submitting} className="sm:mt-[1.625rem]">
          Send invitation
        </Button>
      </div>
    </form>
  );
}
