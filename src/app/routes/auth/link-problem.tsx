import { Link } from 'react-router';
import { Alert } from '@/components/ui/alert.js';
import { isApiError } from '@/lib/api-client.js';

/**
 * Explains why an e-mailed link (invitation or password reset) cannot be used. Without an error
 * the link was incomplete or meant for something else, which reads the same to the person.
 */
export function LinkProblem({ error, what }: { error?: unknown; what: 'invitation' | 'reset' }) {
  const gone = !error || (isApiError(error) && [400, 404, 410, 422].includes(error.status));
  const message = gone
    ? what === 'invitation'
      ? 'This invitation link is not valid any more: it may have expired, been revoked or been used already. Ask the studio admin to send a new one.'
      : 'This reset link is not valid any more: it may have expired or been used already. Ask for a new one below.'
    : isApiError(error)
      ? error.message
      : 'The link could not be checked. Please try again.';
  return (
    <div className="flex flex-col gap-4">
      <Alert tone="error" title={what === 'invitation' ? 'Invitation not usable' : 'Reset link not usable'}>
        {message}
      </Alert>
      <p className="text-sm">
        <Link to={what === 'invitation' ? '/sign-in' : '/reset-password'} className="font-medium text-mulberry-700 hover:underline">
          {what === 'invitation' ? 'Go to sign in' : 'Request a new reset link'}
        </Link>
      </p>
    </div>
  );
}
