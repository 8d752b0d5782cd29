import type { Role } from '@/lib/roles';

export interface NavItem {
  href: string;
  label: string;
}

const TODAY: NavItem = { href: '/home', label: 'Today' };
const CALENDAR: NavItem = { href: '/calendar', label: 'Boil calendar' };
const QUEUE: NavItem = { href: '/queue', label: 'Boil queue' };
const RUNS: NavItem = { href: '/runs', label: 'Runs' };
const LEDGER: NavItem = { href: '/ledger', label: 'Season ledger' };
const SUGARHOUSE: NavItem = { href: '/sugarhouse', label: 'Sugarhouse' };
const HOUSEHOLDS: NavItem = { href: '/households', label: 'Households' };
const SETTINGS: NavItem = { href: '/settings', label: 'Settings' };

/** What each role may open; the pages check the role again on the server. */
export const NAV: Record<Role, NavItem[]> = {
  member: [TODAY, CALENDAR, QUEUE, LEDGER],
  sugarmaker: [TODAY, CALENDAR, QUEUE, RUNS, LEDGER, SUGARHOUSE],
  coordinator: [TODAY, CALENDAR, QUEUE, RUNS, LEDGER, SUGARHOUSE, HOUSEHOLDS, SETTINGS],
};

export const ROLE_LABEL: Record<Role, string> = {
  member: 'Member',
  sugarmaker: 'Sugarmaker',
  coordinator: 'Coordinator',
};
