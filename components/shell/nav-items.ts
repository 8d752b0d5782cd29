import type { Role } from '@/lib/roles';

export interface NavItem {
  href: string;
  label: string;
  /** A shorter label for the phone's tab bar. */
  short?: string;
}

const CALENDAR: NavItem = { href: '/calendar', label: 'Boil calendar', short: 'Calendar' };
const DESK: NavItem = { href: '/deliveries', label: 'Drop-off desk', short: 'Drop-offs' };
const OUR_DROP_OFFS: NavItem = { href: '/deliveries', label: 'Our drop-offs', short: 'Drop-offs' };
const QUEUE: NavItem = { href: '/queue', label: 'Boil queue', short: 'Queue' };
const LEDGER: NavItem = { href: '/ledger', label: 'Season ledger', short: 'Ledger' };

const TODAY: NavItem = { href: '/home', label: 'Today' };
const RUNS: NavItem = { href: '/runs', label: 'Runs' };
const HOUSEHOLDS: NavItem = { href: '/households', label: 'Households' };
const SUGARHOUSE: NavItem = { href: '/sugarhouse', label: 'Sugarhouse' };
const SETTINGS: NavItem = { href: '/settings', label: 'Settings' };
const ACCOUNT: NavItem = { href: '/account', label: 'Your account' };

export interface RoleNav {
  /** The four daily jobs: always one tap away. */
  daily: NavItem[];
  /** Everything else, behind the "More" control. */
  more: NavItem[];
}

/** What each role may open; the pages check the role again on the server. */
export const NAV: Record<Role, RoleNav> = {
  member: { daily: [CALENDAR, OUR_DROP_OFFS, QUEUE, LEDGER], more: [TODAY, ACCOUNT] },
  sugarmaker: { daily: [CALENDAR, DESK, QUEUE, LEDGER], more: [TODAY, RUNS, SUGARHOUSE, ACCOUNT] },
  coordinator: { daily: [CALENDAR, DESK, QUEUE, LEDGER], more: [TODAY, RUNS, HOUSEHOLDS, SUGARHOUSE, SETTINGS, ACCOUNT] },
};

export const ROLE_LABEL: Record<Role, string> = {
  member: 'Member',
  sugarmaker: 'Sugarmaker',
  coordinator: 'Coordinator',
};

/** Whether `href` is the page at `pathname` (or one under it). */
export const isCurrent = (pathname: string, href: string) => pathname === href || pathname.startsWith(`${href}/`);
