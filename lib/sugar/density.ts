import { nonNegative, numberInRange } from './guards';

/** Highest °Brix the density table covers. */
export const MAX_BRIX = 85;

/**
 * Density (g/cm³, true density) of aqueous sucrose solutions at 20 °C, indexed by
 * whole °Brix (% sucrose by mass) from 0 to 85.
 *
 * Published rows: CRC Handbook of Chemistry and Physics, "Concentrative properties of
 * aqueous solutions" (after NBS Circular C440, 1942), which prints every 1 % from 0 to
 * 20 % and every 2 % from 22 to 84 %. Those rows are carried unchanged.
 *
 * Computed rows (odd °Brix 21–83, and 85): the ICUMSA sucrose-density formula at 20 °C
 * (Bubník, Kadlec, Urban & Bruhns, Sugar Technologists Manual, Bartens 1995, p. 164),
 * see {@link icumsaSucroseDensity20C}, plus the mean of the table-minus-formula
 * residuals at the two neighbouring printed rows (85 takes the residual at 84), rounded
 * to 4 decimals. The residual keeps computed rows on the printed table's scale: the
 * formula alone runs up to 0.0008 g/cm³ above the 1942 table near 84 %.
 */
export const SUCROSE_DENSITY_20C: readonly number[] = Object.freeze([
  // 0–9
  0.9982, 1.0021, 1.006, 1.0099, 1.0139, 1.0178, 1.0218, 1.0259, 1.0299, 1.034,
  // 10–19
  1.0381, 1.0423, 1.0465, 1.0507, 1.0549, 1.0592, 1.0635, 1.0678, 1.0722, 1.0766,
  // 20–29 (21, 23, 25, 27, 29 computed)
  1.081, 1.0854, 1.0899, 1.0944, 1.099, 1.1036, 1.1082, 1.1128, 1.1175, 1.1222,
  // 30–39 (odd computed)
  1.127, 1.1318, 1.1366, 1.1415, 1.1464, 1.1513, 1.1562, 1.1612, 1.1663, 1.1714,
  // 40–49 (odd computed)
  1.1765, 1.1816, 1.1868, 1.192, 1.1972, 1.2025, 1.2079, 1.2132, 1.2186, 1.224,
  // 50–59 (odd computed)
  1.2295, 1.235, 1.2406, 1.2462, 1.2518, 1.2575, 1.2632, 1.2689, 1.2747, 1.2805,
  // 60–69 (odd computed)
  1.2864, 1.2923, 1.2983, 1.3043, 1.3103, 1.3163, 1.3224, 1.3286, 1.3348, 1.341,
  // 70–79 (odd computed)
  1.3472, 1.3535, 1.3599, 1.3662, 1.3726, 1.379, 1.3855, 1.392, 1.3986, 1.4051,
  // 80–85 (81, 83, 85 computed)
  1.4117, 1.4183, 1.425, 1.4316, 1.4383, 1.4451,
]);

// Lookups read a typed copy (the hot path of every drop-off); the exported table stays frozen.
const TABLE = Float64Array.from(SUCROSE_DENSITY_20C);

// ICUMSA coefficients (kg/m³) of w, w², … w⁶ at 20 °C, w = mass fraction of sucrose.
const ICUMSA_20C = [385.1761, 135.3705, 40.9299, -3.9643, 13.4853, -17.289] as const;
// Water at 20 °C, Kell (1975), J. Chem. Eng. Data 20:97, the water term of the formula.
const WATER_20C_KG_M3 = 998.2031;

/**
 * Density of a sucrose solution at 20 °C (g/cm³) from the ICUMSA formula
 * ρ = ρw + Σ Aᵢ wⁱ (Sugar Technologists Manual, 1995). Used to derive the table's
 * computed rows; {@link densityFromBrix} is what other code should call.
 */
export function icumsaSucroseDensity20C(brix: number): number {
  numberInRange('brix', brix, 0, MAX_BRIX);
  const w = brix / 100;
  let rho = WATER_20C_KG_M3;
  let power = 1;
  for (const a of ICUMSA_20C) {
    power *= w;
    rho += a * power;
  }
  return rho / 1000;
}

/**
 * Density (g/cm³ = kg/L) at 20 °C of a sucrose solution of the given °Brix, linearly
 * interpolated between the whole-°Brix rows of {@link SUCROSE_DENSITY_20C}.
 * Maple sap and syrup are treated as sucrose solutions, as refractometer °Brix is.
 */
export function densityFromBrix(brix: number): number {
  numberInRange('brix', brix, 0, MAX_BRIX);
  const lower = Math.floor(brix);
  if (lower === MAX_BRIX) return TABLE[MAX_BRIX];
  const lo = TABLE[lower];
  const hi = TABLE[lower + 1];
  return lo + (hi - lo) * (brix - lower);
}

/**
 * Mass of sugar (kg) in a volume of sap or syrup: litres × density(°Brix) × °Brix / 100.
 * The volume is taken as measured at about 20 °C, the temperature of the table.
 */
export function sugarKg(volumeL: number, brix: number): number {
  nonNegative('volumeL', volumeL);
  return (volumeL * densityFromBrix(brix) * brix) / 100;
}
