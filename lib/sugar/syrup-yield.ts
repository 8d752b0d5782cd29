import { densityFromBrix, MAX_BRIX } from './density';
import { nonNegative, numberAboveUpTo, numberBetween, numberInRange, oneOf, positive } from './guards';

/** Default °Brix of finished syrup (a cooperative setting; Vermont's minimum). */
export const DEFAULT_SYRUP_BRIX = 66.9;

/** The sap-to-syrup rules the trade uses. */
export type SapRatioRule = 'jones86' | 'revised' | 'mass-balance';

export const SAP_RATIO_RULES: readonly SapRatioRule[] = ['jones86', 'revised', 'mass-balance'];

/** °Brix of the syrup each fixed rule was derived for. */
const RULE_SYRUP_BRIX = { jones86: 65.5, revised: 66.0 } as const;

export interface SapRatioOptions {
  /** Which rule to apply; 'mass-balance' by default. */
  rule?: SapRatioRule;
  /**
   * Finished syrup °Brix, used by 'mass-balance' only (default 66.9). The fixed rules
   * are defined for their own syrup: 65.5 °Bx for 'jones86', 66.0 °Bx for 'revised'.
   */
  syrupBrix?: number;
}

/**
 * Volume of sap needed per volume of finished syrup (same units for both, so litres
 * per litre or gallons per gallon).
 *
 * - `'jones86'`: 86 / °Brix, the Jones rule of 86 (derived for 65.5 °Bx syrup).
 * - `'revised'`: 87.1 / °Brix − 0.32, the revised Jones rule for 66.0 °Bx syrup.
 * - `'mass-balance'` (default): sugar in = sugar out, from the density table:
 *   (syrupBrix · ρ(syrupBrix)) / (sapBrix · ρ(sapBrix)), for any syrupBrix.
 *
 * @throws RangeError unless 0 < sapBrix < the syrup °Brix of the rule.
 */
export function sapToSyrupRatio(sapBrix: number, options: SapRatioOptions = {}): number {
  const rule = oneOf('rule', options.rule ?? 'mass-balance', SAP_RATIO_RULES);
  if (rule === 'mass-balance') {
    const syrupBrix = numberAboveUpTo('syrupBrix', options.syrupBrix ?? DEFAULT_SYRUP_BRIX, 0, MAX_BRIX);
    numberBetween('sapBrix', sapBrix, 0, syrupBrix);
    return (syrupBrix * densityFromBrix(syrupBrix)) / (sapBrix * densityFromBrix(sapBrix));
  }
  numberBetween('sapBrix', sapBrix, 0, RULE_SYRUP_BRIX[rule]);
  return rule === 'jones86' ? 86 / sapBrix : 87.1 / sapBrix - 0.32;
}

function checkSapAndSyrup(sapL: number, sapBrix: number, syrupBrix: number): void {
  nonNegative('sapL', sapL);
  numberAboveUpTo('syrupBrix', syrupBrix, 0, MAX_BRIX);
  numberInRange('sapBrix', sapBrix, 0, syrupBrix);
}

/**
 * Litres of syrup at `syrupBrix` that `sapL` litres of sap at `sapBrix` make, by a
 * mass balance on sugar (no losses to niter or spillage counted).
 */
export function syrupLitres(sapL: number, sapBrix: number, syrupBrix: number = DEFAULT_SYRUP_BRIX): number {
  checkSapAndSyrup(sapL, sapBrix, syrupBrix);
  const sugar = sapL * densityFromBrix(sapBrix) * sapBrix;
  return sugar / (densityFromBrix(syrupBrix) * syrupBrix);
}

/**
 * Litres of water boiled off to turn `sapL` litres of sap into syrup at `syrupBrix`:
 * sap mass − syrup mass, in kilograms, reported as litres at 1 kg/L. Evaporator ratings
 * ("litres or gallons of water an hour") are quoted on that cold-water basis, so the
 * result divides directly by a rating; the true volume of the steam-side water differs
 * by under 0.2 % at 20 °C, well inside the spread of any rating.
 */
export function waterToEvaporateL(
  sapL: number,
  sapBrix: number,
  syrupBrix: number = DEFAULT_SYRUP_BRIX,
): number {
  checkSapAndSyrup(sapL, sapBrix, syrupBrix);
  const sapKg = sapL * densityFromBrix(sapBrix);
  const syrupKg = (sapKg * sapBrix) / syrupBrix;
  return sapKg - syrupKg;
}

/**
 * Hours of boiling for `sapL` litres of sap on an evaporator rated at `evaporationLph`
 * litres of water an hour: {@link waterToEvaporateL} / rating. Excludes start-up and
 * finishing time.
 */
export function boilHours(
  sapL: number,
  sapBrix: number,
  evaporationLph: number,
  syrupBrix: number = DEFAULT_SYRUP_BRIX,
): number {
  positive('evaporationLph', evaporationLph);
  return waterToEvaporateL(sapL, sapBrix, syrupBrix) / evaporationLph;
}
