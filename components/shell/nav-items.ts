import type { Role } from '@/lib/schemas/roles';
import type { IconName } from '../icons/nav-icons';

export interface NavItem {
  href: '/' | '/networks' | '/audits' | '/admin' | '/account' | '/help';
  label: string;
  icon: IconName;
  /** Shown only to holders of one of these roles (the API enforces access; this only tidies the menu). */
  roles?: Role[];
}

/** The destinations of the shell, in the order they appear on every layout. */
export const navItems: NavItem[] = [
  { href: '/', label: 'Overview', icon: 'overview' },
  { href: '/networks', label: 'Networks', icon: 'networks' },
  { href: '/audits', label: 'Audits', icon: 'audits' },
  { href: '/admin', label: 'Admin', icon: 'admin', roles: ['admin'] },
  { href: '/account', label: 'Account', icon: 'account' },
  { href: '/help', label: 'Help', icon: 'help' },
];

/** The destinations a person with `roles` sees; before the session is known, the role-bound ones stay hidden. */
export function navItemsFor(roles: readonly Role[] | undefined): NavItem[] {
  return navItems.filter((item) => !item.roles || item.roles.some((r) => roles?.includes(r)));
}

/** A destination is current for its own path and everything below it. */
export function isCurrent(href: string, pathname: string): boolean {
  if (href === '/') return pathname === '/';
  return pathname === href || pathname.startsWith(href + '/');
}
