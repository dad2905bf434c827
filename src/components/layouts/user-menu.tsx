import { Badge } from '@/components/ui/badge.js';
import { Button } from '@/components/ui/button.js';
import { useToast } from '@/components/ui/toast.js';
import type { MemberSession } from '@/features/auth/api/get-session.js';
import { useSignOut } from '@/features/auth/api/sign-out.js';
import { isApiError } from '@/lib/api-client.js';
import { ROLE_LABELS } from '@/lib/role-labels.js';

/** Who is signed in, in which studio and role, and the way out. */
export function UserMenu({ session }: { session: MemberSession }) {
  const signOut = useSignOut();
  const { notify } = useToast();
  return (
    <div className="flex items-center gap-3">
      <div className="hidden text-right leading-tight sm:block" data-testid="current-user">
        <p className="text-sm font-medium text-ink-950">{session.user.name}</p>
        <p className="text-xs text-ink-600">
          {session.membership.studioName}
        </p>
      </div>
      <Badge tone={session.membership.role === 'admin' ? 'brand' : 'neutral'}>{ROLE_LABELS[session.membership.role]}</Badge>
      <Button
        variant="secondary"
        size="sm"
        loading={signOut.isPending}
        onClick={() =>
          signOut.mutate(undefined, {
            onError: (err) => notify(isApiError(err) ? err.message : 'Signing out failed. Please try again.', 'error'),
          })
        }
      >
        Sign out
      </Button>
    </div>
  );
}
