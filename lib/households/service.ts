import 'server-only';
import crypto from 'node:crypto';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { db } from '@/db/models';
import type { Role } from '@/lib/roles';
import type { Ctx, PersonCtx } from '@/lib/server/context';
import { registerConstraints } from '@/lib/server/db-errors';
import { AppError, conflict, forbidden, invalidField, notFound } from '@/lib/server/errors';
import { authorize } from '@/lib/server/policies';
import { withTransaction } from '@/lib/server/tx';
import { enqueueMail } from '@/lib/mail/outbox';
import { recordChange } from '@/lib/events';
import { disconnectPerson } from '@/lib/realtime';
import { welcomeMail } from '@/lib/mail/templates';
import type { HouseholdInput, PersonInput, RoleChange } from '@/lib/households/schema';
import type { PersonDto, HouseholdDto } from './types';
export type { PersonDto, HouseholdDto };

registerConstraints({
  households_name_per_coop: { code: 'household_name_taken', field: 'name', message: 'There is already a household by that name.', fieldMessage: 'That name is taken.' },
  users_email_unique: { code: 'email_taken', field: 'email', message: 'That e-mail address already has an account.', fieldMessage: 'This e-mail address is already in use.' },
  users_member_has_household: { code: 'household_required', field: 'householdId', message: 'A member belongs to a household: choose one.' },
});

const INVITE_DAYS = 7;

function personDto(u: { id: string; name: string; email: string; role: Role; householdId: string | null; passwordHash?: string | null }): PersonDto {
  return { id: u.id, name: u.name, email: u.email, role: u.role, householdId: u.householdId, invited: !u.passwordHash };
}

/** Households of one cooperative with their people, by name. */
export async function listHouseholds(ctx: Ctx): Promise<HouseholdDto[]> {
  authorize(ctx.actor, 'household.list');
  const { Household, User } = db();
  const { cooperativeId, transaction } = ctx;
  const [households, people] = await Promise.all([
    Household.findAll({ where: { cooperativeId }, order: [['name', 'ASC']], transaction }),
    User.findAll({ where: { cooperativeId }, order: [['name', 'ASC']], transaction }),
  ]);
  return households.map((h) => ({
    id: h.id,
    name: h.name,
    people: people.filter((p) => p.householdId === h.id).map(personDto),
  }));
}

/** People with no household (coordinators and sugarmakers who deliver no sap of their own). */
export async function listStaff(ctx: Ctx): Promise<PersonDto[]> {
  authorize(ctx.actor, 'person.list');
  const { User } = db();
  const rows = await User.findAll({ where: { cooperativeId: ctx.cooperativeId, householdId: null }, order: [['name', 'ASC']], transaction: ctx.transaction });
  return rows.map(personDto);
}

/** A new household; a name already used in the co-op (any case) answers 409 by its unique index. */
export async function createHousehold(ctx: Ctx, input: HouseholdInput): Promise<HouseholdDto> {
  authorize(ctx.actor, 'household.create');
  const { Household } = db();
  return withTransaction(ctx, async ({ cooperativeId, transaction }) => {
    const h = await Household.create({ cooperativeId, name: input.name }, { transaction });
    await recordChange({ cooperativeId, transaction }, { type: 'household.added', householdId: h.id });
    return { id: h.id, name: h.name, people: [] };
  });
}

async function assertHousehold(cooperativeId: string, householdId: string | null | undefined, transaction: Transaction) {
  if (!householdId) return;
  const { Household } = db();
  const h = await Household.findOne({ where: { id: householdId, cooperativeId }, transaction });
  if (!h) throw invalidField('householdId', 'Choose one of your co-op’s households.');
}

/** Adds a person with a role and queues their welcome e-mail, in one transaction. */
export async function addPerson(ctx: Ctx, input: PersonInput): Promise<PersonDto> {
  authorize(ctx.actor, 'person.create');
  const { User, Cooperative } = db();
  return withTransaction(ctx, async ({ cooperativeId, transaction }) => {
    await assertHousehold(cooperativeId, input.householdId, transaction);
    const taken = await User.findOne({ where: { email: input.email }, transaction });
    if (taken) {
      throw conflict(`${input.email} already has an account.`, 'email_taken', { fields: { email: 'This e-mail address is already in use.' } });
    }
    const token = crypto.randomBytes(32).toString('base64url');
    const user = await User.create(
      {
        cooperativeId,
        householdId: input.householdId ?? null,
        name: input.name,
        email: input.email,
        role: input.role,
        passwordHash: null,
        inviteTokenHash: sha256(token),
        inviteExpiresAt: new Date(Date.now() + INVITE_DAYS * 86_400_000),
      },
      { transaction },
    );
    const coop = await Cooperative.findByPk(cooperativeId, { transaction });
    await enqueueMail(welcomeMail({ to: user.email, name: user.name, cooperative: coop!.name, role: user.role, token }), transaction);
    return personDto(user);
  });
}

