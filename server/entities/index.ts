import { Invitation } from './invitation.entity.js';
import { MailLog } from './mail-log.entity.js';
import { Membership } from './membership.entity.js';
import { Studio } from './studio.entity.js';
import { User } from './user.entity.js';

/** Every entity, listed explicitly (globs break under vitest). Append new ones here. */
export const entities = [Studio, User, Membership, Invitation, MailLog];

export { Invitation, MailLog, Membership, Studio, User };
