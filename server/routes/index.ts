import type { AppDeps } from '../deps.js';
import type { RouteSpec } from '../http/route-table.js';
import { auditsRoutes } from './audits.routes.js';
import { authRoutes } from './auth.routes.js';
import { candidatesRoutes } from './candidates.routes.js';
import { billingRoutes } from './billing.routes.js';
import { exportsRoutes } from './exports.routes.js';
import { healthRoutes } from './health.routes.js';
import { invitationRoutes } from './invitations.routes.js';
import { peopleRoutes } from './people.routes.js';
import { projectsRoutes } from './projects.routes.js';
import { regionsRoutes } from './regions.routes.js';
import { reviewRoutes } from './review.routes.js';

/**
 * The whole API as one table. Each module contributes its RouteSpecs; append new modules here.
 * The role × route test reads this same table.
 */
export function apiRoutes(deps: AppDeps): RouteSpec[] {
  return [...healthRoutes(deps), ...authRoutes(deps), ...peopleRoutes(deps), ...invitationRoutes(deps), ...projectsRoutes(deps), ...billingRoutes(deps), ...auditsRoutes(deps), ...exportsRoutes(deps), ...regionsRoutes(deps), ...candidatesRoutes(deps), ...reviewRoutes(deps)];
}
