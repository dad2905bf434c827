import type { QueryClient } from '@tanstack/react-query';
import type { ComponentType } from 'react';
import type { LoaderFunctionArgs } from 'react-router';
import type { Role } from '@shared/api/roles.js';
import type { MemberSession } from '@/features/auth/api/get-session.js';

/**
 * Each page file exports one of these; router.tsx lists them. A page's `load` warms the query
 * cache from the same query-options factories its components read, so data is there on first paint.
 */
export interface PublicPage {
  /** Path from the site root, without the leading slash (`sign-in`). */
  path: string;
  Component: ComponentType;
  /** Sends a visitor who is already signed in on to their work (sign-in, sign-up). */
  guestOnly?: boolean;
  load?: (args: LoaderFunctionArgs & { queryClient: QueryClient }) => unknown;
}

export interface MemberPage {
  /** Path from the site root, without the leading slash (`studio/people`, `projects/:projectId`). */
  path: string;
  Component: ComponentType;
  /** Who may open the page; every signed-in member when omitted. Others get a 403 page. */
  roles?: readonly Role[];
  load?: (args: LoaderFunctionArgs & { queryClient: QueryClient; session: MemberSession }) => unknown;
}
