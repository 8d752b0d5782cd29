import 'server-only';
import { Op } from 'sequelize';
import { db } from '@/db/models';
import { planBoiling, type BoilPlan, type WaitingLot } from '@/lib/planning';

export interface PlanningDto extends BoilPlan {
  evaporatorId: string | null;
  evaporationLph: number | null;
}

/**
 * Accepted sap not yet boiled. The co-op records no drop-offs yet, so nothing waits; the
 * drop-off desk feeds this list.
 */
async function waitingLots(_cooperativeId: string): Promise<WaitingLot[]> {
  return [];
}

/** The planning strip of the Boil calendar for a co-op's first evaporator. */
export async function getPlanning({ cooperativeId, now = new Date() }: { cooperativeId: string; now?: Date }): Promise<PlanningDto> {
  const { Evaporator, BoilSlot, Cooperative } = db();
  const [coop, evaporator] = await Promise.all([
    Cooperative.findByPk(cooperativeId),
    Evaporator.findOne({ where: { cooperativeId }, order: [['name', 'ASC']] }),
  ]);
  const lots = await waitingLots(cooperativeId);
  const slots = evaporator
    ? await BoilSlot.findAll({
        where: { cooperativeId, evaporatorId: evaporator.id, status: 'booked', endsAt: { [Op.gt]: now } },
        attributes: ['startsAt', 'endsAt'],
      })
    : [];
  const plan = planBoiling({
    lots,
    slots: slots.map((s) => ({ startsAt: s.startsAt, endsAt: s.endsAt })),
    evaporationLph: evaporator?.evaporationLph ?? 1,
    syrupBrix: coop?.syrupBrix ?? 66.9,
    now,
  });
  return { ...plan, evaporatorId: evaporator?.id ?? null, evaporationLph: evaporator?.evaporationLph ?? null };
}
