import { ALL_ROLES, type Role } from '../api-types';
import { snapshotScreenPath } from '../snapshot/current-snapshot';

/** One entry of the side navigation: a screen and the roles that may open it. */
export interface NavItem {
  /** Absolute route path of a workspace-wide screen (e.g. `/overview`). */
  path?: string;
  /** For a screen about one snapshot: its segment under `/snapshots/:snapshotId/`. */
  snapshotScreen?: string;
  /** Screen name as shown in the navigation. */
  label: string;
  /** Material Symbols ligature name. */
  icon: string;
  /** Roles that see the entry (the route's guard should ask for the same roles). */
  roles: readonly Role[];
}

/** An entry ready to show: its link, or null while no snapshot is chosen (shown disabled). */
export interface NavLink extends NavItem {
  link: string | null;
}

/**
 * Screens that exist today; each screen adds one entry here and one route in app.routes.ts.
 * Snapshot screens link to the snapshot in view (chosen on the Overview).
 */
export const NAV_ITEMS: readonly NavItem[] = [
  { path: '/overview', label: 'Overview', icon: 'dashboard', roles: ALL_ROLES },
  // — snapshot screens: one entry each below —
  { snapshotScreen: 'atlas', label: 'Atlas', icon: 'hub', roles: ALL_ROLES },
  { snapshotScreen: 'functions', label: 'Functions', icon: 'functions', roles: ALL_ROLES },
  { snapshotScreen: 'gravity', label: 'Gravity', icon: 'orbit', roles: ALL_ROLES },
];

/** The entries a person with `role` may open; none without a role. */
export function visibleNavItems(items: readonly NavItem[], role: Role | null): NavItem[] {
  return role ? items.filter((item) => item.roles.includes(role)) : [];
}

/** Each entry with its link for the snapshot in view (null: a snapshot screen with no snapshot chosen). */
export function navLinks(items: readonly NavItem[], snapshotId: string | null): NavLink[] {
  return items.map((item) => ({
    ...item,
    link: item.path ?? (item.snapshotScreen && snapshotId ? snapshotScreenPath(snapshotId, item.snapshotScreen) : null),
  }));
}
