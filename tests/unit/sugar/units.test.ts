import { describe, expect, it } from 'vitest';
import { fc, test } from '@fast-check/vitest';
import {
  KG_PER_POUND,
  LITRES_PER_US_GALLON,
  celsiusToFahrenheit,
  fahrenheitToCelsius,
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
