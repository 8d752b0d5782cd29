import 'server-only';
import { DateTime } from 'luxon';
import { QueryTypes, UniqueConstraintError, type Transaction } from 'sequelize';
import { db } from '@/db/models';
import { announceChange, changeMarkOf, recordChange } from '@/lib/events';
import { isStaff } from '@/lib/server/actor';
import { actorUserId, type Ctx, type TxCtx } from '@/lib/server/context';
import { isConnectionError, registerConstraints } from '@/lib/server/db-errors';
import { invalid, notFound } from '@/lib/server/errors';
import { authorize, can } from '@/lib/server/policies';
import { withTransaction } from '@/lib/server/tx';
import { keptJson, processCache } from '@/lib/server/versioned-cache';
import { isCoopKey, photoExists } from '@/lib/storage';
import { sugarKg, type UnitSystem } from '@/lib/sugar';
import { localDay, toZonedIso } from '@/lib/time';
import { queueRejectionMail, type MailCoop } from './mail';
import { collectionStart, decide, recommend, type ShelfSettings } from './rules';
import { LIMITS, type DeliveryInput, type DeliveryPatch, type DeliveryQuery } from './schema';
import type { DeliveryDetailDto, DeliveryDto, DeliveryRevisionDto } from './types';

/** Who acts, for which co-op, and (optionally) the transaction to work in. */
export type DeliveryContext = Ctx;

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** 422 naming the field, with the message on the field. */
function fail(field: string, message: string, code = 'invalid_input'): never {
  throw invalid(message, { [field]: message }, code);
}
const lotNotFound = () => notFound('That drop-off');

/** The household a member may see; null for staff (every household); undefined for nobody's. */
const ownHousehold = (ctx: Ctx): string | null | undefined =>
  isStaff(ctx.actor) ? null : ctx.actor.kind === 'person' ? (ctx.actor.householdId ?? undefined) : undefined;

interface CoopRow extends ShelfSettings {
  id: string;
  name: string;
  timeZone: string;
  unitSystem: UnitSystem;
  seasonId: string | null;
}

async function coopAndOpenSeason(cooperativeId: string, transaction?: Transaction): Promise<CoopRow> {
  const [row] = await db().sequelize.query<CoopRow>(
    `SELECT c.id, c.name, c.time_zone AS "timeZone", c.unit_system AS "unitSystem", c.shelf_days AS "shelfDays",
            c.warm_above_c AS "warmAboveC", c.warm_shelf_days AS "warmShelfDays", s.id AS "seasonId"
       FROM cooperatives c LEFT JOIN seasons s ON s.cooperative_id = c.id AND s.status = 'open'
      WHERE c.id = :cooperativeId`,
    { replacements: { cooperativeId }, type: QueryTypes.SELECT, transaction },
  );
  if (!row) throw notFound('Your cooperative');
  return row;
}

interface NewLotRow extends CoopRow {
  householdName: string | null;
  /** A lot already logged with this idempotency key. */
  existingId: string | null;
}

/** Everything a new lot is checked against, in one statement (a busy desk logs many). */
async function newLotContext(cooperativeId: string, householdId: string, key: string, transaction?: Transaction): Promise<NewLotRow> {
  const [row] = await db().sequelize.query<NewLotRow>(
    `SELECT c.id, c.name, c.time_zone AS "timeZone", c.unit_system AS "unitSystem", c.shelf_days AS "shelfDays",
            c.warm_above_c AS "warmAboveC", c.warm_shelf_days AS "warmShelfDays", s.id AS "seasonId",
            (SELECT h.name FROM households h WHERE h.id = :householdId AND h.cooperative_id = c.id) AS "householdName",
            (SELECT d.id FROM sap_deliveries d WHERE d.cooperative_id = c.id AND d.idempotency_key = :key) AS "existingId"
       FROM cooperatives c LEFT JOIN seasons s ON s.cooperative_id = c.id AND s.status = 'open'
      WHERE c.id = :cooperativeId`,
    { replacements: { cooperativeId, householdId: UUID.test(householdId) ? householdId : null, key }, type: QueryTypes.SELECT, transaction },
  );
  if (!row) throw notFound('Your cooperative');
  return row;
}

