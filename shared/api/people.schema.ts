import { z } from 'zod';
import { emailSchema } from './auth.schema.js';
import { ROLES } from './roles.js';

export const memberSchema = z.object({
  membershipId: z.number(),
  userId: z.number(),
  name: z.string(),
  email: z.string(),
  role: z.enum(ROLES),
  status: z.enum(['active', 'deactivated']),
  createdAt: z.string(),
});
export type Member = z.infer<typeof memberSchema>;

export const pendingInvitationSchema = z.object({
  id: z.number(),
  email: z.string(),
  role: z.enum(ROLES),
  expiresAt: z.string(),
  createdAt: z.string(),
});
export type PendingInvitation = z.infer<typeof pendingInvitationSchema>;

/** `GET /api/people` (admin). Seats count active staff plus pending staff invitations. */
export const peopleListSchema = z.object({
  members: z.array(memberSchema),
  invitations: z.array(pendingInvitationSchema),
  seats: z.object({ used: z.number(), total: z.number() }),
});
export type PeopleList = z.infer<typeof peopleListSchema>;

/** `POST /api/people/invitations` (admin). */
export const inviteSchema = z.object({ email: emailSchema, role: z.enum(ROLES) });
export type InviteInput = z.infer<typeof inviteSchema>;

/** `PATCH /api/people/:membershipId` (admin). */
export const updateMemberSchema = z
  .object({ role: z.enum(ROLES).optional(), status: z.enum(['active', 'deactivated']).optional() })
  .refine((v) => v.role !== undefined || v.status !== undefined, { message: 'Change the role or the status.' });
export type UpdateMemberInput = z.infer<typeof updateMemberSchema>;
