import 'server-only';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { db, type BoilSlot, type Cooperative } from '@/db/models';
import { actorUserId, type Ctx } from '@/lib/server/context';
import { registerConstraints, sqlState } from '@/lib/server/db-errors';
import { AppError, conflict, invalid, invalidField, notFound } from '@/lib/server/errors';
import { authorize, can } from '@/lib/server/policies';
import { withTransaction } from '@/lib/server/tx';
import { getCooperative } from '@/lib/coop/service';
import { isStaff, type Actor } from '@/lib/server/actor';
import { keptJson, processCache } from '@/lib/server/versioned-cache';
import { enqueueMail } from '@/lib/mail/outbox';
import { slotIcs } from '@/lib/mail/ics';
import { broadcast } from '@/lib/realtime';
import { recordChange } from '@/lib/events';
import { clockLabel, clockMinutes, formatSlotRange, localDay, localMinutes, toZonedIso } from '@/lib/time';
import type { SlotInput, SlotPatch } from '@/lib/slots/schema';
import { appUrl } from '@/lib/env';
import type { SlotDto } from './types';
export type { SlotDto };

registerConstraints({
  boil_slots_no_overlap: { code: 'slot_conflict', field: 'startsAt', message: 'That time was just taken by another booking. Pick another time.', fieldMessage: 'This time is taken.' },
  boil_slots_order: { code: 'invalid_input', field: 'endsAt', message: 'The slot must end after it starts.' },
  boil_slots_crew_size: { code: 'invalid_input', field: 'crew', message: 'At most 12 people in a crew.' },
});

/** What a slot's answer is made from: a model instance or a plain row of the list query. */
type SlotFields = Pick<BoilSlot, 'id' | 'evaporatorId' | 'householdId' | 'startsAt' | 'endsAt' | 'status' | 'crew' | 'expectedSapL' | 'note'>;

function toDto(slot: SlotFields, householdName: string, actor: Actor, zone: string): SlotDto {
  const own = can(actor, 'slot.seeDetails', slot);
  return {
    id: slot.id,
    evaporatorId: slot.evaporatorId,
    householdId: slot.householdId,
    householdName,
    startsAt: toZonedIso(slot.startsAt, zone),
    endsAt: toZonedIso(slot.endsAt, zone),
    status: slot.status,
    // Other households' slots show only who crews them.
    crew: own ? slot.crew : [],
    expectedSapL: own ? slot.expectedSapL : null,
    note: own ? slot.note : null,
    editable: own && slot.status === 'booked',
  };
}

interface SlotRow extends Omit<SlotDto, 'startsAt' | 'endsAt' | 'editable'> {
  startsAt: Date;
  endsAt: Date;
}

// A day boundary is the start of that day in the co-op's zone (PostgreSQL reads it there);
// a full timestamp is taken as it is.
const boundarySql = (param: string) =>
  `CASE WHEN $${param} ~ '^\\d{4}-\\d{2}-\\d{2}$' THEN ($${param}::date)::timestamp AT TIME ZONE c.time_zone ELSE $${param}::timestamptz END`;

const LIST_SLOTS_SQL = `
SELECT b.id, b.evaporator_id AS "evaporatorId", b.household_id AS "householdId", h.name AS "householdName",
       b.starts_at AS "startsAt", b.ends_at AS "endsAt", b.status, b.crew, b.expected_sap_l AS "expectedSapL", b.note,
       c.time_zone AS "timeZone"
  FROM cooperatives c
  JOIN boil_slots b ON b.cooperative_id = c.id
  JOIN households h ON h.id = b.household_id AND h.cooperative_id = b.cooperative_id
 WHERE c.id = $cooperativeId AND b.status <> 'cancelled'
   AND b.starts_at < ${boundarySql('to')} AND b.ends_at > ${boundarySql('from')}
 ORDER BY b.starts_at`;

