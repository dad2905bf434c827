/**
 * Where to go after signing in. Only paths on this site are accepted: `//evil.example` and
 * `https://…` would turn the sign-in page into an open redirect.
 */
export function safeNext(next: string | null | undefined, fallback = '/projects'): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  if (next.startsWith('/sign-in') || next.startsWith('/sign-up')) return fallback;
  return next;
}
