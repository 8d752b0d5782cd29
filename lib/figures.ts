import { celsiusToFahrenheit, kgToPounds, litresToGallons, type UnitSystem } from './sugar/units';
import { formatBrix, formatMass, formatTemperature, formatVolume } from './format/units';

/**
 * How precisely each kind of figure is shown on a screen, decided in one place by its unit and
 * size, so a rated 150 L/h reads "39.6 gal/h" and a queue of sap "384.7 gal", never "384.69 gal".
 * Conversions stay in lib/sugar; the API and the database keep SI values at full precision.
 * Client-safe.
 */
export type FigureKind = 'volume' | 'syrup' | 'mass' | 'temperature' | 'rate' | 'brix';

/**
 * Digits after the decimal point for a figure of this kind, given the value as shown (already
 * in gal, lb, °F … when the co-op works in US units):
 * - sap volume and sugar mass: 2 below 10, else 1 (a meter and a scale read to about 0.1);
 * - syrup: always 2 (syrup is drawn off and owed by the hundredth of a gallon or litre);
 * - evaporation rate: 2 below 10, 1 below 100, else none ("39.6 gal/h", "150 L/h");
 * - temperature and °Brix: 1 (a finishing thermometer and a refractometer read to 0.1).
 */
export function digitsFor(kind: FigureKind, shown: number): number {
  const size = Math.abs(shown);
  switch (kind) {
    case 'volume':
    case 'mass':
      return size > 0 && size < 9.995 ? 2 : 1;
    case 'syrup':
      return 2;
    case 'rate':
      return size < 9.995 ? 2 : size < 99.95 ? 1 : 0;
    case 'temperature':
    case 'brix':
      return 1;
  }
}

const gallonsOr = (litres: number, units: UnitSystem) => (units === 'us' ? litresToGallons(litres) : litres);

/** A volume of sap or water stored in litres: "384.7 gal", "4.25 L". */
export const showVolume = (litres: number, units: UnitSystem) => formatVolume(litres, units, { digits: digitsFor('volume', gallonsOr(litres, units)) });

/** A volume of syrup stored in litres: "1.50 gal", "12.74 L". */
export const showSyrup = (litres: number, units: UnitSystem) => formatVolume(litres, units, { digits: digitsFor('syrup', litres) });

/** A mass stored in kilograms: "190.4 lb", "8.17 lb". */
export const showMass = (kg: number, units: UnitSystem) => formatMass(kg, units, { digits: digitsFor('mass', units === 'us' ? kgToPounds(kg) : kg) });

/** A temperature stored in °C: "219.2 °F", "104.0 °C". */
export const showTemperature = (celsius: number, units: UnitSystem) =>
  formatTemperature(celsius, units, { digits: digitsFor('temperature', units === 'us' ? celsiusToFahrenheit(celsius) : celsius) });

/** Sugar content: "2.7 °Bx". */
export const showBrix = (brix: number) => formatBrix(brix, { digits: digitsFor('brix', brix) });

/** An evaporation rate stored in litres an hour: "39.6 gal/h", "150 L/h". */
export function showRate(litresPerHour: number, units: UnitSystem): string {
  const volume = formatVolume(litresPerHour, units, { digits: digitsFor('rate', gallonsOr(litresPerHour, units)) });
  return `${volume}/h`;
}
