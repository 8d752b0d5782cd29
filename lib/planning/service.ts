import 'server-only';
import { Op, QueryTypes } from 'sequelize';
import { db } from '@/db/models';
import type { Ctx } from '@/lib/server/context';
import { planBoiling, type WaitingLot } from '@/lib/planning/rules';
import { collectionStart } from '@/lib/deliveries/rules';
import { spoilageDeadline } from '@/lib/sugar';
import type { PlanningDto } from './types';
export type { PlanningDto };

/**
 * Accepted sap not yet boiled: the litres of every accepted lot of the open season not yet taken
 * into a run (rejected lots never count), each with its spoilage deadline from the co-op's
 * shelf-life settings.
 */
export async function waitingLots(cooperativeId: string): Promise<WaitingLot[]> {
  const rows = await db().sequelize.query<{
    volumeL: number;
    brix: number;
    collectedOn: string;
    sapTempC: number;
    timeZone: string;
    shelfDays: number;
    warmAboveC: number;
    warmShelfDays: number;
  }>(
    `SELECT d.volume_l - d.litres_boiled AS "volumeL", d.brix::float8 AS brix, d.collected_on AS "collectedOn", d.sap_temp_c AS "sapTempC",
            c.time_zone AS "timeZone", c.shelf_days AS "shelfDays", c.warm_above_c AS "warmAboveC", c.warm_shelf_days AS "warmShelfDays"
       FROM sap_deliveries d
       JOIN seasons s ON s.id = d.season_id AND s.status = 'open'
       JOIN cooperatives c ON c.id = d.cooperative_id
      WHERE d.cooperative_id = :cooperativeId AND d.status = 'accepted' AND d.litres_boiled < d.volume_l`,
    { replacements: { cooperativeId }, type: QueryTypes.SELECT },
  );
  return rows
    .filter((r) => r.brix > 0)
    .map((r) => ({
      litres: r.volumeL,
      brix: r.brix,
      deadline: spoilageDeadline(collectionStart(r.collectedOn, r.timeZone), {
        sapTempC: r.sapTempC,
        shelfDays: r.shelfDays,
        warmAboveC: r.warmAboveC,
        warmShelfDays: Math.min(r.warmShelfDays, r.shelfDays),
      }),
    }));
}

/** The planning strip of the Boil calendar for a co-op's first evaporator. */
export async function getPlanning(ctx: Ctx, { now = new Date() }: { now?: Date } = {}): Promise<PlanningDto> {
  const { Evaporator, BoilSlot, Cooperative } = db();
  const { cooperativeId, transaction } = ctx;
  const [coop, evaporator] = await Promise.all([
    Cooperative.findByPk(cooperativeId, { transaction }),
    Evaporator.findOne({ where: { cooperativeId }, order: [['name', 'ASC']], transaction }),
  ]);
  const lots = await waitingLots(cooperativeId);
  const slots = evaporator
    ? await BoilSlot.findAll({
        where: { cooperativeId, evaporatorId: evaporator.id, status: 'booked', endsAt: { [Op.gt]: now } },
        attributes: ['startsAt', 'endsAt'],
        transaction,
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
