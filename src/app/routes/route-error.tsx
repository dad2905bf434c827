import { isRouteErrorResponse, Link, Navigate, useLocation, useRouteError } from 'react-router';
import { Card } from '@/components/ui/card.js';
import { EmptyState } from '@/components/ui/empty-state.js';
import { buttonClasses } from '@/components/ui/button.js';
import { isApiError } from '@/lib/api-client.js';

/** What a page shows when its loader or render failed: a plain account and a way on. */
export function RouteError() {
  const error = useRouteError();
  const location = useLocation();
  const status = isRouteErrorResponse(error) ? error.status : isApiError(error) ? error.status : 500;
  if (status === 401) return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname + location.search)}`} replace />;

  const { title, text } =
    status === 403
      ? { title: 'Not available to your role', text: 'Ask a studio admin if you need access to this page.' }
      : status === 404
        ? { title: 'Nothing here', text: 'The page or item does not exist, or it belongs to another studio.' }
        : {
            title: 'Something went wrong',
            text: isApiError(error) ? error.message : 'The page could not be shown. Reload to try again; if it keeps happening, tell us what you were doing.',
          };
  return (
    <Card>
      <title>{`${title} · Warpmeter`}</title>
      <EmptyState
        title={<span role="alert">{title}</span>}
        description={text}
        action={
          <Link to="/projects" className={buttonClasses('secondary')}>
            Go to projects
          </Link>
        }
      />
    </Card>
  );
}