async function householdName(cooperativeId: string, householdId: string, transaction?: Transaction): Promise<string | null> {
  const [row] = await db().sequelize.query<{ name: string }>('SELECT name FROM households WHERE id = :householdId AND cooperative_id = :cooperativeId', {
    replacements: { householdId, cooperativeId },
    type: QueryTypes.SELECT,
    transaction,
  });
  return row?.name ?? null;
}

const roundL = (v: number) => Math.round(v * 1000) / 1000;
const roundBrix = (v: number) => Math.round(v * 10) / 10;

function checkCollectedOn(collectedOn: string, receivedDay: string) {
  if (collectedOn > receivedDay) fail('collectedOn', 'The collection day cannot be after the day the lot arrived.');
  const oldest = DateTime.fromISO(receivedDay).minus({ days: LIMITS.maxCollectedDaysAgo }).toISODate()!;
  if (collectedOn < oldest) fail('collectedOn', `Sap collected more than ${LIMITS.maxCollectedDaysAgo} days before it arrived cannot be logged.`);
}

async function checkPhotoKey(cooperativeId: string, key: string | null | undefined) {
  if (!key) return;
  if (!isCoopKey(cooperativeId, key) || !(await photoExists(key))) fail('photoKey', 'That photo was not found; take or choose it again.', 'photo_not_found');
}

// The database's refusals, as a person reads them (the service checks first; these are the backstop).
registerConstraints({
  sap_deliveries_volume: { code: 'invalid_input', field: 'volumeL', message: 'The volume must be more than zero.' },
  sap_deliveries_brix: { code: 'invalid_input', field: 'brix', message: `°Brix is between 0 and ${LIMITS.maxBrix}.` },
  sap_deliveries_sap_temp: { code: 'invalid_input', field: 'sapTempC', message: 'That sap temperature is out of range.' },
  sap_deliveries_collected_before_received: { code: 'invalid_input', field: 'collectedOn', message: 'The collection day cannot be after the day the lot arrived.' },
  sap_deliveries_mix: { code: 'invalid_input', field: 'mix', message: 'The sugarbush mix must add up to 100 %.' },
  sap_deliveries_rejected_has_reason: { code: 'reason_required', field: 'reason', message: 'A rejected lot needs a reason.' },
  sap_deliveries_override_has_reason: { code: 'reason_required', field: 'reason', message: 'Going against the recommendation needs a reason.' },
  sap_deliveries_household_fk: { code: 'invalid_input', field: 'householdId', message: 'Choose a household of this cooperative.' },
  sap_deliveries_season_fk: { code: 'no_open_season', message: 'There is no open season to log sap into.' },
  // Runs take litres from lots (lib/runs): a correction may not undercut them.
  sap_deliveries_not_overdrawn: {
    code: 'lot_already_boiled',
    kind: 'conflict',
    field: 'volumeL',
    message: 'Part of this lot has already been boiled: its volume cannot go below the litres taken into runs.',
    fieldMessage: 'Less than what has already been boiled.',
  },
  sap_deliveries_boiled_only_accepted: {
    code: 'lot_already_boiled',
    kind: 'conflict',
    field: 'status',
    message: 'Part of this lot has already been boiled, so it can no longer be rejected.',
    fieldMessage: 'Part of this lot has already been boiled.',
  },
});

// ---------------------------------------------------------------------------------------------
// Reading

