import { QueryTypes } from 'sequelize';
import { getSequelize } from '@/db';
import type { Role } from '@/lib/roles';
import type { PersonActor } from './actor';

export interface PersonRow {
  id: string;
  cooperativeId: string;
  householdId: string | null;
  name: string;
  email: string;
  role: Role;
  sessionVersion: number;
  /** The co-op's change version, read with the person (lets a cached answer skip a query). */
  changeVersion: string;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** One primary-key lookup: the person as the database has them now, or null. */
export async function loadPersonRow(userId: string): Promise<PersonRow | null> {
  if (!UUID.test(userId)) return null;
  const rows = await getSequelize().query<PersonRow>(
    `SELECT u.id, u.cooperative_id AS "cooperativeId", u.household_id AS "householdId", u.name, u.email, u.role,
            u.session_version AS "sessionVersion", c.change_version::text AS "changeVersion"
       FROM users u JOIN cooperatives c ON c.id = u.cooperative_id WHERE u.id = :id`,
    { replacements: { id: userId }, type: QueryTypes.SELECT },
  );
  return rows[0] ?? null;
}

/** The claims of a session token that matter: who, and which generation of their sessions. */
export interface SessionClaims {
  uid?: unknown;
  sv?: unknown;
}

/**
 * The person a session token speaks for, if the token is still good: the person exists and
 * the token's session version is the current one. The same check for route handlers, pages,
 * server actions and sockets.
 */
export async function personFromClaims(
  claims: SessionClaims | null | undefined,
): Promise<{ actor: PersonActor; cooperativeId: string; changeVersion: string } | null> {
  if (!claims || typeof claims.uid !== 'string' || typeof claims.sv !== 'number') return null;
  const row = await loadPersonRow(claims.uid);
  if (!row || row.sessionVersion !== claims.sv) return null;
  return {
    cooperativeId: row.cooperativeId,
    changeVersion: row.changeVersion,
    actor: { kind: 'person', userId: row.id, role: row.role, householdId: row.householdId, name: row.name, email: row.email },
  };
}