/** Active slots (booked or done) overlapping [from, to): one query of plain rows. */
export async function listSlots(ctx: Ctx, { from, to }: { from: string; to: string }): Promise<SlotDto[]> {
  authorize(ctx.actor, 'slot.list');
  const rows = await db().sequelize.query<SlotRow & { timeZone: string }>(LIST_SLOTS_SQL, {
    bind: { cooperativeId: ctx.cooperativeId, from, to },
    type: QueryTypes.SELECT,
    transaction: ctx.transaction,
  });
  return rows.map(({ timeZone, ...slot }) => toDto(slot, slot.householdName, ctx.actor, timeZone));
}

// One week of a co-op's slots is a few kilobytes of JSON; about 2 bytes of memory per character.
const slotLists = processCache<string>('slot-lists', 16 * 2 ** 20, (json) => 2 * json.length);

/**
 * `GET /api/slots` as JSON text, kept per co-op change version (every booking, move and
 * cancellation bumps it) for each range and view: staff see every slot's details, a member its
 * own household's. `knownVersion` is the version read with the person in this request.
 */
export async function slotsJson(ctx: Ctx, query: { from: string; to: string }, { knownVersion }: { knownVersion?: string } = {}): Promise<string> {
  authorize(ctx.actor, 'slot.list');
  const view = isStaff(ctx.actor) ? 'staff' : ctx.actor.kind === 'person' ? `household:${ctx.actor.householdId ?? 'none'}` : 'none';
  return keptJson(slotLists, `${ctx.cooperativeId}|${view}|${query.from}|${query.to}`, { knownVersion, transaction: ctx.transaction }, () => listSlots(ctx, query));
}

/** The next booked slots, for the Today page (one household's, or everyone's). */
export async function listUpcomingSlots(ctx: Ctx, { householdId, limit }: { householdId: string | null; limit: number }) {
  authorize(ctx.actor, 'slot.list');
  const { BoilSlot, Household } = db();
  const rows = await BoilSlot.findAll({
    transaction: ctx.transaction,
    where: {
      cooperativeId: ctx.cooperativeId,
      status: 'booked',
      endsAt: { [Op.gt]: new Date() },
      ...(householdId ? { householdId } : {}),
    },
    include: [{ model: Household, as: 'household', attributes: ['name'] }],
    order: [['startsAt', 'ASC']],
    limit,
  });
  return rows.map((s) => ({
    id: s.id,
    startsAt: s.startsAt,
    endsAt: s.endsAt,
    householdName: (s as unknown as { household: { name: string } }).household.name,
  }));
}

interface Window {
  startsAt: Date;
  endsAt: Date;
}

/** The co-op's booking rules for one slot; answers 422 naming the field at fault. */
async function checkRules(
  { actor, coop, w, transaction }: { actor: Actor; coop: Cooperative; w: Window; transaction: Transaction },
) {
  const minutes = (w.endsAt.getTime() - w.startsAt.getTime()) / 60_000;
  if (minutes < coop.slotMinMinutes || minutes > coop.slotMaxMinutes) {
    throw invalid('That slot length is outside the co-op’s rules.', {
      endsAt: `A slot lasts from ${coop.slotMinMinutes / 60} to ${coop.slotMaxMinutes / 60} hours (this one: ${+(minutes / 60).toFixed(2)} h).`,
    }, 'slot_length');
  }
  const zone = coop.timeZone;
  const startDay = localDay(w.startsAt, zone);
  const endDay = localDay(new Date(w.endsAt.getTime() - 1), zone);
  const season = await db().Season.findOne({
    where: {
      cooperativeId: coop.id,
      status: { [Op.in]: ['planned', 'open'] },
      startsOn: { [Op.lte]: startDay },
      endsOn: { [Op.gte]: endDay },
    },
    transaction,
  });
  if (!season) {
    throw invalid('Slots can only be booked inside an open season.', { startsAt: 'This time is outside the season’s dates.' }, 'outside_season');
  }
  if (!can(actor, 'slot.bookAnyHour')) {
    if (w.startsAt.getTime() < Date.now()) {
      throw invalid('That time has already passed.', { startsAt: 'Choose a start in the future.' }, 'slot_in_past');
    }
    const opens = clockMinutes(coop.opensAt);
    const closes = clockMinutes(coop.closesAt);
    const endMin = localMinutes(w.endsAt, zone) || 24 * 60;
    if (startDay !== endDay || localMinutes(w.startsAt, zone) < opens || endMin > closes) {
      throw invalid('Members book inside the sugarhouse hours.', {
        startsAt: `The sugarhouse is open ${clockLabel(coop.opensAt)}–${clockLabel(coop.closesAt)}; a sugarmaker can book other hours.`,
      }, 'outside_hours');
    }
  }
  return season;
}

