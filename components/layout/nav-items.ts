/** The app's destinations; admin-only ones are hidden from other roles (the server still checks). */
import type { SessionUser } from '../../constants/schemas/auth';
import type { IconName } from '../icons';

export interface NavItem {
  href: '/filings' | '/verify' | '/users' | '/outbox' | '/activity' | '/profile';
  /** Stable id for tests (`nav-<id>`), independent of the wording. */
  id: 'filings' | 'verify' | 'people' | 'outbox' | 'activity' | 'profile';
  label: string;
  icon: IconName;
  adminOnly: boolean;
}

export const NAV_ITEMS: readonly NavItem[] = [
  { href: '/filings', id: 'filings', label: 'Filings', icon: 'filings', adminOnly: false },
  { href: '/verify', id: 'verify', label: 'Verify', icon: 'check', adminOnly: false },
  { href: '/users', id: 'people', label: 'People', icon: 'people', adminOnly: true },
  { href: '/outbox', id: 'outbox', label: 'Sent mail', icon: 'outbox', adminOnly: true },
  { href: '/activity', id: 'activity', label: 'Activity', icon: 'activity', adminOnly: true },
  { href: '/profile', id: 'profile', label: 'Profile', icon: 'profile', adminOnly: false },
];

export function navItemsFor(user: SessionUser): NavItem[] {
  const admin = user.roles.includes('admin');
  return NAV_ITEMS.filter((item) => admin || !item.adminOnly);
}

export function isActive(item: NavItem, pathname: string): boolean {
  if (item.href === '/filings' && pathname === '/') return true;
  return pathname === item.href || pathname.startsWith(`${item.href}/`);
}
