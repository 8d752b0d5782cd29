import { integerInRange, nonNegative, numberInRange, oneOf, safeInteger } from '../sugar/guards';
import { UNIT_SYSTEMS, celsiusToFahrenheit, kgToPounds, litresToGallons, type UnitSystem } from '../sugar/units';

// Figures as screens, e-mails and files print them: stored SI values in the co-op's display
// units, always with the unit. The arithmetic (conversions, ranges) stays in lib/sugar.

export interface FormatOptions {
  /** Digits after the decimal point (defaults per unit). */
  digits?: number;
  /** BCP 47 locale for digit grouping and decimal mark (default 'en-US'). */
  locale?: string;
}

const numberFormats = new Map<string, Intl.NumberFormat>();

function formatNumber(value: number, digits: number, locale: string): string {
  const id = `${locale}|${digits}`;
  let format = numberFormats.get(id);
  if (!format) {
    // 'negative' keeps a value that rounds to zero from printing as "-0.0".
    format = new Intl.NumberFormat(locale, {
      minimumFractionDigits: digits,
      maximumFractionDigits: digits,
      signDisplay: 'negative',
    });
    numberFormats.set(id, format);
  }
  return format.format(value);
}

function digitsOf(options: FormatOptions, fallback: number): number {
  return options.digits === undefined ? fallback : integerInRange('digits', options.digits, 0, 6);
}

/** A volume stored in litres, shown as "12.5 L" (metric) or "3.30 gal" (US). */
export function formatVolume(litres: number, system: UnitSystem, options: FormatOptions = {}): string {
  nonNegative('litres', litres);
  const locale = options.locale ?? 'en-US';
  return oneOf('system', system, UNIT_SYSTEMS) === 'metric'
    ? `${formatNumber(litres, digitsOf(options, 1), locale)} L`
    : `${formatNumber(litresToGallons(litres), digitsOf(options, 2), locale)} gal`;
}

/** A mass stored in kilograms, shown as "4.25 kg" or "9.37 lb". */
export function formatMass(kg: number, system: UnitSystem, options: FormatOptions = {}): string {
  nonNegative('kg', kg);
  const locale = options.locale ?? 'en-US';
  return oneOf('system', system, UNIT_SYSTEMS) === 'metric'
    ? `${formatNumber(kg, digitsOf(options, 2), locale)} kg`
    : `${formatNumber(kgToPounds(kg), digitsOf(options, 2), locale)} lb`;
}

/** A temperature stored in °C, shown as "104.0 °C" or "219.2 °F". */
export function formatTemperature(celsius: number, system: UnitSystem, options: FormatOptions = {}): string {
  numberInRange('celsius', celsius, -273.15, 1000);
  const locale = options.locale ?? 'en-US';
  return oneOf('system', system, UNIT_SYSTEMS) === 'metric'
    ? `${formatNumber(celsius, digitsOf(options, 1), locale)} °C`
    : `${formatNumber(celsiusToFahrenheit(celsius), digitsOf(options, 1), locale)} °F`;
}

/** Sugar content, the same in both systems: "2.1 °Bx". */
export function formatBrix(brix: number, options: FormatOptions = {}): string {
  numberInRange('brix', brix, 0, 85);
  return `${formatNumber(brix, digitsOf(options, 1), options.locale ?? 'en-US')} °Bx`;
}

/**
 * Money held as an integer count of the currency's minor unit (cents for USD and CAD),
 * shown with its currency, e.g. formatMoney(123456, 'USD') → "$1,234.56". The minor
 * unit follows the currency (JPY has none).
 */
export function formatMoney(cents: number, currency: string, locale: string = 'en-US'): string {
  safeInteger('cents', cents);
  if (typeof currency !== 'string' || !/^[A-Z]{3}$/.test(currency)) {
    throw new RangeError(`currency must be a three-letter ISO 4217 code such as 'USD' (got ${String(currency)})`);
  }
  const format = new Intl.NumberFormat(locale, { style: 'currency', currency });
  const minorDigits = format.resolvedOptions().maximumFractionDigits ?? 2;
  return format.format(cents / 10 ** minorDigits);
}
