import type { QueryClient } from '@tanstack/react-query';
import { createBrowserRouter, redirect, type LoaderFunctionArgs, type RouteObject } from 'react-router';
import { AppFrame } from '@/components/layouts/app-frame.js';
import { AuthLayout } from '@/components/layouts/auth-layout.js';
import { Spinner } from '@/components/ui/spinner.js';
import { hasRole, isMember, sessionQueryOptions, type MemberSession } from '@/features/auth/api/get-session.js';
import type { MemberPage, PublicPage } from './route-types.js';
import { safeNext } from './safe-next.js';
import { acceptInvitePage } from './routes/auth/accept-invite-page.js';
import { resetPasswordPage } from './routes/auth/reset-password-page.js';
import { signInPage } from './routes/auth/sign-in-page.js';
import { signUpPage } from './routes/auth/sign-up-page.js';
import { NotFoundPage } from './routes/not-found-page.js';
import { comparePage } from './routes/projects/compare-page.js';
import { projectPage } from './routes/projects/project-page.js';
import { projectsPage } from './routes/projects/projects-page.js';
import { RouteError } from './routes/route-error.js';
import { reviewPage } from './routes/review/review-page.js';
import { reviewRequestsPage } from './routes/review/review-requests-page.js';
import { billingPage } from './routes/studio/billing-page.js';
import { peoplePage } from './routes/studio/people-page.js';

/** Pages anyone may open. Add a page: import it above and list it here. */
const PUBLIC_PAGES: readonly PublicPage[] = [signInPage, signUpPage, acceptInvitePage, resetPasswordPage];

/** Pages inside the signed-in frame; each may restrict itself to roles. */
const MEMBER_PAGES: readonly MemberPage[] = [projectsPage, projectPage, peoplePage, billingPage, reviewRequestsPage, reviewPage, comparePage];

/** The signed-in member, or a redirect to sign-in that comes back here afterwards. */
async function requireMember(queryClient: QueryClient, request: Request): Promise<MemberSession> {
  const session = await queryClient.ensureQueryData(sessionQueryOptions());
  if (!isMember(session)) {
    const url = new URL(request.url);
    throw redirect(`/sign-in?next=${encodeURIComponent(url.pathname + url.search)}`);
  }
  return session;
}

function publicRoute(page: PublicPage, queryClient: QueryClient): RouteObject {
  return {
    path: page.path,
    Component: page.Component,
    loader: async (args: LoaderFunctionArgs) => {
      if (page.guestOnly) {
        const session = await queryClient.ensureQueryData(sessionQueryOptions());
        if (isMember(session)) throw redirect(safeNext(new URL(args.request.url).searchParams.get('next')));
      }
      await page.load?.({ ...args, queryClient });
      return null;
    },
  };
}

function memberRoute(page: MemberPage, queryClient: QueryClient): RouteObject {
  return {
    path: page.path,
    Component: page.Component,
    loader: async (args: LoaderFunctionArgs) => {
      const session = await requireMember(queryClient, args.request);
      if (!hasRole(session, page.roles)) throw new Response('Not available to your role', { status: 403 });
      await page.load?.({ ...args, queryClient, session });
      return null;
    },
  };
}

/** Shown while the first page's loaders run (reading the session, warming the page's data). */
function StartingUp() {
  return (
    <div className="flex min-h-screen items-center justify-center">
      <Spinner label="Opening Warpmeter…" />
    </div>
  );
}

export function buildRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      Component: AuthLayout,
      HydrateFallback: StartingUp,
      ErrorBoundary: RouteError,
      children: PUBLIC_PAGES.map((p) => publicRoute(p, queryClient)),
    },
    {
      path: '/',
      Component: AppFrame,
      HydrateFallback: StartingUp,
      loader: async ({ request }) => {
        await requireMember(queryClient, request);
        return null;
      },
      children: [
        {
          // A pathless layer so a failing page keeps the frame (navigation, sign-out) around it.
          ErrorBoundary: RouteError,
          children: [{ index: true, loader: () => redirect('/projects') }, ...MEMBER_PAGES.map((p) => memberRoute(p, queryClient))],
        },
      ],
    },
    { path: '*', Component: NotFoundPage },
  ];
}

export const createAppRouter = (queryClient: QueryClient) => createBrowserRouter(buildRoutes(queryClient));
