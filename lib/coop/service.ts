import 'server-only';
import { QueryTypes } from 'sequelize';
import { db } from '@/db/models';
import type { Ctx } from '@/lib/server/context';

/** Reads of the co-op's own records need only its id (a display, a worker or a person may ask). */
type CoopScope = Pick<Ctx, 'cooperativeId' | 'transaction'>;
import { notFound } from '@/lib/server/errors';
import { keptJson, processCache } from '@/lib/server/versioned-cache';
import type { SeasonDto, EvaporatorDto } from './types';
export type { SeasonDto, EvaporatorDto };

// A co-op's seasons are a few hundred bytes of JSON.
const seasonLists = processCache<string>('season-lists', 2 * 2 ** 20, (json) => 2 * json.length);

/**
 * `GET /api/seasons` as JSON text, kept per co-op change version (closing and settling a season
 * bump it). `knownVersion` is the version read with the person in this request.
 */
export async function seasonsJson(ctx: CoopScope, { knownVersion }: { knownVersion?: string } = {}): Promise<string> {
  return keptJson(seasonLists, ctx.cooperativeId, { knownVersion, transaction: ctx.transaction }, () => listSeasons(ctx));
}

/** The co-op's seasons, newest first: one query of plain rows. */
export async function listSeasons(ctx: CoopScope): Promise<SeasonDto[]> {
  return db().sequelize.query<SeasonDto>(
    `SELECT id, label, starts_on AS "startsOn", ends_on AS "endsOn", status, fuel_price_cents AS "fuelPriceCents"
       FROM seasons WHERE cooperative_id = $cooperativeId ORDER BY starts_on DESC`,
    { bind: { cooperativeId: ctx.cooperativeId }, type: QueryTypes.SELECT, transaction: ctx.transaction },
  );
}

export async function listEvaporators(ctx: CoopScope): Promise<EvaporatorDto[]> {
  return db().sequelize.query<EvaporatorDto>(
    `SELECT id, name, evaporation_lph AS "evaporationLph", fuel_kind AS "fuelKind"
       FROM evaporators WHERE cooperative_id = $cooperativeId ORDER BY name`,
    { bind: { cooperativeId: ctx.cooperativeId }, type: QueryTypes.SELECT, transaction: ctx.transaction },
  );
}

/** The acting person's cooperative: the one loader for it. */
export async function getCooperative(ctx: CoopScope) {
  const { Cooperative } = db();
  const coop = await Cooperative.findByPk(ctx.cooperativeId, { transaction: ctx.transaction });
  if (!coop) throw notFound('Your cooperative');
  return coop;
}

/** Household ids and names only: what a sugarmaker needs to book for a household. */
export async function listHouseholdNames(ctx: CoopScope): Promise<{ id: string; name: string }[]> {
  return db().sequelize.query<{ id: string; name: string }>(
    'SELECT id, name FROM households WHERE cooperative_id = $cooperativeId ORDER BY name',
    { bind: { cooperativeId: ctx.cooperativeId }, type: QueryTypes.SELECT, transaction: ctx.transaction },
  );
}
