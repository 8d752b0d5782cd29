import Papa from 'papaparse';
import { GRADE_CLASSES } from '@/lib/sugar/grade';
import { round } from './rules';
import type { Ledger } from './types';

/**
 * The ledger as CSV (papaparse), SI units and integer cents so a spreadsheet can recompute it:
 * one row per household, then the co-op totals.
 */
export function ledgerCsv(l: Ledger): string {
  const rows = l.households.map((h) => ({
    household: h.name,
    sap_l: round(h.sapL, 3),
    rejected_l: round(h.rejectedL, 3),
    mean_brix: h.meanBrix === null ? '' : round(h.meanBrix, 2),
    sugar_kg: round(h.sugarKg, 4),
    share: round(h.share, 6),
    syrup_ml: h.syrupMl,
    ...Object.fromEntries(GRADE_CLASSES.map((c) => [`syrup_${c.replace('-', '_')}_ml`, h.syrupByClassMl[c]])),
    fuel_cents: h.fuelCents,
    fee_cents: h.feeCents,
    due_cents: h.dueCents,
    paid_cents: h.paidCents,
    balance_cents: h.balanceCents,
    by_volume_share: round(h.byVolume.share, 6),
    by_volume_syrup_ml: h.byVolume.syrupMl,
    by_volume_fuel_cents: h.byVolume.fuelCents,
    currency: l.currency,
  }));
  const t = l.totals;
  rows.push({
    household: 'Co-op total',
    sap_l: round(t.sapL, 3),
    rejected_l: round(t.rejectedL, 3),
    mean_brix: t.meanBrix === null ? '' : round(t.meanBrix, 2),
    sugar_kg: round(t.sugarKg, 4),
    share: 1,
    syrup_ml: t.syrupMl,
    ...Object.fromEntries(GRADE_CLASSES.map((c) => [`syrup_${c.replace('-', '_')}_ml`, t.syrupByClassMl[c]])),
    fuel_cents: t.fuelCents,
    fee_cents: t.feeCents,
    due_cents: t.dueCents,
    paid_cents: t.paidCents,
    balance_cents: t.balanceCents,
    by_volume_share: 1,
    by_volume_syrup_ml: t.syrupMl,
    by_volume_fuel_cents: t.fuelCents,
    currency: l.currency,
  });
  return Papa.unparse(rows);
}