/** Turns the database's refusal of an overlap into a 409 naming the slot in the way. */
async function conflictError(evaporatorId: string, w: Window, excludeId: string | null, zone: string): Promise<AppError> {
  const { BoilSlot, Household } = db();
  const other = await BoilSlot.findOne({
    where: {
      evaporatorId,
      status: { [Op.ne]: 'cancelled' },
      startsAt: { [Op.lt]: w.endsAt },
      endsAt: { [Op.gt]: w.startsAt },
      ...(excludeId ? { id: { [Op.ne]: excludeId } } : {}),
    },
    include: [{ model: Household, as: 'household', attributes: ['name'] }],
  });
  if (!other) return conflict('That time was just taken by another booking. Pick another time.', 'slot_conflict');
  const name = (other as unknown as { household: { name: string } }).household.name;
  const when = formatSlotRange(other.startsAt, other.endsAt, zone);
  return conflict(`That time overlaps the ${name} household’s slot (${when}). Pick a time around it.`, 'slot_conflict', {
    fields: { startsAt: 'This time is taken.' },
    details: { conflict: { id: other.id, householdName: name, startsAt: toZonedIso(other.startsAt, zone), endsAt: toZonedIso(other.endsAt, zone) } },
  });
}

const isOverlap = (err: unknown) => sqlState(err) === '23P01';

type SlotMailKind = 'booked' | 'moved' | 'cancelled';

async function queueSlotMail(kind: SlotMailKind, slot: BoilSlot, coop: Cooperative, householdName: string, transaction: Transaction) {
  const { User, Evaporator } = db();
  const [people, evaporator] = await Promise.all([
    User.findAll({ where: { householdId: slot.householdId, cooperativeId: coop.id }, transaction }),
    Evaporator.findByPk(slot.evaporatorId, { transaction }),
  ]);
  const when = formatSlotRange(slot.startsAt, slot.endsAt, coop.timeZone);
  const subject = {
    booked: `Boil slot booked: ${when}`,
    moved: `Boil slot moved: ${when}`,
    cancelled: `Boil slot cancelled: ${when}`,
  }[kind];
  const lead = {
    booked: `The ${householdName} household is booked to crew a boil on ${evaporator?.name ?? 'the evaporator'}.`,
    moved: `The ${householdName} household’s boil slot has moved. The new time:`,
    cancelled: `The ${householdName} household’s boil slot has been cancelled; the time is free for others.`,
  }[kind];
  const crew = slot.crew.length ? `\nCrew: ${slot.crew.join(', ')}` : '';
  const text =
    `${lead}\n\n${when}\n${coop.name}${crew}\n\n` +
    (kind === 'cancelled' ? '' : 'Tend the fire with care: boiling sap and syrup burn, keep the firebox door shut between loads, never leave a firing evaporator unattended, and keep the sugarhouse ventilated (carbon monoxide).\n\n') +
    `The Boil calendar: ${appUrl()}/calendar\n\n— Brixhouse`;
  const ics = slotIcs({
    id: slot.id,
    startsAt: slot.startsAt,
    endsAt: slot.endsAt,
    title: `Boil slot – ${householdName} household`,
    description: `Crew the boil on ${evaporator?.name ?? 'the evaporator'} at ${coop.name}.`,
    location: coop.name,
    // The slot's revision: calendar programs keep the copy with the highest SEQUENCE.
    sequence: slot.revision,
    cancelled: kind === 'cancelled',
  });
  await enqueueMail(
    {
      to: people.map((p) => p.email),
      subject,
      text,
      attachments: [{ filename: 'boil-slot.ics', content: ics, contentType: `text/calendar; charset=utf-8; method=${kind === 'cancelled' ? 'CANCEL' : 'PUBLISH'}` }],
    },
    transaction,
  );
}

