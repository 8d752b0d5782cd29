import { describe, expect, it } from 'vitest';
import { VERMONT_DENSITY_CHART, densityFromBrix, fahrenheitToCelsius, hydrometerReadingBrix } from '@/lib/sugar';

// Water at 20 °C, g/cm³ (CRC Handbook of Chemistry and Physics, density of water): turns the
// CRC sucrose table's true densities into specific gravities 20/20 °C.
const WATER_20C = 0.998203;

describe('hydrometer hot-test correction (Vermont Agency of Agriculture, Food & Markets, maple density chart for hydrometers calibrated at 60 °F, year not verified)', () => {
  it.each(VERMONT_DENSITY_CHART.map(([f, baume, brix]) => [f, baume, brix]))(
    'chart row %d °F: %f °Bé and %f °Brix name the same density within 0.1 °Bé (Baumé modulus 145 and sucrose densities, NBS Circular C440, 1942 / CRC Handbook)',
    (_f, baume, brix) => {
      const sg = densityFromBrix(brix) / WATER_20C;
      expect(Math.abs(145 - 145 / sg - baume)).toBeLessThan(0.1);
    },
  );

  it.each([
    [209, 58.0],
    [193, 59.0],
    [176, 60.0],
    [158, 61.0],
  ])(
    'syrup finished to 66.0 °Bx reads %d °F → %f °Brix within 0.2 (trade density chart, column for 66.0 °Brix syrup, publisher not verified; common practice)',
    (f, reading) => {
      expect(Math.abs(hydrometerReadingBrix(66, fahrenheitToCelsius(f)) - reading)).toBeLessThan(0.2);
    },
  );

  it('the hot-test line: 66.9 °Bx syrup at 211 °F reads 59.1 °Brix within 0.15 (State of Vermont hydrometer calibration, hot test at 211 °F; common practice)', () => {
    expect(Math.abs(hydrometerReadingBrix(66.9, fahrenheitToCelsius(211)) - 59.1)).toBeLessThan(0.15);
  });

  it('reads true at the 60 °F calibration temperature and about 0.4–0.6 °Brix low at 68 °F room temperature (Vermont density chart, year not verified: 66.9 at 60 °F, 66.4 at 70 °F)', () => {
    expect(hydrometerReadingBrix(67.5, fahrenheitToCelsius(60))).toBeCloseTo(67.5, 9);
    const low = 66.9 - hydrometerReadingBrix(66.9, 20);
    expect(low).toBeGreaterThan(0.3);
    expect(low).toBeLessThan(0.6);
  });

  it('reads lower the hotter the syrup, from 50 °F to 209 °F (hot syrup is less dense; common practice)', () => {
    let previous = Infinity;
    for (let f = 50; f <= 209; f += 1) {
      const r = hydrometerReadingBrix(66.9, fahrenheitToCelsius(f));
      expect(r).toBeLessThan(previous + 1e-12);
      previous = r;
    }
    expect(hydrometerReadingBrix(66.9, fahrenheitToCelsius(209))).toBeLessThan(hydrometerReadingBrix(66.9, fahrenheitToCelsius(50)) - 8);
  });
});
