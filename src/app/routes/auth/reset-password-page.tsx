import { useQuery } from '@tanstack/react-query';
import { Link, useSearchParams } from 'react-router';
import { Spinner } from '@/components/ui/spinner.js';
import { invitationQueryOptions } from '@/features/auth/api/get-invitation.js';
import { AuthCard } from '@/features/auth/components/auth-card.js';
import { ResetPasswordForm } from '@/features/auth/components/reset-password-form.js';
import { ResetRequestForm } from '@/features/auth/components/reset-request-form.js';
import type { PublicPage } from '../../route-types.js';
import { LinkProblem } from './link-problem.js';

const backToSignIn = (
  <Link to="/sign-in" className="font-medium text-mulberry-700 hover:underline">
    Back to sign in
  </Link>
);

/** Without a token: ask for a reset link. With `?token=`: set the new password. */
function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  if (!token) {
    return (
      <AuthCard title="Reset your password" intro="Enter your e-mail and we will send you a link to set a new password." footer={backToSignIn}>
        <ResetRequestForm />
      </AuthCard>
    );
  }
  return <SetNewPassword token={token} />;
}

function SetNewPassword({ token }: { token: string }) {
  const link = useQuery(invitationQueryOptions(token));
  if (link.isPending) return <Spinner label="Checking your link…" />;
  if (link.isError || link.data.kind !== 'reset') {
    return (
      <AuthCard title="Set a new password" footer={backToSignIn}>
        <LinkProblem what="reset" error={link.error} />
      </AuthCard>
    );
  }
  return (
    <AuthCard title="Set a new password" intro={<>For {link.data.email}.</>} footer={backToSignIn}>
      <ResetPasswordForm token={token} email={link.data.email} />
    </AuthCard>
  );
}

export const resetPasswordPage: PublicPage = {
  path: 'reset-password',
  Component: ResetPasswordPage,
  load: async ({ request, queryClient }) => {
    const token = new URL(request.url).searchParams.get('token');
    if (token) await queryClient.prefetchQuery(invitationQueryOptions(token));
  },
};
