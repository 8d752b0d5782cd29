import { numberInRange } from './guards';

/**
 * Where the evaporator is: either its elevation (standard atmosphere assumed), or the
 * absolute barometric pressure measured there now. Weather services usually report
 * pressure reduced to sea level; that figure is not the one to pass.
 */
export type BoilingPlace =
  | { elevationM: number; pressureKPa?: undefined }
  | { pressureKPa: number; elevationM?: undefined };

/** Elevation range accepted (m): the troposphere, where the standard-atmosphere formula holds. */
export const ELEVATION_RANGE_M = { min: -500, max: 11000 } as const;
/** Pressure range accepted (kPa): IAPWS-IF97 region 4, triple point to critical point. */
export const PRESSURE_RANGE_KPA = { min: 0.611213, max: 22064 } as const;

/**
 * Standard-atmosphere barometric pressure (kPa) at an elevation (m):
 * p = 101.325 (1 − 2.25577×10⁻⁵ Z)^5.2559, ASHRAE Handbook – Fundamentals (2017) ch. 1 eq. 3.
 */
export function standardPressureKPa(elevationM: number): number {
  numberInRange('elevationM', elevationM, ELEVATION_RANGE_M.min, ELEVATION_RANGE_M.max);
  return 101.325 * Math.pow(1 - 2.25577e-5 * elevationM, 5.2559);
}

// IAPWS-IF97 region 4 (saturation line) coefficients n1…n10.
const N = [
  0.11670521452767e4, -0.72421316598308e6, -0.17073846940092e2, 0.12020824702470e5,
  -0.32325550322333e7, 0.14915108613530e2, -0.48232657361591e4, 0.40511340542057e6,
  -0.23855557567849, 0.65017534844798e3,
] as const;

/**
 * Saturation temperature of water (K) at a pressure (kPa), IAPWS-IF97 region 4
 * backward equation (IAPWS, Revised Release on the IAPWS Industrial Formulation 1997,
 * eq. 31).
 */
export function saturationTemperatureK(pressureKPa: number): number {
  numberInRange('pressureKPa', pressureKPa, PRESSURE_RANGE_KPA.min, PRESSURE_RANGE_KPA.max);
  const [n1, n2, n3, n4, n5, n6, n7, n8, n9, n10] = N;
  const beta = Math.pow(pressureKPa / 1000, 0.25);
  const e = beta * beta + n3 * beta + n6;
  const f = n1 * beta * beta + n4 * beta + n7;
  const g = n2 * beta * beta + n5 * beta + n8;
  const d = (2 * g) / (-f - Math.sqrt(f * f - 4 * e * g));
  return (n10 + d - Math.sqrt((n10 + d) * (n10 + d) - 4 * (n9 + n10 * d))) / 2;
}

/** Temperature range accepted (K): IAPWS-IF97 region 4, triple point to critical point. */
export const SATURATION_RANGE_K = { min: 273.15, max: 647.096 } as const;

/**
 * Saturation (vapour) pressure of water (kPa) at a temperature (K), IAPWS-IF97 region 4
 * basic equation (IAPWS, Revised Release on the IAPWS Industrial Formulation 1997,
 * eq. 30); the inverse of {@link saturationTemperatureK}.
 */
export function saturationPressureKPa(temperatureK: number): number {
  numberInRange('temperatureK', temperatureK, SATURATION_RANGE_K.min, SATURATION_RANGE_K.max);
  const [n1, n2, n3, n4, n5, n6, n7, n8, n9, n10] = N;
  const theta = temperatureK + n9 / (temperatureK - n10);
  const a = theta * theta + n1 * theta + n2;
  const b = n3 * theta * theta + n4 * theta + n5;
  const c = n6 * theta * theta + n7 * theta + n8;
  return Math.pow((2 * c) / (-b + Math.sqrt(b * b - 4 * a * c)), 4) * 1000;
}

/**
 * Absolute pressure (kPa) at a place: the measured pressure, or the standard atmosphere
 * at the elevation.
 */
export function placePressureKPa(place: BoilingPlace): number {
  if (place === null || typeof place !== 'object') {
    throw new RangeError('place must be an object with elevationM or pressureKPa');
  }
  const hasElevation = place.elevationM !== undefined;
  const hasPressure = place.pressureKPa !== undefined;
  if (hasElevation === hasPressure) {
    throw new RangeError('place must give exactly one of elevationM or pressureKPa');
  }
  return hasPressure
    ? numberInRange('pressureKPa', place.pressureKPa, PRESSURE_RANGE_KPA.min, PRESSURE_RANGE_KPA.max)
    : standardPressureKPa(place.elevationM as number);
}

/**
 * Boiling point of pure water (°C) at an elevation (standard atmosphere, ASHRAE 2017)
 * or at a measured absolute pressure (IAPWS-IF97 saturation line).
 */
export function waterBoilingPointC(place: BoilingPlace): number {
  return saturationTemperatureK(placePressureKPa(place)) - 273.15;
}
