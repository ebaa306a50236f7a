import { NAV_ITEMS, NavItem, navLinks, visibleNavItems } from './nav-items';

describe('visibleNavItems', () => {
  const items: NavItem[] = [
    { path: '/overview', label: 'Overview', icon: 'dashboard', roles: ['owner', 'architect', 'reviewer', 'viewer'] },
    { path: '/carve', label: 'Carve', icon: 'content_cut', roles: ['owner', 'architect'] },
  ];

  it('should keep only the entries open to the role', () => {
    expect(visibleNavItems(items, 'viewer').map((item) => item.label)).toEqual(['Overview']);
    expect(visibleNavItems(items, 'architect').map((item) => item.label)).toEqual(['Overview', 'Carve']);
  });

  it('should show nothing without a role', () => {
    expect(visibleNavItems(items, null)).toEqual([]);
  });

  it('should list the Overview first', () => {
    expect(NAV_ITEMS[0]).toMatchObject({ path: '/overview', label: 'Overview' });
  });
});

describe('navLinks', () => {
  const items: NavItem[] = [
    { path: '/overview', label: 'Overview', icon: 'dashboard', roles: ['viewer'] },
    { snapshotScreen: 'functions', label: 'Functions', icon: 'functions', roles: ['viewer'] },
  ];

  it('should link snapshot screens to the snapshot in view', () => {
    expect(navLinks(items, 's 1').map((i) => i.link)).toEqual(['/overview', '/snapshots/s%201/functions']);
  });

  it('should leave snapshot screens without a link while no snapshot is chosen', () => {
    expect(navLinks(items, null).map((i) => i.link)).toEqual(['/overview', null]);
  });
});
