import { NAV_ITEMS, NavItem, visibleNavItems } from './nav-items';

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

  it('should list only screens that exist today', () => {
    expect(NAV_ITEMS.map((item) => item.label)).toEqual(['Overview']);
  });
});
