import { paths } from './paths';
import { OWNER_ROLES, STAFF_ROLES, type Role } from '@contract';

/**
 * The one list of signed-in areas: the navigation and the route guards both read it,
 * so a menu item and the page it opens can never disagree about who may use it.
 * A later feature adds one entry here and one route in app/router.tsx.
 */
export interface NavItem {
  id: string;
  label: string;
  to: string;
  roles: readonly Role[];
  /** Shown only when the server says the area exists (e.g. the dev outbox). */
  needsFeature?: 'outbox';
}

export const navItems: readonly NavItem[] = [
  { id: 'jobs', label: 'Jobs', to: paths.jobs, roles: STAFF_ROLES },
  { id: 'users', label: 'Users', to: paths.users, roles: OWNER_ROLES },
  { id: 'mail', label: 'E-mail', to: paths.mail, roles: OWNER_ROLES },
  { id: 'reports', label: 'Reports', to: paths.reports, roles: OWNER_ROLES },
  { id: 'settings', label: 'Settings', to: paths.companySettings, roles: OWNER_ROLES },
  { id: 'price-book', label: 'Price book & catalog', to: paths.priceBook, roles: STAFF_ROLES },
  { id: 'account', label: 'Your account', to: paths.account, roles: STAFF_ROLES },
  { id: 'outbox', label: 'Outbox', to: paths.outbox, roles: OWNER_ROLES, needsFeature: 'outbox' },
];

export type Feature = NonNullable<NavItem['needsFeature']>;

export function navItemsFor(role: Role, features: ReadonlySet<Feature>): NavItem[] {
  return navItems.filter((i) => i.roles.includes(role) && (!i.needsFeature || features.has(i.needsFeature)));
}

export function rolesFor(id: string): readonly Role[] {
  return navItems.find((i) => i.id === id)?.roles ?? [];
}
