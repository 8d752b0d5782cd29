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
const DESK: NavItem = { href: '/deliveries', label: 'Drop-off desk' };
const OUR_DROP_OFFS: NavItem = { href: '/deliveries', label: 'Our drop-offs' };
const SUGARHOUSE: NavItem = { href: '/sugarhouse', label: 'Sugarhouse' };
const HOUSEHOLDS: NavItem = { href: '/households', label: 'Households' };
const SETTINGS: NavItem = { href: '/settings', label: 'Settings' };

/** What each role may open; the pages check the role again on the server. */
export const NAV: Record<Role, NavItem[]> = {
  member: [TODAY, OUR_DROP_OFFS, CALENDAR, QUEUE, LEDGER],
  sugarmaker: [TODAY, DESK, CALENDAR, QUEUE, RUNS, LEDGER, SUGARHOUSE],
  coordinator: [TODAY, DESK, CALENDAR, QUEUE, RUNS, LEDGER, SUGARHOUSE, HOUSEHOLDS, SETTINGS],
};

export const ROLE_LABEL: Record<Role, string> = {
  member: 'Member',
  sugarmaker: 'Sugarmaker',
  coordinator: 'Coordinator',
};
