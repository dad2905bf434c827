import { ROLES, type Role } from '@shared/api/roles.js';

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  cartographer: 'Cartographer',
  editor: 'Editor',
  client: 'Client reviewer',
};

/** One line on what each role may do, for selects and hints. */
export const ROLE_DESCRIPTIONS: Record<Role, string> = {
  admin: 'Manages people, seats and billing.',
  cartographer: 'Creates projects, uploads regions, runs audits.',
  editor: 'Compares candidates, shortlists, asks the client for sign-off.',
  client: 'Reviews shared projects and signs off. Takes no seat.',
};

export const ROLE_OPTIONS = ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }));