async function householdName(householdId: string, cooperativeId: string, transaction: Transaction): Promise<string> {
  const h = await db().Household.findOne({ where: { id: householdId, cooperativeId }, transaction });
  if (!h) throw invalidField('householdId', 'Choose one of your co-op’s households.');
  return h.name;
}

/** Books a slot in one transaction: rules, the overlap constraint, and the confirmation e-mail. */
export async function createSlot(ctx: Ctx, input: SlotInput): Promise<SlotDto> {
  const { BoilSlot, Evaporator } = db();
  const { actor } = ctx;
  const householdId = input.householdId ?? (actor.kind === 'person' ? actor.householdId : null) ?? undefined;
  authorize(actor, 'slot.create', { householdId: householdId ?? null }, 'Members book slots for their own household only.');
  if (!householdId) throw invalidField('householdId', 'Choose the household that crews this boil.');
  const w = { startsAt: new Date(input.startsAt), endsAt: new Date(input.endsAt) };
  const coop = await getCooperative(ctx);
  try {
    const dto = await withTransaction(ctx, async ({ transaction }) => {
      const name = await householdName(householdId!, coop.id, transaction);
      const evaporator = await Evaporator.findOne({ where: { id: input.evaporatorId, cooperativeId: coop.id }, transaction });
      if (!evaporator) throw invalidField('evaporatorId', 'Choose one of your co-op’s evaporators.');
      const season = await checkRules({ actor, coop, w, transaction });
      const slot = await BoilSlot.create(
        {
          cooperativeId: coop.id,
          seasonId: season.id,
          evaporatorId: evaporator.id,
          householdId: householdId!,
          startsAt: w.startsAt,
          endsAt: w.endsAt,
          crew: input.crew ?? [],
          expectedSapL: input.expectedSapL ?? null,
          note: input.note || null,
          bookedById: actorUserId(ctx),
        },
        { transaction },
      );
      await queueSlotMail('booked', slot, coop, name, transaction);
      await recordChange({ cooperativeId: coop.id, transaction }, { type: 'slot.booked', slotId: slot.id });
      return toDto(slot, name, actor, coop.timeZone);
    });
    broadcast(coop.id, 'slots:changed', { id: dto.id });
    return dto;
  } catch (err) {
    if (isOverlap(err)) throw await conflictError(input.evaporatorId, w, null, coop.timeZone);
    throw err;
  }
}

/**
 * Members change a slot (move or cancel) only until the co-op's notice before it starts, which
 * also keeps them from moving or cancelling a past slot still marked booked; staff may at any time.
 */
function checkNotice(actor: Actor, slot: BoilSlot, coop: Cooperative, action: 'move' | 'cancel') {
  if (can(actor, 'slot.cancelLate') || slot.startsAt.getTime() - Date.now() >= coop.cancelNoticeHours * 3_600_000) return;
  const started = slot.startsAt.getTime() <= Date.now();
  throw invalid(
    `Members can ${action} a slot up to ${coop.cancelNoticeHours} hours before it starts; ask a sugarmaker to ${action} this one.`,
    { startsAt: started ? `This slot has already started; it can no longer be ${action === 'move' ? 'moved' : 'cancelled'}.` : `Too close to the start to ${action}.` },
    `${action}_notice`,
  );
}