/** The co-op-local ISO 8601 time of a timestamptz column, formatted by PostgreSQL once per row. */
const zonedIso = (col: string, zone: string) =>
  `(to_char(${col} AT TIME ZONE ${zone}, 'YYYY-MM-DD"T"HH24:MI:SS.MS') || (SELECT CASE WHEN o < 0 THEN '-' ELSE '+' END || lpad((abs(o) / 60)::text, 2, '0') || ':' || lpad((abs(o) % 60)::text, 2, '0') FROM (SELECT (extract(epoch FROM (${col} AT TIME ZONE ${zone}) - (${col} AT TIME ZONE 'UTC')) / 60)::int AS o) x))`;

const LOT_COLUMNS = `
  d.id, d.season_id AS "seasonId", d.household_id AS "householdId", h.name AS "householdName",
  ${zonedIso('d.received_at', 'c.time_zone')} AS "receivedAt", d.collected_on AS "collectedOn",
  d.volume_l AS "volumeL", d.brix::float8 AS brix, d.sap_temp_c AS "sapTempC", d.clarity, d.contamination,
  d.sugar_maple_pct AS "sugarMaplePct", d.red_maple_pct AS "redMaplePct", d.other_pct AS "otherPct",
  d.recommendation, d.status, d.reason, d.photo_key AS "photoKey", d.note, d.logged_by AS "loggedBy", u.name AS "loggedByName", d.litres_boiled AS "litresBoiled"`;

const LOT_FROM = `
  FROM sap_deliveries d
  JOIN cooperatives c ON c.id = d.cooperative_id
  JOIN households h ON h.id = d.household_id
  LEFT JOIN users u ON u.id = d.logged_by`;

interface LotRow extends Omit<DeliveryDto, 'sugarKg' | 'mix' | 'revisions'> {
  sugarMaplePct: number | null;
  redMaplePct: number | null;
  otherPct: number | null;
}

function toDto<R extends LotRow>(r: R): Omit<R, 'sugarMaplePct' | 'redMaplePct' | 'otherPct'> & Pick<DeliveryDto, 'sugarKg' | 'mix'> {
  const { sugarMaplePct, redMaplePct, otherPct, ...rest } = r;
  return {
    ...rest,
    sugarKg: sugarKg(r.volumeL, r.brix),
    mix: sugarMaplePct === null ? null : { sugarMaple: sugarMaplePct, redMaple: redMaplePct!, other: otherPct! },
  };
}

/**
 * `GET /api/deliveries`: one SQL query; a member sees its own household's lots only. Days are
 * the co-op's calendar days, inclusive.
 */
// Lists as JSON text per co-op, household scope and query, kept per co-op change version (every
// write a list shows — lots, corrections, runs taking litres, names — bumps it).
const lists = processCache<string>('delivery-lists', 16 * 2 ** 20, (json) => 2 * json.length);

/**
 * `GET /api/deliveries` as JSON text. `knownVersion` is the co-op's change version read with the
 * person in this request (nothing written since): a list built at it or later is served as kept.
 */
export async function deliveriesJson(ctx: DeliveryContext, query: DeliveryQuery, { knownVersion }: { knownVersion?: string } = {}): Promise<string> {
  const own = ownHousehold(ctx);
  const scope = own === undefined ? 'none' : (own ?? 'all');
  const q = query as Record<string, unknown>;
  const key = [ctx.cooperativeId, scope, ...Object.keys(q).sort().map((k) => `${k}=${String(q[k] ?? '')}`)].join('|');
  return keptJson(lists, key, { knownVersion, transaction: ctx.transaction }, () => listDeliveries(ctx, query));
}

