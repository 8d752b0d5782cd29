import 'server-only';
import { db } from '@/db/models';

export interface SeasonDto {
  id: string;
  label: string;
  startsOn: string;
  endsOn: string;
  status: string;
  fuelPriceCents: number;
}
export interface EvaporatorDto {
  id: string;
  name: string;
  evaporationLph: number;
  fuelKind: string;
}

export async function listSeasons({ cooperativeId }: { cooperativeId: string }): Promise<SeasonDto[]> {
  const { Season } = db();
  const rows = await Season.findAll({ where: { cooperativeId }, order: [['startsOn', 'DESC']] });
  return rows.map((s) => ({
    id: s.id,
    label: s.label,
    startsOn: s.startsOn,
    endsOn: s.endsOn,
    status: s.status,
    fuelPriceCents: s.fuelPriceCents,
  }));
}

export async function listEvaporators({ cooperativeId }: { cooperativeId: string }): Promise<EvaporatorDto[]> {
  const { Evaporator } = db();
  const rows = await Evaporator.findAll({ where: { cooperativeId }, order: [['name', 'ASC']] });
  return rows.map((e) => ({ id: e.id, name: e.name, evaporationLph: e.evaporationLph, fuelKind: e.fuelKind }));
}

export async function getCooperative({ cooperativeId }: { cooperativeId: string }) {
  const { Cooperative } = db();
  const coop = await Cooperative.findByPk(cooperativeId);
  if (!coop) throw new Error('The signed-in cooperative no longer exists.');
  return coop;
}

/** Household ids and names only: what a sugarmaker needs to book for a household. */
export async function listHouseholdNames({ cooperativeId }: { cooperativeId: string }) {
  const { Household } = db();
  const rows = await Household.findAll({ where: { cooperativeId }, attributes: ['id', 'name'], order: [['name', 'ASC']] });
  return rows.map((h) => ({ id: h.id, name: h.name }));
}
