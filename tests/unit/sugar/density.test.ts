import { describe, expect, it } from 'vitest';
import { fc, test } from '@fast-check/vitest';
import {
  MAX_BRIX,
  SUCROSE_DENSITY_20C,
  densityFromBrix,
  icumsaSucroseDensity20C,
  sugarKg,
} from '@/lib/sugar';

// CRC Handbook of Chemistry and Physics, "Concentrative properties of aqueous solutions"
// (after NBS Circular C440, 1942): density of sucrose solutions at 20 °C, g/cm³.
const CRC_ROWS: ReadonlyArray<[number, number]> = [
  [0, 0.9982],
  [1, 1.0021],
  [2, 1.006],
  [3, 1.0099],
  [4, 1.0139],
  [60, 1.2864],
  [64, 1.3103],
  [66, 1.3224],
  [68, 1.3348],
  [70, 1.3472],
];

// Same CRC table, "g sucrose per litre" column.
const CRC_GRAMS_PER_LITRE: ReadonlyArray<[number, number]> = [
  [1, 10.0],
  [2, 20.1],
  [3, 30.3],
  [4, 40.6],
  [64, 838.6],
  [66, 872.8],
  [68, 907.6],
  [70, 943.1],
];

describe('sucrose density table (CRC Handbook / NBS Circular C440, 1942)', () => {
  it('carries every whole °Brix from 0 to 85 (range of the CRC Handbook table, after NBS Circular C440, 1942)', () => {
    expect(SUCROSE_DENSITY_20C).toHaveLength(86);
    expect(MAX_BRIX).toBe(85);
  });

  it.each(CRC_ROWS)('row %d °Bx is %f g/cm³ exactly (CRC Handbook, NBS C440 1942)', (brix, rho) => {
    expect(SUCROSE_DENSITY_20C[brix]).toBe(rho);
    expect(densityFromBrix(brix)).toBe(rho);
  });

  it.each(CRC_GRAMS_PER_LITRE)(
    '%d °Bx holds %f g of sucrose per litre (CRC Handbook, g/L column, after NBS Circular C440, 1942)',
    (brix, gramsPerLitre) => {
      // The table rounds its density and g/L columns separately, so allow 0.1 g/L.
      expect(Math.abs(sugarKg(1, brix) * 1000 - gramsPerLitre)).toBeLessThanOrEqual(0.1);
    },
  );

  it('rises strictly and smoothly: first differences between 0.0035 and 0.0070 g/cm³ per °Bx (CRC Handbook / NBS C440 1942 rows: 0.0039 at 0 °Bx, 0.0068 at 84 °Bx)', () => {
    for (let b = 1; b <= MAX_BRIX; b++) {
      const step = SUCROSE_DENSITY_20C[b] - SUCROSE_DENSITY_20C[b - 1];
      expect(step).toBeGreaterThan(0.0035);
      expect(step).toBeLessThan(0.007);
    }
  });

  it('ICUMSA formula (Sugar Technologists Manual, Bartens 1995) reproduces the CRC check rows to ±0.0005', () => {
    for (const [brix, rho] of CRC_ROWS) {
      expect(Math.abs(icumsaSucroseDensity20C(brix) - rho)).toBeLessThanOrEqual(0.0005);
    }
  });

  it('computed row 21 °Bx matches specific gravity 1.08733 (20/20 °C) within 0.0001 g/cm³ (Asadi, Beet-Sugar Handbook, Wiley-Interscience, 2007, Table A.1)', () => {
    expect(Math.abs(SUCROSE_DENSITY_20C[21] - 1.08733 * 0.998203)).toBeLessThan(0.0001);
  });

  it('computed odd rows 21–83 sit within 0.0002 g/cm³ of the mean of the printed rows beside them (NBS Circular C440, 1942: printed second differences are below 0.0002)', () => {
    for (let b = 21; b <= 83; b += 2) {
      expect(Math.abs(SUCROSE_DENSITY_20C[b] - (SUCROSE_DENSITY_20C[b - 1] + SUCROSE_DENSITY_20C[b + 1]) / 2), `row ${b}`).toBeLessThan(0.0002);
    }
  });

  it('interpolates linearly between rows: 2.5 °Bx is the mean of the CRC 2 and 3 °Bx rows; 66.9 °Bx lies between the CRC 66 and 68 °Bx rows (CRC Handbook, NBS C440 1942)', () => {
    expect(densityFromBrix(2.5)).toBeCloseTo((1.006 + 1.0099) / 2, 12);
    expect(densityFromBrix(66.9)).toBeGreaterThan(1.3224);
    expect(densityFromBrix(66.9)).toBeLessThan(1.3348);
    expect(Math.abs(densityFromBrix(66.9) - (1.3224 + (0.9 / 2) * (1.3348 - 1.3224)))).toBeLessThan(0.0002);
  });
});

describe('sugarKg', () => {
  it('100 L of 2 °Bx sap holds 100 × 1.0060 × 0.02 = 2.012 kg of sugar (CRC Handbook density row, NBS C440 1942)', () => {
    expect(sugarKg(100, 2)).toBeCloseTo(2.012, 10);
  });

  it('1 L of 66 °Bx syrup holds 0.8728 kg of sugar (CRC Handbook g/L column 872.8, after NBS Circular C440, 1942)', () => {
    expect(sugarKg(1, 66)).toBeCloseTo(0.8728, 3);
  });

  it('no sugar in no sap, or in pure water (°Brix is % sucrose by mass: ICUMSA definition, from memory)', () => {
    expect(sugarKg(0, 3)).toBe(0);
    expect(sugarKg(250, 0)).toBe(0);
  });

  test.prop([
    fc.double({ min: 0, max: 10_000, noNaN: true }),
    fc.double({ min: 0.001, max: 10_000, noNaN: true }),
    fc.double({ min: 0.01, max: MAX_BRIX, noNaN: true }),
  ])('grows with volume at fixed °Brix (CRC Handbook g/L column rises, NBS Circular C440, 1942)', (volume, extra, brix) => {
    expect(sugarKg(volume + extra, brix)).toBeGreaterThan(sugarKg(volume, brix));
  });

  test.prop([
    fc.double({ min: 0.001, max: 10_000, noNaN: true }),
    fc.double({ min: 0, max: MAX_BRIX - 0.01, noNaN: true }),
    fc.double({ min: 0.001, max: MAX_BRIX, noNaN: true }),
  ])('grows with °Brix at fixed volume (CRC Handbook g/L column rises, NBS Circular C440, 1942)', (volume, brix, step) => {
    const higher = Math.min(MAX_BRIX, brix + step);
    fc.pre(higher > brix);
    expect(sugarKg(volume, higher)).toBeGreaterThan(sugarKg(volume, brix));
  });
});
