import {
  placePressureKPa,
  saturationPressureKPa,
  saturationTemperatureK,
  type BoilingPlace,
} from './boiling-point';
import { numberInRange } from './guards';

/** °Brix range of the boiling-point relation (the sucrose density table's range). */
export const BPE_BRIX_RANGE = { min: 0, max: 85 } as const;
/** Pressure range of the boiling-point relation (kPa): a vacuum pan to a pressure cooker. */
export const BPE_PRESSURE_RANGE_KPA = { min: 5, max: 250 } as const;
/** Temperature range of {@link sucroseWaterActivity} (°C). */
export const WATER_ACTIVITY_RANGE_C = { min: 0, max: 150 } as const;

// Molar masses (g/mol) from the IUPAC standard atomic weights: C12H22O11 and H2O.
const SUCROSE_G_PER_MOL = 342.2965;
const WATER_G_PER_MOL = 18.01528;
// Molar gas constant, J/(mol·K), exact since the 2019 SI (CODATA 2018).
const R = 8.314462618;
// Starzak & Peacock (1997): Q (J/mol), a and b of the water activity coefficient.
const STARZAK_PEACOCK = { q: -17638, a: -1.0038, b: -0.24653 } as const;

/** Mole fraction of sucrose in a solution of `brix` % sucrose by mass. */
export function sucroseMoleFraction(brix: number): number {
  numberInRange('brix', brix, 0, 100);
  const sucrose = brix / SUCROSE_G_PER_MOL;
  const water = (100 - brix) / WATER_G_PER_MOL;
  return sucrose / (sucrose + water);
}

function lnWaterActivity(brix: number, temperatureK: number): number {
  const x = sucroseMoleFraction(brix);
  const { q, a, b } = STARZAK_PEACOCK;
  const lnGamma = (q / (R * temperatureK)) * x * x * (1 + a * x + b * x * x);
  return Math.log(1 - x) + lnGamma;
}

/**
 * Water activity of a pure sucrose solution at a temperature: a_w = x_w · γ_w, with the
 * water activity coefficient of Starzak & Peacock, "Water activity coefficient in aqueous
 * solutions of sucrose – a comprehensive data analysis", Zuckerindustrie 122 (1997)
 * 380–387: ln γ_w = Q/(R·T) · x_s² · (1 + a·x_s + b·x_s²), Q = −17 638 J/mol,
 * a = −1.0038, b = −0.24653, x_s the mole fraction of sucrose. The authors fitted it to a
 * century of vapour-pressure and boiling-point data and give it for boiling-point
 * elevation over the concentrations and pressures they studied.
 */
export function sucroseWaterActivity(brix: number, tempC: number): number {
  numberInRange('brix', brix, BPE_BRIX_RANGE.min, BPE_BRIX_RANGE.max);
  numberInRange('tempC', tempC, WATER_ACTIVITY_RANGE_C.min, WATER_ACTIVITY_RANGE_C.max);
  return Math.exp(lnWaterActivity(brix, tempC + 273.15));
}

/**
 * Boiling-point elevation (°C, = K) of a pure sucrose solution of `brix` % by mass at an
 * absolute pressure (kPa, default one standard atmosphere): the temperature T at which the
 * solution's water vapour pressure, a_w(x, T) · p_sat(T), equals the pressure, less the
 * boiling point of pure water there. a_w is {@link sucroseWaterActivity} (Starzak &
 * Peacock, 1997); p_sat is the IAPWS-IF97 saturation line. Maple syrup is treated as a
 * sucrose solution, as its refractometer °Brix is.
 */
export function boilingPointElevationC(brix: number, pressureKPa: number = 101.325): number {
  numberInRange('brix', brix, BPE_BRIX_RANGE.min, BPE_BRIX_RANGE.max);
  numberInRange('pressureKPa', pressureKPa, BPE_PRESSURE_RANGE_KPA.min, BPE_PRESSURE_RANGE_KPA.max);
  if (brix === 0) return 0;
  const waterK = saturationTemperatureK(pressureKPa);
  const lnP = Math.log(pressureKPa);
  // ln(a_w · p_sat) − ln p rises with T, is < 0 at the water boiling point and > 0 some
  // 40 K above it for anything up to 85 °Brix: bisect between the two.
  let lo = waterK;
  let hi = waterK + 40;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (lnWaterActivity(brix, mid) + Math.log(saturationPressureKPa(mid)) < lnP) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2 - waterK;
}

/** Where the evaporator is, and the °Brix the co-op finishes syrup to. */
export type DrawOffInput = BoilingPlace & {
  /** Finishing density of the syrup, °Brix (the co-op's setting, e.g. 66.9). */
  finishBrix: number;
};

/**
 * Draw-off target (°C): the boiling point of syrup at the co-op's finishing °Brix at the
 * sugarhouse = water's boiling point there (elevation → standard atmosphere, or a measured
 * absolute pressure) + {@link boilingPointElevationC} at that pressure.
 *
 * @example drawOffTargetC({ elevationM: 310, finishBrix: 66.9 }) // ≈ 103.1 °C
 * @example drawOffTargetC({ pressureKPa: 97, finishBrix: 66.0 })
 */
export function drawOffTargetC(input: DrawOffInput): number {
  if (input === null || typeof input !== 'object') {
    throw new RangeError('input must be an object with finishBrix and elevationM or pressureKPa');
  }
  const pressureKPa = placePressureKPa(input);
  numberInRange('finishBrix', input.finishBrix, BPE_BRIX_RANGE.min, BPE_BRIX_RANGE.max);
  return saturationTemperatureK(pressureKPa) - 273.15 + boilingPointElevationC(input.finishBrix, pressureKPa);
}
