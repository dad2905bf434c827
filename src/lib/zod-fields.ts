import type { z } from 'zod';

/** First message per field from a zod error; issues without a path go under `_` (the whole form). */
export function fieldErrors(error: z.ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? String(issue.path[0]) : '_';
    if (!out[key]) out[key] = issue.message;
  }
  return out;
}
