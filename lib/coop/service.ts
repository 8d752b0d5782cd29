import 'server-only';
import { db } from '@/db/models';
import type { Ctx } from '@/lib/server/context';

/** Reads of the co-op's own records need only its id (a display, a worker or a person may ask). */
type CoopScope = Pick<Ctx, 'cooperativeId' | 'transaction'>;
import { notFound } from '@/lib/server/errors';
import type { SeasonDto, EvaporatorDto } from './types';
export type { SeasonDto, EvaporatorDto };

export async function listSeasons(ctx: CoopScope): Promise<SeasonDto[]> {
  const { Season } = db();
  const rows = await Season.findAll({ where: { cooperativeId: ctx.cooperativeId }, order: [['startsOn', 'DESC']], transaction: ctx.transaction });
  return rows.map((s) => ({
    id: s.id,
    label: s.label,
    startsOn: s.startsOn,
    endsOn: s.endsOn,
    status: s.status,
    fuelPriceCents: s.fuelPriceCents,
  }));
}

export async function listEvaporators(ctx: CoopScope): Promise<EvaporatorDto[]> {
  const { Evaporator } = db();
  const rows = await Evaporator.findAll({ where: { cooperativeId: ctx.cooperativeId }, order: [['name', 'ASC']], transaction: ctx.transaction });
  return rows.map((e) => ({ id: e.id, name: e.name, evaporationLph: e.evaporationLph, fuelKind: e.fuelKind }));
}

/** The acting person's cooperative: the one loader for it. */
export async function getCooperative(ctx: CoopScope) {
  const { Cooperative } = db();
  const coop = await Cooperative.findByPk(ctx.cooperativeId, { transaction: ctx.transaction });
  if (!coop) throw notFound('Your cooperative');
  return coop;
}

/** Household ids and names only: what a sugarmaker needs to book for a household. */
export async function listHouseholdNames(ctx: CoopScope) {
  const { Household } = db();
  const rows = await Household.findAll({ where: { cooperativeId: ctx.cooperativeId }, attributes: ['id', 'name'], order: [['name', 'ASC']], transaction: ctx.transaction });
  return rows.map((h) => ({ id: h.id, name: h.name }));
}