export async function listDeliveries(ctx: DeliveryContext, query: DeliveryQuery): Promise<DeliveryDto[]> {
  const own = ownHousehold(ctx);
  if (own === undefined) return [];
  const householdId = own ?? query.householdId;
  const where = ['d.cooperative_id = :cooperativeId'];
  if (householdId) where.push('d.household_id = :householdId');
  if (query.status) where.push('d.status = :status');
  if (query.seasonId) where.push('d.season_id = :seasonId');
  if (query.from) where.push(`d.received_at >= (:from::date)::timestamp AT TIME ZONE c.time_zone`);
  if (query.to) where.push(`d.received_at < ((:to::date) + 1)::timestamp AT TIME ZONE c.time_zone`);
  const rows = await db().sequelize.query<LotRow & { revisions: number }>(
    `SELECT ${LOT_COLUMNS}, (SELECT count(*) FROM delivery_revisions r WHERE r.delivery_id = d.id)::int AS revisions
       ${LOT_FROM}
      WHERE ${where.join(' AND ')}
      ORDER BY d.received_at DESC, d.id`,
    {
      replacements: { cooperativeId: ctx.cooperativeId, householdId, status: query.status, seasonId: query.seasonId, from: query.from, to: query.to },
      type: QueryTypes.SELECT,
      transaction: ctx.transaction,
    },
  );
  return rows.map(toDto);
}

/** `GET /api/deliveries/:id`: the lot with its revisions and deadline; another household's lot is 404 to a member. */
export async function getDelivery(ctx: DeliveryContext, id: string): Promise<DeliveryDetailDto> {
  if (!UUID.test(id)) throw lotNotFound();
  const [row] = await db().sequelize.query<
    LotRow & { revisions: DeliveryRevisionDto[] | null; timeZone: string; shelfDays: number; warmAboveC: number; warmShelfDays: number }
  >(
    `SELECT ${LOT_COLUMNS}, c.time_zone AS "timeZone", c.shelf_days AS "shelfDays", c.warm_above_c AS "warmAboveC", c.warm_shelf_days AS "warmShelfDays",
            (SELECT json_agg(json_build_object('id', r.id, 'changedAt', ${zonedIso('r.changed_at', 'c.time_zone')}, 'changedBy', r.changed_by,
                     'changedByName', ru.name, 'reason', r.reason, 'before', r.before, 'after', r.after) ORDER BY r.changed_at, r.id)
               FROM delivery_revisions r LEFT JOIN users ru ON ru.id = r.changed_by WHERE r.delivery_id = d.id) AS revisions
       ${LOT_FROM}
      WHERE d.id = :id AND d.cooperative_id = :cooperativeId`,
    { replacements: { id, cooperativeId: ctx.cooperativeId }, type: QueryTypes.SELECT, transaction: ctx.transaction },
  );
  // Another household's lot is not there for a member (404, not 403: its existence is not theirs to know).
  if (!row || !can(ctx.actor, 'delivery.read', { householdId: row.householdId })) throw lotNotFound();
  const { timeZone, shelfDays, warmAboveC, warmShelfDays, revisions, ...lot } = row;
  const rec = recommend(
    { clarity: lot.clarity, contamination: lot.contamination, sapTempC: lot.sapTempC, collectedAt: collectionStart(lot.collectedOn, timeZone), receivedAt: new Date(lot.receivedAt) },
    { shelfDays, warmAboveC, warmShelfDays },
  );
  return { ...toDto(lot), revisions: revisions ?? [], deadline: toZonedIso(rec.deadline, timeZone) };
}

// ---------------------------------------------------------------------------------------------
// Writing

const isIdempotencyClash = (err: unknown) =>
  err instanceof UniqueConstraintError && (err.parent as { constraint?: string } | undefined)?.constraint === 'sap_deliveries_idempotency';

async function findByKey(cooperativeId: string, key: string): Promise<string | null> {
  const [row] = await db().sequelize.query<{ id: string }>('SELECT id FROM sap_deliveries WHERE cooperative_id = :cooperativeId AND idempotency_key = :key', {
    replacements: { cooperativeId, key },
    type: QueryTypes.SELECT,
  });
  return row?.id ?? null;
}

/**
 * `POST /api/deliveries`: logs a lot. An accepted lot (nearly every lot at a busy desk) is one
 * statement of its own: the lot and its change mark commit together, and that statement inserts
 * nothing if the season closed or the key was taken meanwhile. Anything else (a rejected lot
 * with its e-mail, a key seen before, a season closed in between, a lost connection) goes
 * through one transaction that reads everything again. A repeated idempotency key, also from a
 * concurrent post, answers the first lot with `created: false`.
 */
