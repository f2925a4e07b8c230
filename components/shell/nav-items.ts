import type { IconName } from '../icons/nav-icons';

export interface NavItem {
  href: '/' | '/networks' | '/audits' | '/admin' | '/help';
  label: string;
  icon: IconName;
}

/** The destinations of the shell, in the order they appear on every layout. */
export const navItems: NavItem[] = [
  { href: '/', label: 'Overview', icon: 'overview' },
  { href: '/networks', label: 'Networks', icon: 'networks' },
  { href: '/audits', label: 'Audits', icon: 'audits' },
  { href: '/admin', label: 'Admin', icon: 'admin' },
  { href: '/help', label: 'Help', icon: 'help' },
];

/** A destination is current for its own path and everything below it. */
export function isCurrent(href: string, pathname: string): boolean {
  if (href === '/') return pathname === '/';
  return pathname === href || pathname.startsWith(href + '/');
}
