/**
 * Which sections each role sees. The (app) layout draws its tabs or rail from this list and sends
 * anyone who types a section's URL that their role does not include back to their own home.
 */
import type { Href } from 'expo-router';
import type { Role } from '@/shared/schemas';

export type NavKey = 'quick' | 'projects' | 'catalogue' | 'reviews' | 'users' | 'outbox' | 'account';

export interface NavItem {
  key: NavKey;
  label: string;
  /** The URL path, checked against the app's routes (typed routes), also what a pathname is matched against. */
  href: Extract<Href, string>;
  roles: readonly Role[];
}

export const navItems: readonly NavItem[] = [
  // Quick sizing: the installer's first question on site, one tap from anywhere.
  { key: 'quick', label: 'Quick size', href: '/quick', roles: ['installer'] },
  // Reviewers read the organisation's projects (read-only); the server enforces what each may change.
  { key: 'projects', label: 'Projects', href: '/projects', roles: ['installer', 'reviewer', 'admin'] },
  // Everyone reads the mirror catalogue; only the admin's screens offer editing.
  { key: 'catalogue', label: 'Catalogue', href: '/catalogue', roles: ['installer', 'reviewer', 'admin'] },
  { key: 'reviews', label: 'Reviews', href: '/reviews', roles: ['reviewer'] },
  { key: 'users', label: 'Users', href: '/users', roles: ['admin'] },
  { key: 'outbox', label: 'Outbox', href: '/outbox', roles: ['admin'] },
  { key: 'account', label: 'Account', href: '/account', roles: ['installer', 'reviewer', 'admin'] },
];

/** The order a role's tabs appear in: their daily work first, Account last. */
const orderByRole: Record<Role, readonly NavKey[]> = {
  installer: ['projects', 'quick', 'catalogue', 'account'],
  reviewer: ['reviews', 'projects', 'catalogue', 'account'],
  admin: ['users', 'outbox', 'projects', 'catalogue', 'account'],
};

export function navItemsFor(role: Role): NavItem[] {
  return orderByRole[role].map((key) => navItems.find((item) => item.key === key)).filter((item): item is NavItem => Boolean(item));
}

export function homeFor(role: Role): NavItem['href'] {
  return navItemsFor(role)[0].href;
}

/** The section a pathname belongs to, or undefined for "/" and unknown paths. */
export function sectionOf(pathname: string): NavItem | undefined {
  return navItems.find((item) => pathname === item.href || pathname.startsWith(`${item.href}/`));
}

export function mayVisit(role: Role, pathname: string): boolean {
  const section = sectionOf(pathname);
  return section === undefined || section.roles.includes(role);
}

export const roleLabels: Record<Role, string> = {
  installer: 'Installer',
  reviewer: 'Safety reviewer',
  admin: 'Administrator',
};

/** Short names where three must fit side by side (role controls). */
export const shortRoleLabels: Record<Role, string> = { installer: 'Installer', reviewer: 'Reviewer', admin: 'Admin' };

/** The roles in the order the invite form offers them. Kept here so the bundle need not carry zod. */
export const roleOptions: readonly Role[] = ['installer', 'reviewer', 'admin'];
