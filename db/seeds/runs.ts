import { DateTime } from 'luxon';
import { QueryTypes, type Transaction } from 'sequelize';
import { db } from '@/db/models';
import { allocateRun } from '@/lib/ledger/allocate-run';
import { densityFromBrix, drawOffTargetC, gradeClass, sugarKg, waterToEvaporateL, type GradeClass } from '@/lib/sugar';

interface SeedRunsArgs {
  transaction: Transaction;
  cooperativeId: string;
  zone: string;
  now: Date;
  elevationM: number;
  evaporator: { id: string; evaporationLph: number };
  openSeason: { id: string; startsOn: string; endsOn: string; fuelPriceCents: number };
  lastSeason: { id: string; startsOn: string; endsOn: string; fuelPriceCents: number };
  staffIds: string[];
}

/** The same pseudo-random numbers on every load. */
function mulberry32(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

interface Lot {
  id: string;
  receivedAt: Date;
  left: number;
  brix: number;
}

/** Hours of boiling a run is given at most, so a lot can be split over two runs. */
const MAX_RUN_HOURS = 8;
/** Least syrup a demo run is fired for, litres (about a gallon; common practice, no source). */
const MIN_RUN_SYRUP_L = 4;
/** Least syrup in one demo draw-off, litres (invented for the demo). */
const MIN_DRAW_L = 2;
/** Cords of dry hardwood per litre of syrup: about 1 cord per 25 US gal of syrup (from memory; trade rule of thumb). */
const CORDS_PER_SYRUP_L = 1 / (25 * 3.785411784);

/**
 * Demo boil runs: about one a day through last year's season (every accepted lot boiled) and
 * through the open season until two days ago, each taking the oldest waiting sap first; lots that
 * arrived since the last run stay in the queue. Each run's syrup is 93–97 % of what its sugar
 * makes at the draw-off °Brix, in two to four draw-offs of at least 2 L whose colour darkens as
 * the season goes on (a run that would make under 4 L is not fired: its sap waits for the next);
 * fuel is costed at the season's price. Invented data.
 */
export async function seedRuns(a: SeedRunsArgs) {
  const m = db();
  const rand = mulberry32(11);
  const { transaction } = a;
  const today = DateTime.fromJSDate(a.now, { zone: a.zone }).startOf('day');

  const seasons = [
    {
      season: a.lastSeason,
      first: DateTime.fromISO(a.lastSeason.startsOn, { zone: a.zone }).plus({ days: 2 }),
      last: DateTime.fromISO(a.lastSeason.endsOn, { zone: a.zone }).minus({ days: 5 }),
      span: DateTime.fromISO(a.lastSeason.endsOn, { zone: a.zone }).diff(DateTime.fromISO(a.lastSeason.startsOn, { zone: a.zone }), 'days').days,
      finishAll: true,
    },
    {
      season: a.openSeason,
      first: DateTime.fromISO(a.openSeason.startsOn, { zone: a.zone }).plus({ days: 2 }),
      // The last two days' sap still waits in the queue.
      last: today.minus({ days: 2 }),
      span: DateTime.fromISO(a.openSeason.endsOn, { zone: a.zone }).diff(DateTime.fromISO(a.openSeason.startsOn, { zone: a.zone }), 'days').days,
      finishAll: false,
    },
  ];

  let runs = 0;
  for (const s of seasons) {
    const lots: Lot[] = (
      await m.sequelize.query<{ id: string; received_at: Date; left: number; brix: number }>(
        `SELECT id, received_at, volume_l - litres_boiled AS left, brix::float8 AS brix FROM sap_deliveries
          WHERE season_id = :season AND status = 'accepted' ORDER BY received_at, id`,
        { replacements: { season: s.season.id }, type: QueryTypes.SELECT, transaction },
      )
    ).map((l) => ({ id: l.id, receivedAt: new Date(l.received_at), left: l.left, brix: l.brix }));
    const slots = await m.BoilSlot.findAll({ where: { seasonId: s.season.id, evaporatorId: a.evaporator.id }, transaction, raw: true });
    const seasonStart = DateTime.fromISO(s.season.startsOn, { zone: a.zone });
    let number = 0;

    for (let day = s.first; day <= s.last; day = day.plus({ days: 1 })) {
      const slot = slots.find((x) => x.status !== 'cancelled' && DateTime.fromJSDate(x.startsAt, { zone: a.zone }).hasSame(day, 'day'));
      const start = slot ? DateTime.fromJSDate(slot.startsAt, { zone: a.zone }) : day.set({ hour: 9 });
      const finalRun = s.finishAll && day.hasSame(s.last, 'day');
      const ready = lots.filter((l) => l.left > 1e-9 && l.receivedAt < start.toJSDate());
      if (!ready.length) continue;
      // Oldest sap first, up to the run's hours (the last run of a finished season boils everything).
      const takes: { lot: Lot; litres: number }[] = [];
      let hours = 0;
      for (const lot of ready) {
        const perLitre = waterToEvaporateL(1, lot.brix) / a.evaporator.evaporationLph;
        const room = finalRun ? Infinity : (MAX_RUN_HOURS - hours) / perLitre;
        if (room < 5) break;
        const litres = Math.min(lot.left, Math.floor(room * 10) / 10);
        takes.push({ lot, litres: litres === lot.left ? lot.left : litres });
        hours += litres * perLitre;
      }
      if (!takes.length) continue;
      const finishedAt = start.plus({ minutes: Math.round((hours + 0.75) * 60) });
      if (finishedAt.toJSDate() > a.now) break;
      // Syrup: 93–97 % of the sugar taken in.
      const sugar = takes.reduce((sum, t) => sum + sugarKg(t.litres, t.lot.brix), 0) * (0.93 + rand() * 0.04);
      const syrupL = sugar / ((densityFromBrix(67) * 67) / 100);
      // Nobody fires the evaporator for a pot's worth: the sap waits for the next run (the last run
      // of a finished season boils whatever is left).
      if (!finalRun && syrupL < MIN_RUN_SYRUP_L) continue;
      number++;
      runs++;
      const year = s.season.startsOn.slice(0, 4);
      const run = await m.BoilRun.create(
        {
          cooperativeId: a.cooperativeId,
          seasonId: s.season.id,
          evaporatorId: a.evaporator.id,
          slotId: slot?.id ?? null,
          runNumber: number,
          lotCode: `${year}-${String(number).padStart(3, '0')}`,
          status: 'finished',
          startedAt: start.toJSDate(),
          finishedAt: finishedAt.toJSDate(),
          startedById: a.staffIds[number % a.staffIds.length],
          finishedById: a.staffIds[number % a.staffIds.length],
        },
        { transaction },
      );
      await m.RunInput.bulkCreate(
        takes.map((t, i) => ({
          cooperativeId: a.cooperativeId,
          runId: run.id,
          deliveryId: t.lot.id,
          litres: t.litres,
          takenAt: start.plus({ minutes: i * 20 }).toJSDate(),
          takenById: run.startedById,
        })),
        { transaction },
      );
      for (const t of takes) t.lot.left = t.litres === t.lot.left ? 0 : t.lot.left - t.litres;

      // Two to four draw-offs, each of at least MIN_DRAW_L.
      const draws = Math.min(2 + Math.floor(rand() * 3), Math.max(1, Math.floor(syrupL / MIN_DRAW_L)));
      const progress = day.diff(seasonStart, 'days').days / Math.max(1, s.span);
      for (let i = 0; i < draws; i++) {
        const brix = Math.round((66.9 + rand() * 0.8) * 10) / 10;
        // Litres floored to 0.01 L (syrup is owed by the hundredth), so the syrup never exceeds
        // what its sugar makes, and the flooring costs a 2 L draw-off at most 0.5 %.
        const litres = Math.floor(((sugar / draws) / ((densityFromBrix(brix) * brix) / 100)) * 100) / 100;
        const tc = Math.max(8, Math.min(95, Math.round((95 - progress * 110 + (rand() - 0.5) * 12) * 10) / 10));
        const klass: GradeClass = gradeClass(tc);
        await m.SyrupDraw.create(
          {
            cooperativeId: a.cooperativeId,
            runId: run.id,
            drawnAt: start.plus({ minutes: Math.round(((i + 1) / draws) * hours * 60) + 20 }).toJSDate(),
            litres,
            brix,
            transmittancePct: tc,
            gradeClass: klass,
            temperatureC: Math.round(drawOffTargetC({ elevationM: a.elevationM, finishBrix: brix }) * 10) / 10,
            recordedById: run.startedById,
          },
          { transaction },
        );
      }
      const cords = Math.max(0.1, Math.round(syrupL * CORDS_PER_SYRUP_L * 20) / 20);
      const loads = cords >= 0.3 ? [Math.round((cords / 2) * 100) / 100, Math.round((cords - Math.round((cords / 2) * 100) / 100) * 100) / 100] : [cords];
      await m.FuelUse.bulkCreate(
        loads.map((q, i) => ({
          cooperativeId: a.cooperativeId,
          runId: run.id,
          kind: 'wood' as const,
          quantity: q,
          unit: 'cord' as const,
          costCents: Math.round(q * s.season.fuelPriceCents),
          recordedAt: start.plus({ minutes: Math.round(((i + 1) / loads.length) * hours * 60) }).toJSDate(),
          recordedById: run.startedById,
        })),
        { transaction },
      );
      await allocateRun({ cooperativeId: a.cooperativeId, transaction }, run.id);
    }
  }
  return runs;
}
