import { Audit } from './audit.entity.js';
import { Candidate } from './candidate.entity.js';
import { Invitation } from './invitation.entity.js';
import { MailLog } from './mail-log.entity.js';
import { MapProject } from './map-project.entity.js';
import { Membership } from './membership.entity.js';
import { ProjectAccess } from './project-access.entity.js';
import { Region } from './region.entity.js';
import { Scorecard } from './scorecard.entity.js';
import { Studio } from './studio.entity.js';
import { User } from './user.entity.js';
import { ActivityEvent } from './activity-event.entity.js';
import { ProjectComment } from './comment.entity.js';
import { ReviewRecipient } from './review-recipient.entity.js';
import { ReviewRound } from './review-round.entity.js';
import { SignOff } from './sign-off.entity.js';
import { PaymentEvent } from './payment-event.entity.js';
import { SeatSubscription } from './seat-subscription.entity.js';

/** Every entity, listed explicitly (globs break under vitest). Append new ones here. */
export const entities = [
  Studio, User, Membership, Invitation, MailLog,
  MapProject, ProjectAccess, Region, Candidate, Audit, Scorecard,
  ReviewRound, ReviewRecipient, SignOff, ProjectComment, ActivityEvent,
  SeatSubscription, PaymentEvent,
];

export { Audit, Candidate, Invitation, MailLog, MapProject, Membership, ProjectAccess, Region, Scorecard, Studio, User };
export { ActivityEvent, ProjectComment, ReviewRecipient, ReviewRound, SignOff };
export { PaymentEvent, SeatSubscription };
