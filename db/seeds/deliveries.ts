import { DateTime } from 'luxon';
import type { CreationAttributes, Transaction } from 'sequelize';
import { db } from '@/db/models';
import type { SapContamination, SapDelivery as SapDeliveryModel } from '@/db/models/sap-delivery';

/** Households whose sugarbush is mostly sugar maple (sweeter sap); the others are mostly red maple. */
const SUGAR_MAPLE_HEAVY = new Set(['Okafor', 'Tremblay-Haddad', 'Brennan', 'Ferreira']);

/** A small seeded generator, so the demo data is the same on every load. */
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

interface SeedDeliveriesArgs {
  transaction: Transaction;
  cooperativeId: string;
  zone: string;
  now: Date;
  openSeason: { id: string; startsOn: string };
  lastSeason: { id: string; startsOn: string; endsOn: string };
  households: { id: string; name: string }[];
  staffIds: string[];
}

/** Rejections the demo shows, by (season, household index, lot index within the household). */
const REJECTIONS: { season: 'open' | 'last'; household: number; lot: number; clarity: 'clear' | 'cloudy'; contamination: SapContamination; reason: string }[] = [
  { season: 'open', household: 2, lot: 3, clarity: 'cloudy', contamination: 'none', reason: 'Rejected: cloudy sap. It had sat in a warm shed over the weekend.' },
  { season: 'open', household: 5, lot: 6, clarity: 'clear', contamination: 'insects', reason: 'Rejected: insects in the sap (moths in an uncovered bucket).' },
  { season: 'open', household: 1, lot: 8, clarity: 'cloudy', contamination: 'off-odour', reason: 'Rejected: cloudy sap with a sour smell.' },
  { season: 'last', household: 4, lot: 5, clarity: 'clear', contamination: 'debris', reason: 'Rejected: bark and leaf debris in the sap.' },
  { season: 'last', household: 6, lot: 10, clarity: 'cloudy', contamination: 'none', reason: 'Rejected: cloudy sap at the end of the run.' },
];

/**
 * Demo sap drop-offs: every household brings 100–400 L every one to three days across the open season
 * so far and across last year's season; sugar-maple-heavy sugarbushes give 2.2–3.2 °Bx sap,
 * red-maple-heavy ones 1.4–2.3 °Bx. A few lots are rejected with their reason, one is accepted
 * against the recommendation with its reason, and one is corrected with a revision. Invented data.
 */
export async function seedDeliveries(a: SeedDeliveriesArgs) {
  const { SapDelivery, DeliveryRevision } = db();
  const rand = mulberry32(20261202);
  const nowLocal = DateTime.fromJSDate(a.now, { zone: a.zone });
  const rows: CreationAttributes<SapDeliveryModel>[] = [];
  let n = 0;

  const seasons = [
    { key: 'last' as const, id: a.lastSeason.id, first: DateTime.fromISO(a.lastSeason.startsOn, { zone: a.zone }), last: DateTime.fromISO(a.lastSeason.endsOn, { zone: a.zone }).minus({ days: 8 }) },
    { key: 'open' as const, id: a.openSeason.id, first: DateTime.fromISO(a.openSeason.startsOn, { zone: a.zone }), last: nowLocal.startOf('day') },
  ];

  for (const season of seasons) {
    a.households.forEach((h, hi) => {
      const sweet = SUGAR_MAPLE_HEAVY.has(h.name);
      let day = season.first.plus({ days: 1 + (hi % 2) });
      let lotIndex = 0;
      while (day <= season.last) {
        const receivedAt = day.set({ hour: 7 + Math.floor(rand() * 10), minute: Math.floor(rand() * 60) });
        if (receivedAt.toJSDate() >= a.now) break;
        const collectedOn = (rand() < 0.6 ? receivedAt : receivedAt.minus({ days: 1 })).toISODate()!;
        const volumeL = Math.round((100 + rand() * 300) * 10) / 10;
        const brix = Math.round((sweet ? 2.2 + rand() * 1.0 : 1.4 + rand() * 0.9) * 10) / 10;
        const warm = rand() < 0.06;
        const sapTempC = Math.round((warm ? 8 + rand() * 3 : 1 + rand() * 4.5) * 10) / 10;
        const rejection = REJECTIONS.find((r) => r.season === season.key && r.household === hi && r.lot === lotIndex);
        const against = season.key === 'open' && hi === 3 && lotIndex === 4;
        rows.push({
          cooperativeId: a.cooperativeId,
          seasonId: season.id,
          householdId: h.id,
          receivedAt: receivedAt.toJSDate(),
          collectedOn,
          volumeL,
          brix,
          sapTempC,
          clarity: rejection?.clarity ?? 'clear',
          contamination: rejection?.contamination ?? (against ? 'debris' : 'none'),
          sugarMaplePct: sweet ? 80 : 20,
          redMaplePct: sweet ? 15 : 75,
          otherPct: 5,
          recommendation: rejection || against ? 'reject' : 'accept',
          status: rejection ? 'rejected' : 'accepted',
          reason: rejection?.reason ?? (against ? 'A few twigs, strained out at the tank through a clean filter; the sap itself is clear and cold.' : null),
          photoKey: null,
          note: null,
          loggedBy: a.staffIds[n % a.staffIds.length],
          idempotencyKey: `demo-lot-${String(++n).padStart(5, '0')}`,
        });
        lotIndex++;
        const gap = rand();
        day = day.plus({ days: gap < 0.4 ? 1 : gap < 0.8 ? 2 : 3 });
      }
    });
  }
  const created = await SapDelivery.bulkCreate(rows, { transaction: a.transaction, returning: true });

  // One correction: the meter was read again on an open-season lot of the first household.
  const lot = created.find((l) => l.seasonId === a.openSeason.id && l.householdId === a.households[0].id && l.status === 'accepted');
  if (lot) {
    const before = { volumeL: lot.volumeL };
    const after = { volumeL: Math.round((lot.volumeL + 9) * 10) / 10 };
    await lot.update({ volumeL: after.volumeL }, { transaction: a.transaction });
    await DeliveryRevision.create(
      {
        cooperativeId: a.cooperativeId,
        deliveryId: lot.id,
        changedBy: a.staffIds[0],
        changedAt: DateTime.fromJSDate(lot.receivedAt).plus({ hours: 2 }).toJSDate(),
        reason: 'Meter read again after the tank settled: 9 L more than first written.',
        before,
        after,
      },
      { transaction: a.transaction },
    );
  }
  return created.length;
}
