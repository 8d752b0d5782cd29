import type { Role } from '@/lib/roles';
import { type Actor, isStaff } from './actor';
import { forbidden } from './errors';

/**
 * Who may do what to which record, in one place. A rule gets the actor and, where it matters,
 * the record (or the parts of it the rule needs, e.g. `{ householdId }`). Services call
 * `authorize(ctx.actor, 'slot.change', slot)`; pages may call `can(...)` to show or hide a control.
 *
 * A feature adds its actions with `definePolicies({ 'run.start': staff, ... })` in its own
 * lib/<feature>/policies.ts (or service.ts); an action nobody defined throws, so a typo fails
 * loudly at the first test rather than letting anyone through.
 */

export type Rule<R = unknown> = (actor: Actor, record: R) => boolean;

/** The record parts a household-scoped rule looks at. */
export interface HouseholdOwned {
  householdId: string | null;
}

// Building blocks.
export const roles =
  (...allowed: Role[]): Rule =>
  (a) =>
    a.kind === 'person' && allowed.includes(a.role);
export const anyone: Rule = (a) => a.kind === 'person' || a.kind === 'system';
export const coordinator: Rule = (a) => a.kind === 'system' || (a.kind === 'person' && a.role === 'coordinator');
export const staff: Rule = (a) => isStaff(a);
/** Staff, or a member of the household the record belongs to. */
export const staffOrOwnHousehold: Rule<HouseholdOwned | undefined> = (a, r) =>
  isStaff(a) || (a.kind === 'person' && !!r && r.householdId !== null && r.householdId === a.householdId);

const rules = new Map<string, Rule<never>>();

export function definePolicies(entries: Record<string, Rule<never>>) {
  for (const [action, rule] of Object.entries(entries)) rules.set(action, rule);
}

definePolicies({
  // Co-op and its settings
  'coop.read': anyone,
  'settings.read': coordinator,
  'settings.update': coordinator,
  'sugarhouse.view': staff,
  'season.list': anyone,
  'season.manage': coordinator,
  'season.settle': coordinator,
  'evaporator.list': anyone,
  'evaporator.manage': coordinator,
  // Households and people
  'household.list': coordinator,
  'household.listNames': anyone,
  'household.create': coordinator,
  'household.update': coordinator,
  'person.list': coordinator,
  'person.create': coordinator,
  'person.changeRole': coordinator,
  // Boil slots: members book and change their own household's; staff any, at any hour
  'slot.list': anyone,
  'slot.create': staffOrOwnHousehold,
  'slot.change': staffOrOwnHousehold,
  'slot.seeDetails': staffOrOwnHousehold,
  'slot.bookAnyHour': staff,
  'slot.cancelLate': staff,
  // Placeholders the coming features fill in (change the rule in their own module if it differs)
  'delivery.create': staff,
  'delivery.read': staffOrOwnHousehold,
  'delivery.update': staff,
  'queue.read': (a: Actor) => a.kind === 'person' || a.kind === 'display' || a.kind === 'system',
  'run.read': staffOrOwnHousehold,
  'run.write': staff,
  'ledger.read': (a: Actor, r: HouseholdOwned | undefined) => a.kind === 'system' || (a.kind === 'person' && (a.role === 'coordinator' || (!!r && r.householdId === a.householdId))),
  'statement.read': (a: Actor, r: HouseholdOwned | undefined) => a.kind === 'system' || (a.kind === 'person' && (a.role === 'coordinator' || (!!r && r.householdId === a.householdId))),
  'statement.markPaid': coordinator,
  'display.manage': coordinator,
  'upload.create': staff,
} as Record<string, Rule<never>>);

/** May `actor` do `action` (to `record`)? */
export function can(actor: Actor, action: string, record?: unknown): boolean {
  const rule = rules.get(action) as Rule<unknown> | undefined;
  if (!rule) throw new Error(`No policy for "${action}": add it with definePolicies().`);
  return rule(actor, record);
}

/** Throws the forbidden domain error (403) unless `actor` may do `action`. */
export function authorize(actor: Actor, action: string, record?: unknown, message?: string): void {
  if (!can(actor, action, record)) throw forbidden(message ?? 'Your role does not allow you to do that.', 'forbidden');
}