export async function createDelivery(ctx: DeliveryContext, input: DeliveryInput, now = new Date()): Promise<{ lot: DeliveryDto; created: boolean }> {
  authorize(ctx.actor, 'delivery.create', undefined, 'Only a sugarmaker or a coordinator can log a drop-off.');
  // The photo is looked up in storage once, also when the lot then goes the long way.
  let photoChecked = false;
  if (!ctx.transaction) {
    try {
      const coop = await newLotContext(ctx.cooperativeId, input.householdId, input.idempotencyKey);
      if (coop.existingId) return { lot: await lotForAnswer(ctx, coop.existingId), created: false };
      const plan = await planLot(ctx.cooperativeId, coop, input, now);
      photoChecked = true;
      if (plan.status === 'accepted') {
        const lot = await insertAcceptedLot(ctx, coop, plan, input, now);
        if (lot) return { lot, created: true };
      }
    } catch (err) {
      // A connection lost on the way: the transaction below retries, and finds the lot if it landed.
      if (!isConnectionError(err)) throw err;
    }
  }
  try {
    // Safe to retry on a lost connection: a second try of a committed insert meets the key.
    const out = await withTransaction(ctx, (tx) => insertLot(tx, input, now, photoChecked), { idempotent: true });
    if ('existingId' in out) return { lot: await lotForAnswer(ctx, out.existingId), created: false };
    return { lot: out, created: true };
  } catch (err) {
    if (isIdempotencyClash(err)) {
      const id = await findByKey(ctx.cooperativeId, input.idempotencyKey);
      if (id) return { lot: await lotForAnswer(ctx, id), created: false };
    }
    throw err;
  }
}

async function lotForAnswer(ctx: DeliveryContext, id: string): Promise<DeliveryDto> {
  const { deadline: _deadline, revisions, ...lot } = await getDelivery({ ...ctx, transaction: undefined }, id);
  return { ...lot, revisions: revisions.length };
}

/** A new lot's row as checked against its co-op (422 naming the field otherwise). */
interface LotPlan {
  seasonId: string;
  householdName: string;
  recommendation: 'accept' | 'reject';
  status: 'accepted' | 'rejected';
  reason: string | null;
}

async function planLot(cooperativeId: string, coop: NewLotRow, input: DeliveryInput, now: Date, photoChecked = false): Promise<LotPlan> {
  if (!coop.seasonId) throw invalid('There is no open season to log sap into. A coordinator opens one in Settings.', undefined, 'no_open_season');
  const name = coop.householdName;
  if (!name) fail('householdId', 'Choose a household of this cooperative.', 'unknown_household');
  checkCollectedOn(input.collectedOn, localDay(now, coop.timeZone));
  if (!photoChecked) await checkPhotoKey(cooperativeId, input.photoKey);

  const rec = recommend(
    { clarity: input.clarity, contamination: input.contamination, sapTempC: input.sapTempC, collectedAt: collectionStart(input.collectedOn, coop.timeZone), receivedAt: now },
    coop,
  );
  const decided = decide(rec, input.decision, input.reason);
  if ('needsReason' in decided) {
    const message = input.decision === 'reject' || (!input.decision && rec.decision === 'reject') ? 'Say why the lot is rejected.' : 'Say why you go against the recommendation.';
    fail('reason', message, 'reason_required');
  }
  return { seasonId: coop.seasonId, householdName: name, recommendation: rec.decision, status: decided.status, reason: decided.reason ?? null };
}