/**
 * Changes a person's role (and household); a co-op always keeps one coordinator. The acting
 * coordinator and every coordinator are locked in one order (by id), and the actor's own role is
 * checked again under that lock, so two coordinators demoting each other at once leave one.
 */
export async function changeRole(ctx: PersonCtx, userId: string, input: RoleChange): Promise<PersonDto> {
  authorize(ctx.actor, 'person.changeRole');
  const { User } = db();
  return withTransaction(ctx, async ({ cooperativeId, transaction, actor }) => {
    const locked = await User.findAll({
      where: { cooperativeId, [Op.or]: [{ role: 'coordinator' }, { id: userId }, { id: actor.userId }] },
      order: [['id', 'ASC']],
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    const me = locked.find((u) => u.id === actor.userId);
    if (!me || me.role !== 'coordinator') throw forbidden('Only a coordinator can change roles; yours has just changed.', 'role_changed');
    const user = locked.find((u) => u.id === userId);
    if (!user) throw notFound('That person', 'person_not_found');
    const householdId = input.householdId === undefined ? user.householdId : input.householdId;
    if (input.role === 'member' && !householdId) {
      throw invalidField('householdId', 'A member belongs to a household: choose one.', 'household_required');
    }
    await assertHousehold(cooperativeId, householdId, transaction);
    if (user.role === 'coordinator' && input.role !== 'coordinator') {
      const coordinators = locked.filter((u) => u.role === 'coordinator');
      if (coordinators.length <= 1) {
        throw conflict('The co-op needs at least one coordinator: make someone else coordinator first.', 'last_coordinator', {
          fields: { role: 'This is the last coordinator.' },
        });
      }
    }
    const changed = user.role !== input.role || user.householdId !== householdId;
    await user.update({ role: input.role, householdId }, { transaction });
    // Their next request reads the new role and household (no stale powers); open sockets
    // reconnect and are checked afresh.
    if (changed) transaction.afterCommit(() => disconnectPerson(user.id));
    return personDto(user);
  });
}

/**
 * Ends every session of a person: their session tokens stop working at the next request, and
 * (after commit) their open sockets are disconnected.
 */
export async function endSessions(userId: string, transaction: Transaction): Promise<void> {
  await db().sequelize.query('UPDATE users SET session_version = session_version + 1 WHERE id = :userId', {
    replacements: { userId },
    transaction,
    type: QueryTypes.UPDATE,
  });
  transaction.afterCommit(() => disconnectPerson(userId));
}

/** "Sign out everywhere": the acting person's every session, this one included, ends. */
export async function signOutEverywhere(ctx: PersonCtx): Promise<void> {
  await withTransaction(ctx, ({ actor, transaction }) => endSessions(actor.userId, transaction));
}

export function sha256(s: string) {
  return crypto.createHash('sha256').update(s).digest('hex');
}

const invitationGone = () =>
  new AppError('not_found', 'invitation_not_found', 'This invitation link has expired or was already used. Ask your coordinator for a new one.');

/** Throws 404 unless the invitation link is still good. */
export async function findUsableInvitation(token: string): Promise<void> {
  const { User } = db();
  const user = await User.findOne({ where: { inviteTokenHash: sha256(token), inviteExpiresAt: { [Op.gt]: new Date() } } });
  if (!user) throw invitationGone();
}

/** Sets the password of an invited person from their one-time link. */
export async function acceptInvitation({ token, passwordHash }: { token: string; passwordHash: string }) {
  const { User } = db();
  return withTransaction(async (transaction) => {
    const user = await User.findOne({ where: { inviteTokenHash: sha256(token) }, transaction, lock: transaction.LOCK.UPDATE });
    if (!user || !user.inviteExpiresAt || user.inviteExpiresAt < new Date()) {
      throw invitationGone();
    }
    await user.update({ passwordHash, inviteTokenHash: null, inviteExpiresAt: null }, { transaction });
    return { email: user.email };
  });
}
