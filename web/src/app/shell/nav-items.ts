import { ALL_ROLES, type Role } from '../api-types';

/** One entry of the side navigation: a screen and the roles that may open it. */
export interface NavItem {
  /** Absolute route path of the screen. */
  path: string;
  /** Screen name as shown in the navigation. */
  label: string;
  /** Material Symbols ligature name. */
  icon: string;
  /** Roles that see the entry (the route's guard should ask for the same roles). */
  roles: readonly Role[];
}

/** Screens that exist today; each later screen is one more entry. */
export const NAV_ITEMS: readonly NavItem[] = [
  { path: '/overview', label: 'Overview', icon: 'dashboard', roles: ALL_ROLES },
];

/** The entries a person with `role` may open; none without a role. */
export function visibleNavItems(items: readonly NavItem[], role: Role | null): NavItem[] {
  return role ? items.filter((item) => item.roles.includes(role)) : [];
}
