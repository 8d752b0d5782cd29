import { finiteNumber } from './guards';

/** Display unit system chosen by a cooperative; stored values are always SI. */
export type UnitSystem = 'metric' | 'us';

export const UNIT_SYSTEMS: readonly UnitSystem[] = ['metric', 'us'];

/** Litres in one US liquid gallon, exact (NIST Handbook 44 / SP 811). */
export const LITRES_PER_US_GALLON = 3.785411784;
/** Kilograms in one avoirdupois pound, exact (NIST Handbook 44 / SP 811). */
export const KG_PER_POUND = 0.45359237;

/** Litres → US gallons. */
export function litresToGallons(litres: number): number {
  return finiteNumber('litres', litres) / LITRES_PER_US_GALLON;
}

/** US gallons → litres. */
export function gallonsToLitres(gallons: number): number {
  return finiteNumber('gallons', gallons) * LITRES_PER_US_GALLON;
}

/** Kilograms → pounds. */
export function kgToPounds(kg: number): number {
  return finiteNumber('kg', kg) / KG_PER_POUND;
}

/** Pounds → kilograms. */
export function poundsToKg(pounds: number): number {
  return finiteNumber('pounds', pounds) * KG_PER_POUND;
}

/** °C → °F (°F = °C × 9/5 + 32). */
export function celsiusToFahrenheit(celsius: number): number {
  return (finiteNumber('celsius', celsius) * 9) / 5 + 32;
}

/** °F → °C. */
export function fahrenheitToCelsius(fahrenheit: number): number {
  return ((finiteNumber('fahrenheit', fahrenheit) - 32) * 5) / 9;
}
