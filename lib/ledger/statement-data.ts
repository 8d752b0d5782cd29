// Server code (database), without the 'server-only' marker: the statement worker in server.ts
// loads statements under plain Node.
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { Statement } from './types';

interface StatementRow {
  id: string;
  seasonId: string;
  seasonLabel: string;
  householdId: string;
  householdName: string;
  cooperativeName: string;
  currency: string;
  unitSystem: 'metric' | 'us';
  sapL: number;
  meanBrix: number | null;
  sugarKg: number;
  share: number;
  golden: number;
  amber: number;
  dark: number;
  veryDark: number;
  syrupMl: number;
  fuelCents: number;
  feeCents: number;
  dueCents: number;
  settledAt: string;
  sentAt: string | null;
  payments: Statement['payments'];
}

const ISO = (col: string) => `to_char(${col} AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS"Z"')`;

/** One statement (a settlement row) with its payments, or null when not in this co-op. */
export async function loadStatement(sequelize: Sequelize, id: string, cooperativeId: string, transaction?: Transaction): Promise<Statement | null> {
  const [row] = await sequelize.query<StatementRow>(
    `SELECT st.id, st.season_id AS "seasonId", se.label AS "seasonLabel", st.household_id AS "householdId",
            h.name AS "householdName", c.name AS "cooperativeName", c.currency, c.unit_system AS "unitSystem",
            st.sap_l AS "sapL", st.mean_brix AS "meanBrix", st.sugar_kg AS "sugarKg", st.share,
            st.syrup_golden_ml AS golden, st.syrup_amber_ml AS amber, st.syrup_dark_ml AS dark,
            st.syrup_very_dark_ml AS "veryDark", st.syrup_ml AS "syrupMl", st.fuel_cents AS "fuelCents",
            st.fee_cents AS "feeCents", st.due_cents AS "dueCents",
            ${ISO('st.settled_at')} AS "settledAt", ${ISO('st.sent_at')} AS "sentAt",
            COALESCE((SELECT json_agg(json_build_object('id', p.id, 'amountCents', p.amount_cents, 'method', p.method,
                       'paidAt', ${ISO('p.paid_at')}, 'reference', p.reference) ORDER BY p.paid_at)
                        FROM payments p WHERE p.settlement_id = st.id), '[]'::json) AS payments
       FROM settlements st
       JOIN seasons se ON se.id = st.season_id
       JOIN households h ON h.id = st.household_id
       JOIN cooperatives c ON c.id = st.cooperative_id
      WHERE st.id = :id AND st.cooperative_id = :cooperativeId`,
    { replacements: { id, cooperativeId }, type: QueryTypes.SELECT, transaction },
  );
  if (!row) return null;
  const payments = row.payments;
  const paidCents = payments.reduce((s, p) => s + p.amountCents, 0);
  return {
    id: row.id,
    seasonId: row.seasonId,
    seasonLabel: row.seasonLabel,
    householdId: row.householdId,
    householdName: row.householdName,
    cooperativeName: row.cooperativeName,
    currency: row.currency,
    unitSystem: row.unitSystem,
    sapL: row.sapL,
    meanBrix: row.meanBrix,
    sugarKg: row.sugarKg,
    share: row.share,
    syrupMl: row.syrupMl,
    syrupByClassMl: { golden: row.golden, amber: row.amber, dark: row.dark, 'very-dark': row.veryDark },
    fuelCents: row.fuelCents,
    feeCents: row.feeCents,
    dueCents: row.dueCents,
    paidCents,
    balanceCents: row.dueCents - paidCents,
    paid: paidCents >= row.dueCents,
    settledAt: row.settledAt,
    sentAt: row.sentAt,
    payments,
  };
}
