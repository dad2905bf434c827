import { Link } from 'react-router';
import { Logo } from '@/components/brand/logo.js';
import { buttonClasses } from '@/components/ui/button.js';
import { EmptyState } from '@/components/ui/empty-state.js';

/** Any address the router does not know. */
export function NotFoundPage() {
  return (
    <div className="flex min-h-screen flex-col items-center justify-center px-4">
      <title>Page not found · Warpmeter</title>
      <Logo className="mb-6" />
      <EmptyState
        title="This page is off the map"
        description="The address does not match any page in Warpmeter."
        action={
          <Link to="/projects" className={buttonClasses('primary')}>
            Go to projects
          </Link>
        }
      />
    </div>
  );
}
