import { Link, useNavigate } from 'react-router';
import { AuthCard } from '@/features/auth/components/auth-card.js';
import { SignUpForm } from '@/features/auth/components/sign-up-form.js';
import type { PublicPage } from '../../route-types.js';

function SignUpPage() {
  const navigate = useNavigate();
  return (
    <AuthCard
      title="Create your studio"
      intro="You will be the studio's admin. Invite cartographers, editors and client reviewers once you are in."
      footer={
        <>
          Already have an account?{' '}
          <Link to="/sign-in" className="font-medium text-mulberry-700 hover:underline">
            Sign in
          </Link>
        </>
      }
    >
      <SignUpForm onSignedUp={() => navigate('/projects', { replace: true })} />
    </AuthCard>
  );
}

export const signUpPage: PublicPage = { path: 'sign-up', Component: SignUpPage, guestOnly: true };