/** The row's columns as written, in both ways of writing it. */
function lotRow(ctx: DeliveryContext, plan: LotPlan, input: DeliveryInput, now: Date) {
  return {
    cooperativeId: ctx.cooperativeId,
    seasonId: plan.seasonId,
    householdId: input.householdId,
    receivedAt: now,
    collectedOn: input.collectedOn,
    volumeL: roundL(input.volumeL),
    brix: roundBrix(input.brix),
    sapTempC: input.sapTempC,
    clarity: input.clarity,
    contamination: input.contamination,
    sugarMaplePct: input.mix?.sugarMaple ?? null,
    redMaplePct: input.mix?.redMaple ?? null,
    otherPct: input.mix?.other ?? null,
    recommendation: plan.recommendation,
    status: plan.status,
    reason: plan.reason,
    photoKey: input.photoKey ?? null,
    note: input.note?.trim() || null,
    loggedBy: actorUserId(ctx),
    idempotencyKey: input.idempotencyKey,
  };
}

type NewLot = ReturnType<typeof lotRow> & { id: string };

/** The answer to a new lot: nothing boiled from it yet, no corrections. */
function newLotDto(ctx: DeliveryContext, row: NewLot, householdName: string, timeZone: string, mix: DeliveryInput['mix']): DeliveryDto {
  return {
    id: row.id,
    seasonId: row.seasonId,
    householdId: row.householdId,
    householdName,
    receivedAt: toZonedIso(row.receivedAt, timeZone),
    collectedOn: row.collectedOn,
    volumeL: row.volumeL,
    brix: row.brix,
    sugarKg: sugarKg(row.volumeL, row.brix),
    sapTempC: row.sapTempC,
    clarity: row.clarity,
    contamination: row.contamination,
    mix: mix ?? null,
    recommendation: row.recommendation,
    status: row.status,
    reason: row.reason,
    photoKey: row.photoKey,
    note: row.note,
    loggedBy: row.loggedBy,
    loggedByName: ctx.actor.kind === 'person' ? ctx.actor.name : null,
    litresBoiled: 0,
    revisions: 0,
  };
}

/**
 * An accepted lot and its change mark in one statement (so one round trip and one commit). It
 * writes nothing, and answers null, when the season is no longer open or the key was taken since
 * the lot was checked; the caller then goes the long way, which says why.
 */
async function insertAcceptedLot(ctx: DeliveryContext, coop: NewLotRow, plan: LotPlan, input: DeliveryInput, now: Date): Promise<DeliveryDto | null> {
  const row = lotRow(ctx, plan, input, now);
  const [lot] = await db().sequelize.query<{ id: string }>(
    `WITH lot AS (
       INSERT INTO sap_deliveries (cooperative_id, season_id, household_id, received_at, collected_on, volume_l, brix, sap_temp_c,
                                   clarity, contamination, sugar_maple_pct, red_maple_pct, other_pct, recommendation, status, reason,
                                   photo_key, note, logged_by, idempotency_key)
       SELECT :cooperativeId, s.id, :householdId, :receivedAt, :collectedOn, :volumeL, :brix, :sapTempC,
              :clarity, :contamination, :sugarMaplePct, :redMaplePct, :otherPct, :recommendation, :status, :reason,
              :photoKey, :note, :loggedBy, :idempotencyKey
         FROM seasons s WHERE s.id = :seasonId AND s.cooperative_id = :cooperativeId AND s.status = 'open'
       ON CONFLICT ON CONSTRAINT sap_deliveries_idempotency DO NOTHING
       RETURNING id, cooperative_id),
     marked AS (${changeMarkOf('lot')})
     SELECT id FROM lot`,
    { replacements: row, type: QueryTypes.SELECT },
  );
  if (!lot) return null;
  announceChange({ cooperativeId: ctx.cooperativeId, event: { type: 'delivery.accepted', deliveryId: lot.id, householdId: row.householdId } });
  return newLotDto(ctx, { ...row, id: lot.id }, plan.householdName, coop.timeZone, input.mix);
}

