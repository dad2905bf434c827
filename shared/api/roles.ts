/** The four roles of a studio membership. Client reviewers take no seat. */
export const ROLES = ['admin', 'cartographer', 'editor', 'client'] as const;
export type Role = (typeof ROLES)[number];
export const STAFF_ROLES: readonly Role[] = ['admin', 'cartographer', 'editor'];
export const isStaffRole = (r: Role) => STAFF_ROLES.includes(r);
