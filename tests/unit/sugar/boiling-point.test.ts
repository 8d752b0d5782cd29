import { describe, expect, it } from 'vitest';
import {
  celsiusToFahrenheit,
  saturationPressureKPa,
  saturationTemperatureK,
  standardPressureKPa,
  waterBoilingPointC,
} from '@/lib/sugar';

const FOOT_M = 0.3048;

describe('standard-atmosphere pressure (ASHRAE Handbook – Fundamentals, 2017, ch. 1 eq. 3)', () => {
  it('is 101.325 kPa at sea level (standard atmosphere, ISO 2533:1975 / U.S. Standard Atmosphere, 1976)', () => {
    expect(standardPressureKPa(0)).toBeCloseTo(101.325, 9);
  });

  // U.S. Standard Atmosphere, 1976 (NOAA, NASA, USAF), tabulated pressure at geopotential
  // altitude; the values are quoted from memory.
  it.each([
    [1000, 89.8746],
    [2000, 79.4952],
    [3000, 70.1085],
    [5000, 54.0199],
    [11000, 22.6321],
  ])('%d m → %f kPa within 0.05 kPa (U.S. Standard Atmosphere, 1976, NOAA/NASA/USAF; from memory)', (z, kPa) => {
    expect(Math.abs(standardPressureKPa(z) - kPa)).toBeLessThan(0.05);
  });
});

describe('saturation temperature, IAPWS-IF97 region 4 (IAPWS Revised Release on IF97, 2007, verification values)', () => {
  it('Tsat(0.1 MPa) = 372.755919 K (IAPWS-IF97 verification table, 2007)', () => {
    expect(saturationTemperatureK(100)).toBeCloseTo(372.755919, 6);
  });

  it('Tsat(1 MPa) = 453.035632 K (IAPWS-IF97 verification table, 2007)', () => {
    expect(saturationTemperatureK(1000)).toBeCloseTo(453.035632, 6);
  });

  it('Tsat(10 MPa) = 584.149488 K within 1 µK (IAPWS-IF97 verification table; from memory)', () => {
    expect(Math.abs(saturationTemperatureK(10_000) - 584.149488)).toBeLessThan(1e-6);
  });

  it('normal boiling point, 101.325 kPa → 373.124 K (IAPWS-IF97 steam tables; from memory)', () => {
    expect(saturationTemperatureK(101.325)).toBeCloseTo(373.124, 3);
  });
});

describe('saturation pressure, IAPWS-IF97 region 4 eq. 30 (IAPWS Revised Release on IF97, 2007)', () => {
  it.each([
    [300, 3.53658941],
    [500, 2638.89776],
    [600, 12344.3146],
  ])('psat(%d K) = %f kPa (IAPWS-IF97 verification table for eq. 30; from memory)', (t, kPa) => {
    expect(Math.abs(saturationPressureKPa(t) / kPa - 1)).toBeLessThan(1e-8);
  });

  it.each([20, 40, 60, 80, 100])(
    'at %d °C agrees within 0.5 % with the Antoine equation for water (A 8.07131, B 1730.63, C 233.426, mmHg/°C, 1–100 °C; Lange’s Handbook of Chemistry, McGraw-Hill; from memory)',
    (c) => {
      const antoineKPa = (10 ** (8.07131 - 1730.63 / (233.426 + c)) * 101.325) / 760;
      expect(Math.abs(saturationPressureKPa(c + 273.15) / antoineKPa - 1)).toBeLessThan(0.005);
    },
  );
});

describe('boiling point of water at elevation', () => {
  const boilingF = (feet: number) => celsiusToFahrenheit(waterBoilingPointC({ elevationM: feet * FOOT_M }));

  it('2,000 ft → 208 °F within 0.5 °F (USDA FSIS, “High Altitude Cooking and Food Safety”, year not verified)', () => {
    expect(Math.abs(boilingF(2000) - 208)).toBeLessThanOrEqual(0.5);
  });

  it('5,000 ft → 203 °F within 0.5 °F (standard high-altitude cooking table from the U.S. Standard Atmosphere, 1976, NOAA/NASA/USAF)', () => {
    expect(Math.abs(boilingF(5000) - 203)).toBeLessThanOrEqual(0.5);
  });

  it('10,000 ft → 193.6 °F within 0.5 °F (standard high-altitude cooking table from the U.S. Standard Atmosphere, 1976, NOAA/NASA/USAF)', () => {
    expect(Math.abs(boilingF(10_000) - 193.6)).toBeLessThanOrEqual(0.5);
  });

  it('falls about 1 °F for every 500 ft of elevation (USDA FSIS, “High Altitude Cooking and Food Safety”, year not verified; common practice)', () => {
    const perFoot = (boilingF(0) - boilingF(5000)) / 5000;
    expect(perFoot * 500).toBeGreaterThan(0.8);
    expect(perFoot * 500).toBeLessThan(1.1);
  });

  it('a measured pressure gives the same answer as the elevation whose standard pressure it is (ASHRAE 2017 + IAPWS-IF97, both ways)', () => {
    expect(waterBoilingPointC({ pressureKPa: standardPressureKPa(310) })).toBeCloseTo(
      waterBoilingPointC({ elevationM: 310 }),
      12,
    );
  });

  it('a low-pressure day lowers it: 97 kPa boils within 0.05 °C of the inverted Antoine equation for water (Lange’s Handbook of Chemistry, McGraw-Hill; from memory)', () => {
    const mmHg = (97 * 760) / 101.325;
    const antoineC = 1730.63 / (8.07131 - Math.log10(mmHg)) - 233.426;
    expect(Math.abs(waterBoilingPointC({ pressureKPa: 97 }) - antoineC)).toBeLessThan(0.05);
    expect(waterBoilingPointC({ pressureKPa: 97 })).toBeLessThan(99);
  });

  it.each([
    [70.183, 90],
    [84.609, 95],
  ])('%f kPa → %d °C within 0.01 °C (Çengel & Boles, Thermodynamics: An Engineering Approach, McGraw-Hill, saturated-water table A-4; from memory)', (kPa, c) => {
    expect(Math.abs(waterBoilingPointC({ pressureKPa: kPa }) - c)).toBeLessThan(0.01);
  });
});