/** The new lot in the caller's transaction, or the lot an earlier request with the same idempotency key logged. */
async function insertLot(ctx: TxCtx, input: DeliveryInput, now: Date, photoChecked: boolean): Promise<DeliveryDto | { existingId: string }> {
  const { transaction, cooperativeId } = ctx;
  const coop = await newLotContext(cooperativeId, input.householdId, input.idempotencyKey, transaction);
  // A repeated request answers the first lot, even after the season closed or the form changed.
  if (coop.existingId) return { existingId: coop.existingId };
  const plan = await planLot(cooperativeId, coop, input, now, photoChecked);
  const row = await db().SapDelivery.create(lotRow(ctx, plan, input, now), { transaction });
  await recordChange(ctx, { type: row.status === 'accepted' ? 'delivery.accepted' : 'delivery.rejected', deliveryId: row.id, householdId: row.householdId });
  if (row.status === 'rejected') {
    await queueRejectionMail({ ...lotForMail(row), reason: row.reason! }, coop satisfies MailCoop, transaction);
  }
  return newLotDto(ctx, row, plan.householdName, coop.timeZone, input.mix);
}

function lotForMail(row: { id: string; householdId: string; receivedAt: Date; collectedOn: string; volumeL: number; brix: number; sapTempC: number }) {
  return { id: row.id, householdId: row.householdId, receivedAt: row.receivedAt, collectedOn: row.collectedOn, volumeL: row.volumeL, brix: row.brix, sapTempC: row.sapTempC };
}

/** The lot's fields as the API names them, for a revision's before and after. */
type Snapshot = {
  householdId: string;
  volumeL: number;
  brix: number;
  sapTempC: number;
  collectedOn: string;
  clarity: string;
  contamination: string;
  mix: { sugarMaple: number; redMaple: number; other: number } | null;
  recommendation: string;
  status: string;
  reason: string | null;
  photoKey: string | null;
  note: string | null;
};

/**
 * `PATCH /api/deliveries/:id`: a correction with its reason. Writes exactly one revision with
 * the changed fields before and after, in the same transaction as the change; a new volume or
 * °Brix changes the lot's sugar everywhere, since sugar is always computed from them.
 */
export async function correctDelivery(ctx: DeliveryContext, id: string, patch: DeliveryPatch): Promise<DeliveryDetailDto> {
  authorize(ctx.actor, 'delivery.update', undefined, 'Only a sugarmaker or a coordinator can correct a drop-off.');
  if (!UUID.test(id)) throw lotNotFound();
  await withTransaction(ctx, (tx) => applyCorrection(tx, id, patch));
  return getDelivery({ ...ctx, transaction: undefined }, id);
}

