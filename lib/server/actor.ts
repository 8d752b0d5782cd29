import type { Role } from '@/lib/roles';

/** A signed-in person, as the database has them at this request. */
export interface PersonActor {
  kind: 'person';
  userId: string;
  role: Role;
  householdId: string | null;
  name: string;
  email: string;
}
/** Work the application does on its own (mail worker, scheduled jobs, seeds). */
export interface SystemActor {
  kind: 'system';
}
/** A sugarhouse screen showing the live queue through a revocable display link. */
export interface DisplayActor {
  kind: 'display';
  displayLinkId: string;
}
export type Actor = PersonActor | SystemActor | DisplayActor;

export const isPerson = (a: Actor): a is PersonActor => a.kind === 'person';
/** Sugarmakers and coordinators: they work for every household. */
export const isStaff = (a: Actor): boolean => a.kind === 'system' || (a.kind === 'person' && (a.role === 'coordinator' || a.role === 'sugarmaker'));
export const hasRole = (a: Actor, roles: readonly Role[]): boolean => a.kind === 'person' && roles.includes(a.role);
