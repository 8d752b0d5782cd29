import { describe, expect, it } from 'vitest';
import { fc, test } from '@fast-check/vitest';
import {
  KG_PER_POUND,
  LITRES_PER_US_GALLON,
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  formatBrix,
  formatMass,
  formatMoney,
  formatTemperature,
  formatVolume,
  gallonsToLitres,
  kgToPounds,
  litresToGallons,
  poundsToKg,
} from '@/lib/sugar';

describe('exact unit definitions (NIST Handbook 44 / NIST SP 811)', () => {
  it('1 US gallon = 3.785411784 L and 1 lb = 0.45359237 kg (NIST Handbook 44 / NIST SP 811, 2008)', () => {
    expect(LITRES_PER_US_GALLON).toBe(3.785411784);
    expect(KG_PER_POUND).toBe(0.45359237);
    expect(gallonsToLitres(1)).toBe(3.785411784);
    expect(poundsToKg(1)).toBe(0.45359237);
    expect(litresToGallons(3.785411784)).toBe(1);
    expect(kgToPounds(0.45359237)).toBe(1);
  });

  it('°F = °C × 9/5 + 32: 100 °C = 212 °F, 0 °C = 32 °F, −40 °C = −40 °F (NIST SP 811, 2008)', () => {
    expect(celsiusToFahrenheit(100)).toBe(212);
    expect(celsiusToFahrenheit(0)).toBe(32);
    expect(celsiusToFahrenheit(-40)).toBe(-40);
    expect(fahrenheitToCelsius(219)).toBeCloseTo(103.888889, 5);
  });

  test.prop([fc.double({ min: -1e6, max: 1e6, noNaN: true })])('round-trips within 1e-12 relative (exact definitions, NIST SP 811, 2008)', (x) => {
    const tol = 1e-12 * Math.max(1, Math.abs(x));
    expect(Math.abs(gallonsToLitres(litresToGallons(x)) - x)).toBeLessThanOrEqual(tol);
    expect(Math.abs(poundsToKg(kgToPounds(x)) - x)).toBeLessThanOrEqual(tol);
    expect(Math.abs(fahrenheitToCelsius(celsiusToFahrenheit(x)) - x)).toBeLessThanOrEqual(tol);
  });
});

describe('formatters always print the unit (unit symbols: NIST SP 811, 2008; currencies: ISO 4217)', () => {
  it('volume: litres with one decimal, US gallons with two (NIST SP 811, 2008)', () => {
    expect(formatVolume(12.5, 'metric')).toBe('12.5 L');
    expect(formatVolume(12.5, 'us')).toBe('3.30 gal');
    expect(formatVolume(1234.56, 'metric')).toBe('1,234.6 L');
    expect(formatVolume(3.785411784, 'us', { digits: 0 })).toBe('1 gal');
  });

  it('temperature (NIST SP 811, 2008)', () => {
    expect(formatTemperature(103.9, 'metric')).toBe('103.9 °C');
    expect(formatTemperature(100, 'us')).toBe('212.0 °F');
    expect(formatTemperature(-0.01, 'metric')).toBe('0.0 °C');
    expect(formatTemperature(-2.5, 'metric')).toBe('-2.5 °C');
  });

  it('mass (NIST SP 811, 2008)', () => {
    expect(formatMass(4.25, 'metric')).toBe('4.25 kg');
    expect(formatMass(0.45359237, 'us')).toBe('1.00 lb');
  });

  it('°Brix (% sucrose by mass: ICUMSA definition, from memory)', () => {
    expect(formatBrix(2.14)).toBe('2.1 °Bx');
    expect(formatBrix(66.9)).toBe('66.9 °Bx');
  });

  it('money from integer minor units, with its currency (ISO 4217:2015 minor units)', () => {
    expect(formatMoney(123456, 'USD')).toBe('$1,234.56');
    expect(formatMoney(26000, 'CAD', 'en-CA')).toBe('$260.00');
    expect(formatMoney(26000, 'CAD', 'en-US')).toBe('CA$260.00');
    expect(formatMoney(-150, 'USD')).toBe('-$1.50');
    expect(formatMoney(500, 'JPY')).toBe('¥500');
  });
});
