import type { Role } from '@shared/api/roles.js';

export interface NavItem {
  to: string;
  label: string;
  /** Shown only to these roles; to everyone signed in when omitted. */
  roles?: readonly Role[];
}

/** The main navigation. The server checks the same roles on every API route; hiding is a courtesy. */
export const NAV_ITEMS: readonly NavItem[] = [
  { to: '/projects', label: 'Projects' },
  { to: '/review', label: 'Reviews', roles: ['client'] },
  { to: '/studio/people', label: 'People', roles: ['admin'] },
  { to: '/studio/billing', label: 'Billing', roles: ['admin'] },
];

export const navFor = (role: Role) => NAV_ITEMS.filter((item) => !item.roles || item.roles.includes(role));
