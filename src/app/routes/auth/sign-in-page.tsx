import { Link, useNavigate, useSearchParams } from 'react-router';
import { SignInForm } from '@/features/auth/components/sign-in-form.js';
import { AuthCard } from '@/features/auth/components/auth-card.js';
import type { PublicPage } from '../../route-types.js';
import { safeNext } from '../../safe-next.js';

function SignInPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const next = safeNext(params.get('next'));
  return (
    <AuthCard
      title="Sign in"
      intro="Welcome back. Sign in to your studio."
      footer={
        <>
          New to Warpmeter?{' '}
          <Link to="/sign-up" className="font-medium text-mulberry-700 hover:underline">
            Create a studio
          </Link>
          . Invited by a studio? Use the link in your invitation e-mail.
        </>
      }
    >
      <SignInForm onSignedIn={() => navigate(next, { replace: true })} />
    </AuthCard>
  );
}

export const signInPage: PublicPage = { path: 'sign-in', Component: SignInPage, guestOnly: true };