async function applyCorrection(ctx: TxCtx, id: string, patch: DeliveryPatch) {
  const { transaction, cooperativeId } = ctx;
  const { SapDelivery, DeliveryRevision } = db();
  const lot = await SapDelivery.findOne({ where: { id, cooperativeId }, transaction, lock: transaction.LOCK.UPDATE });
  if (!lot) throw lotNotFound();
  const coop = await coopAndOpenSeason(cooperativeId, transaction);

  const before: Snapshot = snapshot(lot);
  const next: Snapshot = { ...before };
  if (patch.householdId !== undefined && patch.householdId !== lot.householdId) {
    if (!(await householdName(cooperativeId, patch.householdId, transaction))) fail('householdId', 'Choose a household of this cooperative.', 'unknown_household');
    next.householdId = patch.householdId;
  }
  if (patch.volumeL !== undefined) next.volumeL = roundL(patch.volumeL);
  if (patch.brix !== undefined) next.brix = roundBrix(patch.brix);
  if (patch.sapTempC !== undefined) next.sapTempC = patch.sapTempC;
  if (patch.collectedOn !== undefined) {
    checkCollectedOn(patch.collectedOn, localDay(lot.receivedAt, coop.timeZone));
    next.collectedOn = patch.collectedOn;
  }
  if (patch.clarity !== undefined) next.clarity = patch.clarity;
  if (patch.contamination !== undefined) next.contamination = patch.contamination;
  if (patch.mix !== undefined) next.mix = patch.mix;
  if (patch.note !== undefined) next.note = patch.note?.trim() || null;
  if (patch.photoKey !== undefined) {
    if (patch.photoKey !== lot.photoKey) await checkPhotoKey(cooperativeId, patch.photoKey);
    next.photoKey = patch.photoKey ?? null;
  }

  const rec = recommend(
    {
      clarity: next.clarity as DeliveryInput['clarity'],
      contamination: next.contamination as DeliveryInput['contamination'],
      sapTempC: next.sapTempC,
      collectedAt: collectionStart(next.collectedOn, coop.timeZone),
      receivedAt: lot.receivedAt,
    },
    coop,
  );
  next.recommendation = rec.decision;
  next.status = patch.status ?? before.status;
  let reason = patch.statusReason !== undefined ? patch.statusReason?.trim() || null : before.reason;
  if (next.status === 'accepted' && before.status === 'rejected' && patch.statusReason === undefined) reason = null;
  if (!reason && (next.status === 'rejected' || rec.decision === 'reject')) {
    reason = next.status === 'rejected' && rec.decision === 'reject' && rec.text ? rec.text : patch.reason.trim();
  }
  next.reason = reason;

  const changed = (Object.keys(next) as (keyof Snapshot)[]).filter((k) => JSON.stringify(next[k]) !== JSON.stringify(before[k]));
  if (!changed.length) throw invalid('Nothing to correct: every field is as it was.', undefined, 'nothing_changed');

  await lot.update(
    {
      householdId: next.householdId,
      volumeL: next.volumeL,
      brix: next.brix,
      sapTempC: next.sapTempC,
      collectedOn: next.collectedOn,
      clarity: next.clarity as DeliveryInput['clarity'],
      contamination: next.contamination as DeliveryInput['contamination'],
      sugarMaplePct: next.mix?.sugarMaple ?? null,
      redMaplePct: next.mix?.redMaple ?? null,
      otherPct: next.mix?.other ?? null,
      recommendation: rec.decision,
      status: next.status as 'accepted' | 'rejected',
      reason: next.reason,
      photoKey: next.photoKey,
      note: next.note,
    },
    { transaction },
  );
  const revision = await DeliveryRevision.create(
    {
      cooperativeId,
      deliveryId: lot.id,
      changedBy: actorUserId(ctx),
      reason: patch.reason.trim(),
      before: Object.fromEntries(changed.map((k) => [k, before[k]])),
      after: Object.fromEntries(changed.map((k) => [k, next[k]])),
    },
    { transaction },
  );
  await recordChange(ctx, { type: 'delivery.corrected', deliveryId: lot.id, householdId: next.householdId, revisionId: revision.id });
  if (next.status === 'rejected' && (before.status !== 'rejected' || before.householdId !== next.householdId)) {
    await queueRejectionMail({ ...lotForMail(lot), reason: next.reason! }, coop satisfies MailCoop, transaction);
  }
}

function snapshot(lot: InstanceType<ReturnType<typeof db>['SapDelivery']>): Snapshot {
  return {
    householdId: lot.householdId,
    volumeL: lot.volumeL,
    brix: lot.brix,
    sapTempC: lot.sapTempC,
    collectedOn: lot.collectedOn,
    clarity: lot.clarity,
    contamination: lot.contamination,
    mix: lot.sugarMaplePct === null ? null : { sugarMaple: lot.sugarMaplePct, redMaple: lot.redMaplePct!, other: lot.otherPct! },
    recommendation: lot.recommendation,
    status: lot.status,
    reason: lot.reason,
    photoKey: lot.photoKey,
    note: lot.note,
  };
}

/** Households of the co-op (id and name), for the form's household picker. */
export async function householdChoices(cooperativeId: string): Promise<{ id: string; name: string }[]> {
  return db().sequelize.query<{ id: string; name: string }>('SELECT id, name FROM households WHERE cooperative_id = :cooperativeId ORDER BY name', {
    replacements: { cooperativeId },
    type: QueryTypes.SELECT,
  });
}
