import { GRADE_CLASS_INFO, GRADE_CLASSES, type UnitSystem } from '@/lib/sugar';
import { formatMoney } from '@/lib/format/units';
import type { Statement, SyrupByClass } from './types';
import { showBrix, showMass, showSyrup, showVolume } from '@/lib/figures';

/** Display helpers for ledger and statement figures (client-safe, no database). */

export const formatShare = (share: number) => `${(share * 100).toFixed(1)} %`;

export const formatSyrup = (ml: number, units: UnitSystem) => showSyrup(ml / 1000, units);

/** "Golden 1.20 gal, Amber 0.80 gal" — only the classes present. */
export function formatSyrupClasses(byClass: SyrupByClass, units: UnitSystem): string {
  const parts = GRADE_CLASSES.filter((c) => byClass[c] > 0).map((c) => `${GRADE_CLASS_INFO[c].name.replace(' Color', '')} ${formatSyrup(byClass[c], units)}`);
  return parts.length ? parts.join(', ') : 'none';
}

export interface StatementLine {
  label: string;
  value: string;
  /** Lines that carry money totals are set bold. */
  strong?: boolean;
}

/** The statement's figures as label/value lines, shared by the page, the e-mail and the PDF. */
export function statementLines(s: Statement): StatementLine[] {
  const u = s.unitSystem;
  const money = (c: number) => formatMoney(c, s.currency);
  return [
    { label: 'Sap delivered (accepted)', value: showVolume(s.sapL, u) },
    { label: 'Average sugar content', value: s.meanBrix === null ? '—' : showBrix(s.meanBrix) },
    { label: 'Sugar in the season’s boils', value: showMass(s.sugarKg, u) },
    { label: 'Share of the season’s sugar', value: formatShare(s.share) },
    { label: 'Syrup owed', value: formatSyrup(s.syrupMl, u) },
    { label: 'Syrup by colour class', value: formatSyrupClasses(s.syrupByClassMl, u) },
    { label: 'Fuel share', value: money(s.fuelCents) },
    { label: 'Season fee', value: money(s.feeCents) },
    { label: 'Total due', value: money(s.dueCents), strong: true },
    { label: 'Paid', value: money(s.paidCents) },
    { label: 'Balance', value: money(s.balanceCents), strong: true },
  ];
}
