import { DateTime } from 'luxon';
import { QueryTypes, type Transaction } from 'sequelize';
import { db } from '@/db/models';
import { insertSettlements, seasonOf } from '@/lib/ledger/ledger-data';

interface SeedLedgerArgs {
  transaction: Transaction;
  cooperativeId: string;
  zone: string;
  openSeason: { id: string };
  lastSeason: { id: string; endsOn: string };
  households: { id: string; name: string }[];
  coordinatorId: string;
}

/**
 * Demo ledger: season fees (most households $25.00, two none), and last year's season settled
 * from its runs' allocations (computed by the runs seed, never typed in): statements sent a few
 * days after it ended, every household paid by card or cheque except the Brennans, who still
 * owe. Invented data.
 */
export async function seedLedger(a: SeedLedgerArgs) {
  const { sequelize } = db();
  const { transaction, cooperativeId } = a;
  const q = (sql: string, replacements: Record<string, unknown>) => sequelize.query(sql, { replacements, transaction });

  for (const season of [a.openSeason, a.lastSeason]) {
    for (const h of a.households) {
      const fee = h.name === 'Szabo' || h.name === 'Ferreira' ? 0 : 2500;
      await q(`INSERT INTO season_fees (season_id, cooperative_id, household_id, fee_cents) VALUES (:s, :c, :h, :fee)`, { s: season.id, c: cooperativeId, h: h.id, fee });
    }
  }

  const settledAt = DateTime.fromISO(a.lastSeason.endsOn, { zone: a.zone }).plus({ days: 3 }).set({ hour: 10 });
  const season = await seasonOf({ cooperativeId, transaction }, a.lastSeason.id);
  await insertSettlements({ cooperativeId, transaction }, season, a.coordinatorId);
  await q(`UPDATE settlements SET settled_at = :at, queued_at = :at, sent_at = :sent WHERE season_id = :s`, {
    at: settledAt.toJSDate(),
    sent: settledAt.plus({ minutes: 1 }).toJSDate(),
    s: a.lastSeason.id,
  });
  const rows = await sequelize.query<{ id: string; householdId: string; dueCents: number; name: string }>(
    `SELECT st.id, st.household_id AS "householdId", st.due_cents AS "dueCents", h.name
       FROM settlements st JOIN households h ON h.id = st.household_id WHERE st.season_id = :s ORDER BY h.name`,
    { replacements: { s: a.lastSeason.id }, type: QueryTypes.SELECT, transaction },
  );
  let n = 0;
  for (const r of rows) {
    if (r.name === 'Brennan' || r.dueCents === 0) continue;
    n++;
    const card = n % 2 === 1;
    await q(
      `INSERT INTO payments (cooperative_id, settlement_id, household_id, amount_cents, method, reference, checkout_session_id, paid_at, recorded_by_id)
       VALUES (:c, :st, :h, :amount, :method, :reference, :session, :paidAt, :by)`,
      {
        c: cooperativeId,
        st: r.id,
        h: r.householdId,
        amount: r.dueCents,
        method: card ? 'card' : 'cheque',
        reference: card ? null : `Cheque ${1040 + n}`,
        session: card ? `cs_demo_${r.id.slice(0, 8)}` : null,
        paidAt: settledAt.plus({ days: 2 + n * 3 }).toJSDate(),
        by: card ? null : a.coordinatorId,
      },
    );
  }
}
