import 'server-only';
import crypto from 'node:crypto';
import { Op } from 'sequelize';
import { db } from '@/db/models';
import type { Role } from '@/lib/roles';
import { ApiError } from '@/lib/api/errors';
import { enqueueMail } from '@/lib/mail/outbox';
import { welcomeMail } from '@/lib/mail/templates';
import type { HouseholdInput, PersonInput, RoleChange } from '@/lib/validations/households';

export interface PersonDto {
  id: string;
  name: string;
  email: string;
  role: Role;
  householdId: string | null;
  invited: boolean;
}
export interface HouseholdDto {
  id: string;
  name: string;
  people: PersonDto[];
}

const INVITE_DAYS = 7;

function personDto(u: { id: string; name: string; email: string; role: Role; householdId: string | null; passwordHash?: string | null }): PersonDto {
  return { id: u.id, name: u.name, email: u.email, role: u.role, householdId: u.householdId, invited: !u.passwordHash };
}

/** Households of one cooperative with their people, by name. */
export async function listHouseholds({ cooperativeId }: { cooperativeId: string }): Promise<HouseholdDto[]> {
  const { Household, User } = db();
  const [households, people] = await Promise.all([
    Household.findAll({ where: { cooperativeId }, order: [['name', 'ASC']] }),
    User.findAll({ where: { cooperativeId }, order: [['name', 'ASC']] }),
  ]);
  return households.map((h) => ({
    id: h.id,
    name: h.name,
    people: people.filter((p) => p.householdId === h.id).map(personDto),
  }));
}

/** People with no household (coordinators and sugarmakers who deliver no sap of their own). */
export async function listStaff({ cooperativeId }: { cooperativeId: string }): Promise<PersonDto[]> {
  const { User } = db();
  const rows = await User.findAll({ where: { cooperativeId, householdId: null }, order: [['name', 'ASC']] });
  return rows.map(personDto);
}

export async function createHousehold({ cooperativeId, input }: { cooperativeId: string; input: HouseholdInput }) {
  const { Household, sequelize } = db();
  return sequelize.transaction(async (transaction) => {
    const clash = await Household.findOne({
      where: { cooperativeId, name: { [Op.iLike]: input.name } },
      transaction,
    });
    if (clash) throw new ApiError(409, `There is already a household called “${clash.name}”.`, { name: 'That name is taken.' });
    const h = await Household.create({ cooperativeId, name: input.name }, { transaction });
    return { id: h.id, name: h.name, people: [] } satisfies HouseholdDto;
  });
}

async function assertHousehold(cooperativeId: string, householdId: string | null | undefined, transaction: import('sequelize').Transaction) {
  if (!householdId) return;
  const { Household } = db();
  const h = await Household.findOne({ where: { id: householdId, cooperativeId }, transaction });
  if (!h) throw new ApiError(422, 'Some fields need another look.', { householdId: 'Choose one of your co-op’s households.' });
}

/** Adds a person with a role and queues their welcome e-mail, in one transaction. */
export async function addPerson({ cooperativeId, input }: { cooperativeId: string; input: PersonInput }): Promise<PersonDto> {
  const { User, Cooperative, sequelize } = db();
  return sequelize.transaction(async (transaction) => {
    await assertHousehold(cooperativeId, input.householdId, transaction);
    const taken = await User.findOne({ where: { email: input.email }, transaction });
    if (taken) {
      throw new ApiError(409, `${input.email} already has an account.`, { email: 'This e-mail address is already in use.' });
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
    await enqueueMail(
      welcomeMail({ to: user.email, name: user.name, cooperative: coop!.name, role: user.role, token }),
      transaction,
    );
    return personDto(user);
  });
}

/** Changes a person's role (and household); a co-op always keeps one coordinator. */
export async function changeRole({ cooperativeId, userId, input }: { cooperativeId: string; userId: string; input: RoleChange }): Promise<PersonDto> {
  const { User, sequelize } = db();
  return sequelize.transaction(async (transaction) => {
    const user = await User.findOne({ where: { id: userId, cooperativeId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw new ApiError(404, 'That person was not found in your co-op.');
    const householdId = input.householdId === undefined ? user.householdId : input.householdId;
    if (input.role === 'member' && !householdId) {
      throw new ApiError(422, 'Some fields need another look.', { householdId: 'A member belongs to a household: choose one.' });
    }
    await assertHousehold(cooperativeId, householdId, transaction);
    if (user.role === 'coordinator' && input.role !== 'coordinator') {
      const coordinators = await User.findAll({
        where: { cooperativeId, role: 'coordinator' },
        transaction,
        lock: transaction.LOCK.UPDATE,
      });
      if (coordinators.length <= 1) {
        throw new ApiError(409, 'The co-op needs at least one coordinator: make someone else coordinator first.', {
          role: 'This is the last coordinator.',
        });
      }
    }
    await user.update({ role: input.role, householdId }, { transaction });
    return personDto(user);
  });
}

export function sha256(s: string) {
  return crypto.createHash('sha256').update(s).digest('hex');
}

/** Sets the password of an invited person from their one-time link. */
export async function acceptInvitation({ token, passwordHash }: { token: string; passwordHash: string }) {
  const { User, sequelize } = db();
  return sequelize.transaction(async (transaction) => {
    const user = await User.findOne({ where: { inviteTokenHash: sha256(token) }, transaction, lock: transaction.LOCK.UPDATE });
    if (!user || !user.inviteExpiresAt || user.inviteExpiresAt < new Date()) {
      throw new ApiError(404, 'This invitation link has expired or was already used. Ask your coordinator for a new one.');
    }
    await user.update({ passwordHash, inviteTokenHash: null, inviteExpiresAt: null }, { transaction });
    return { email: user.email };
  });
}
