import type { Role } from '../../shared/api/roles.js';

/** The signed-in person making a request, as loaded from the session and their membership. */
export interface Actor {
  userId: number;
  studioId: number;
  membershipId: number;
  role: Role;
  email: string;
  name: string;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      actor?: Actor;
    }
  }
}

declare module 'express-session' {
  interface SessionData {
    userId?: number;
    membershipId?: number;
    csrfToken?: string;
  }
}