async function loadOwnSlot(ctx: Ctx, id: string, transaction: Transaction) {
  const slot = await db().BoilSlot.findOne({ where: { id, cooperativeId: ctx.cooperativeId }, transaction, lock: transaction.LOCK.UPDATE });
  if (!slot) throw notFound('That boil slot', 'slot_not_found');
  authorize(ctx.actor, 'slot.change', slot, 'Members change only their own household’s slots.');
  if (slot.status !== 'booked') throw conflict(`That slot is ${slot.status} and can no longer be changed.`, 'slot_closed');
  return slot;
}

/** Moves a slot or changes its crew or note; a move re-checks the rules and e-mails the household. */
export async function updateSlot(ctx: Ctx, id: string, patch: SlotPatch): Promise<SlotDto> {
  const coop = await getCooperative(ctx);
  let target: { evaporatorId: string; w: Window } | null = null;
  try {
    const dto = await withTransaction(ctx, async ({ transaction, actor }) => {
      const slot = await loadOwnSlot(ctx, id, transaction);
      const name = await householdName(slot.householdId, coop.id, transaction);
      const moved =
        patch.startsAt !== undefined &&
        patch.endsAt !== undefined &&
        (new Date(patch.startsAt).getTime() !== slot.startsAt.getTime() || new Date(patch.endsAt).getTime() !== slot.endsAt.getTime());
      const changes: Partial<BoilSlot> = {};
      if (moved) {
        checkNotice(actor, slot, coop, 'move');
        const w = { startsAt: new Date(patch.startsAt!), endsAt: new Date(patch.endsAt!) };
        target = { evaporatorId: slot.evaporatorId, w };
        const season = await checkRules({ actor, coop, w, transaction });
        Object.assign(changes, { startsAt: w.startsAt, endsAt: w.endsAt, seasonId: season.id });
      }
      if (patch.crew !== undefined) changes.crew = patch.crew;
      if (patch.note !== undefined) changes.note = patch.note || null;
      if (patch.expectedSapL !== undefined) changes.expectedSapL = patch.expectedSapL;
      // returning: the row as the database wrote it, with the revision its trigger raised.
      await slot.update(changes, { transaction, returning: true });
      if (moved) await queueSlotMail('moved', slot, coop, name, transaction);
      if (moved) await recordChange({ cooperativeId: coop.id, transaction }, { type: 'slot.moved', slotId: slot.id });
      return toDto(slot, name, actor, coop.timeZone);
    });
    broadcast(coop.id, 'slots:changed', { id });
    return dto;
  } catch (err) {
    const t = target as { evaporatorId: string; w: Window } | null;
    if (isOverlap(err) && t) throw await conflictError(t.evaporatorId, t.w, id, coop.timeZone);
    throw err;
  }
}

/** Cancels a slot (members: their own, and not later than the co-op's notice); frees its time. */
export async function cancelSlot(ctx: Ctx, id: string): Promise<SlotDto> {
  const coop = await getCooperative(ctx);
  const dto = await withTransaction(ctx, async ({ transaction, actor }) => {
    const slot = await loadOwnSlot(ctx, id, transaction);
    checkNotice(actor, slot, coop, 'cancel');
    const name = await householdName(slot.householdId, coop.id, transaction);
    await slot.update({ status: 'cancelled', cancelledAt: new Date(), cancelledById: actorUserId(ctx) }, { transaction, returning: true });
    await queueSlotMail('cancelled', slot, coop, name, transaction);
    await recordChange({ cooperativeId: coop.id, transaction }, { type: 'slot.cancelled', slotId: slot.id });
    return toDto(slot, name, actor, coop.timeZone);
  });
  broadcast(coop.id, 'slots:changed', { id });
  return dto;
}
