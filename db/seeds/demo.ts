import bcrypt from 'bcryptjs';
import { DateTime } from 'luxon';
import type { Transaction } from 'sequelize';
import { db } from '@/db/models';
import { seedDeliveries } from './deliveries';
import { seedRuns } from './runs';
import { seedLedger } from './ledger';
import { assertDisposable } from '@/db/guard';

export const DEMO_PASSWORD = 'syrup-season';
export const DEMO_TIME_ZONE = 'America/New_York';

/** The invented demo co-op's households and the member who signs in for each. */
export const DEMO_HOUSEHOLDS = [
  { name: 'Okafor', email: 'okafor@larkspur.example', person: 'Adaeze Okafor' },
  { name: 'Lindqvist', email: 'lindqvist@larkspur.example', person: 'Sune Lindqvist' },
  { name: 'Tremblay-Haddad', email: 'tremblay-haddad@larkspur.example', person: 'Josée Tremblay-Haddad' },
  { name: 'Nakamura', email: 'nakamura@larkspur.example', person: 'Hiroko Nakamura' },
  { name: 'Brennan', email: 'brennan@larkspur.example', person: 'Fintan Brennan' },
  { name: 'Szabo', email: 'szabo@larkspur.example', person: 'Réka Szabo' },
  { name: 'Ferreira', email: 'ferreira@larkspur.example', person: 'Inês Ferreira' },
] as const;

export const DEMO_STAFF = [
  { email: 'coordinator@larkspur.example', person: 'Wren Castellan', role: 'coordinator' as const },
  { email: 'sugarmaker@larkspur.example', person: 'Abel Marchetti', role: 'sugarmaker' as const },
  { email: 'sugarmaker2@larkspur.example', person: 'Juno Varga', role: 'sugarmaker' as const },
];

/** Every demo sign-in, for the start banner and the README. */
export const DEMO_SIGN_INS = [
  ...DEMO_STAFF.map((s) => ({ email: s.email, role: s.role })),
  ...DEMO_HOUSEHOLDS.map((h) => ({ email: h.email, role: 'member' as const })),
];

const TABLES = ['password_resets', 'rate_limits', 'payment_events', 'payments', 'settlements', 'allocation_revisions', 'allocations', 'season_fees', 'display_links', 'fuel_uses', 'syrup_draws', 'run_inputs', 'boil_runs', 'delivery_revisions', 'sap_deliveries', 'boil_slots', 'users', 'evaporators', 'seasons', 'households', 'cooperatives'];

/**
 * Removes every row of the domain tables (tests start each suite from the demo data). Refuses a
 * database whose name does not end in _test unless `force`.
 */
export async function truncateAll({ transaction, force = false }: { transaction?: Transaction; force?: boolean } = {}) {
  const { sequelize } = db();
  assertDisposable(sequelize, 'empty', { force });
  await sequelize.query(`TRUNCATE ${TABLES.join(', ')} RESTART IDENTITY CASCADE`, { transaction });
}

/**
 * Loads the demo co-op: an open season placed around `now` (it began 20 days before and ends
 * 25 days after) and last year's settled one, seven households and their people, the
 * evaporator, and booked slots. Invented data for the demo only.
 */
export async function seedDemo({ now = new Date() }: { now?: Date } = {}) {
  const m = db();
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  const today = DateTime.fromJSDate(now, { zone: DEMO_TIME_ZONE }).startOf('day');

  return m.sequelize.transaction(async (transaction) => {
    const coop = await m.Cooperative.create(
      {
        name: 'Larkspur Hollow Sugar Cooperative',
        timeZone: DEMO_TIME_ZONE,
        elevationM: 310,
        unitSystem: 'us',
        currency: 'USD',
      },
      { transaction },
    );
    const cooperativeId = coop.id;

    const evaporator = await m.Evaporator.create(
      { cooperativeId, name: 'Main evaporator', evaporationLph: 150, fuelKind: 'wood' },
      { transaction },
    );

    const start = today.minus({ days: 20 });
    const end = today.plus({ days: 25 });
    const open = await m.Season.create(
      {
        cooperativeId,
        label: `Season ${start.year}`,
        startsOn: start.toISODate()!,
        endsOn: end.toISODate()!,
        status: 'open',
        fuelPriceCents: 26000,
      },
      { transaction },
    );
    const last = await m.Season.create(
      {
        cooperativeId,
        label: `Season ${start.year - 1}`,
        startsOn: start.minus({ years: 1 }).toISODate()!,
        endsOn: end.minus({ years: 1 }).toISODate()!,
        status: 'settled',
        fuelPriceCents: 24500,
      },
      { transaction },
    );

    const households = [];
    for (const h of DEMO_HOUSEHOLDS) {
      const household = await m.Household.create({ cooperativeId, name: h.name }, { transaction });
      households.push(household);
      await m.User.create(
        { cooperativeId, householdId: household.id, name: h.person, email: h.email, passwordHash: hash, role: 'member' },
        { transaction },
      );
    }
    const staff = [];
    for (const s of DEMO_STAFF) {
      staff.push(
        await m.User.create(
          { cooperativeId, householdId: null, name: s.person, email: s.email, passwordHash: hash, role: s.role },
          { transaction },
        ),
      );
    }

    // Slots: a boil most days, in the morning or the afternoon, by turns of the households.
    const slots = [];
    for (let d = -12; d <= 9; d++) {
      if (d % 3 === 2) continue;
      const day = today.plus({ days: d });
      const morning = d % 2 === 0;
      const startsAt = day.set({ hour: morning ? 7 : 13 });
      const endsAt = startsAt.plus({ hours: morning ? 5 : 6 });
      const household = households[(d + 14) % households.length];
      const person = DEMO_HOUSEHOLDS[(d + 14) % households.length].person;
      slots.push({
        cooperativeId,
        seasonId: open.id,
        evaporatorId: evaporator.id,
        householdId: household.id,
        startsAt: startsAt.toJSDate(),
        endsAt: endsAt.toJSDate(),
        crew: [person],
        expectedSapL: 600 + ((d + 20) % 5) * 120,
        note: null,
        status: (endsAt < DateTime.fromJSDate(now) ? 'done' : 'booked') as 'done' | 'booked',
        bookedById: staff[1].id,
      });
    }
    await m.BoilSlot.bulkCreate(slots, { transaction });
    await seedDeliveries({ transaction, cooperativeId, zone: DEMO_TIME_ZONE, now, openSeason: open, lastSeason: last, households, staffIds: staff.filter((s) => s.role === 'sugarmaker').map((s) => s.id) });
    await seedRuns({ transaction, cooperativeId, zone: DEMO_TIME_ZONE, now, elevationM: coop.elevationM, evaporator, openSeason: open, lastSeason: last, staffIds: staff.filter((s) => s.role === 'sugarmaker').map((s) => s.id) });
    await seedLedger({ transaction, cooperativeId, zone: DEMO_TIME_ZONE, openSeason: open, lastSeason: last, households, coordinatorId: staff.find((s) => s.role === 'coordinator')!.id });

    return { cooperativeId, seasonId: open.id, evaporatorId: evaporator.id };
  });
}
