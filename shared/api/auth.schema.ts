import { z } from 'zod';
import { ROLES } from './roles.js';

/** Password policy: long enough to resist guessing, no composition rules (common practice). */
export const passwordSchema = z
  .string()
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.');

export const emailSchema = z.string().trim().toLowerCase().email('Enter a valid e-mail address.').max(254);
export const personNameSchema = z.string().trim().min(1, 'Enter a name.').max(120, 'Use at most 120 characters.');

export const signUpSchema = z.object({
  studioName: z.string().trim().min(2, 'Enter the studio name.').max(120),
  name: personNameSchema,
  email: emailSchema,
  password: passwordSchema,
});
export type SignUpInput = z.infer<typeof signUpSchema>;

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password.').max(200),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const resetRequestSchema = z.object({ email: emailSchema });
export const resetPasswordSchema = z.object({ token: z.string().min(20).max(200), password: passwordSchema });
export const acceptInviteSchema = z.object({
  token: z.string().min(20).max(200),
  name: personNameSchema,
  password: passwordSchema,
});

/** `GET /api/auth/session` (public): who is signed in, plus the CSRF token for later writes. */
export const sessionSchema = z.object({
  user: z.object({ id: z.number(), email: z.string(), name: z.string() }).nullable(),
  membership: z
    .object({ id: z.number(), role: z.enum(ROLES), studioId: z.number(), studioName: z.string() })
    .nullable(),
  csrfToken: z.string(),
});
export type SessionInfo = z.infer<typeof sessionSchema>;

/** `GET /api/invitations/:token` (public): what an invitation or reset link is for. */
export const invitationPreviewSchema = z.object({
  kind: z.enum(['invite', 'reset']),
  email: z.string(),
  role: z.enum(ROLES).nullable(),
  studioName: z.string().nullable(),
  expiresAt: z.string(),
  hasAccount: z.boolean(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;
