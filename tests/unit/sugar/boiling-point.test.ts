import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import {
  celsiusToFahrenheit,
  drawOffTemperatureC,
  saturationTemperatureK,
  standardPressureKPa,
  waterBoilingPointC,
} from '@/lib/sugar';

const FOOT_M = 0.3048;

interface Psychrometrics {
  SI: number;
  SetUnitSystem(system: number): void;
  GetStandardAtmPressure(altitudeM: number): number;
}
const psychrolib = createRequire(import.meta.url)('psychrolib') as Psychrometrics;
psychrolib.SetUnitSystem(psychrolib.SI);

describe('standard-atmosphere pressure (ASHRAE Handbook – Fundamentals, 2017, ch. 1 eq. 3)', () => {
  it('is 101.325 kPa at sea level', () => {
    expect(standardPressureKPa(0)).toBe(101.325);
  });

  it.each([-100, 310, 609.6, 1524, 3048, 8000])('matches psychrolib GetStandardAtmPressure at %d m', (z) => {
    expect(standardPressureKPa(z)).toBeCloseTo(psychrolib.GetStandardAtmPressure(z) / 1000, 10);
  });
});

describe('saturation temperature, IAPWS-IF97 region 4 (IAPWS Revised Release on IF97, verification values)', () => {
  it('Tsat(0.1 MPa) = 372.755919 K', () => {
    expect(saturationTemperatureK(100)).toBeCloseTo(372.755919, 6);
  });

  it('Tsat(1 MPa) = 453.035632 K', () => {
    expect(saturationTemperatureK(1000)).toBeCloseTo(453.035632, 6);
  });

  it('Tsat(10 MPa) = 584.149488 K within 1 µK (third IF97 verification value, quoted from memory)', () => {
    expect(Math.abs(saturationTemperatureK(10_000) - 584.149488)).toBeLessThan(1e-6);
  });

  it('normal boiling point, 101.325 kPa → 373.124 K (IAPWS-IF97)', () => {
    expect(saturationTemperatureK(101.325)).toBeCloseTo(373.124, 3);
  });
});

describe('boiling point of water at elevation', () => {
  const boilingF = (feet: number) => celsiusToFahrenheit(waterBoilingPointC({ elevationM: feet * FOOT_M }));

  it('2,000 ft → 208 °F within 0.5 °F (USDA FSIS, high-altitude cooking)', () => {
    expect(Math.abs(boilingF(2000) - 208)).toBeLessThanOrEqual(0.5);
  });

  it('5,000 ft → 203 °F within 0.5 °F (standard high-altitude cooking table, NOAA/NASA standard atmosphere)', () => {
    expect(Math.abs(boilingF(5000) - 203)).toBeLessThanOrEqual(0.5);
  });

  it('10,000 ft → 193.6 °F within 0.5 °F (standard high-altitude cooking table, NOAA/NASA standard atmosphere)', () => {
    expect(Math.abs(boilingF(10_000) - 193.6)).toBeLessThanOrEqual(0.5);
  });

  it('falls as the sugarhouse sits higher', () => {
    const points = [0, 300, 600, 1200].map((elevationM) => waterBoilingPointC({ elevationM }));
    for (let i = 1; i < points.length; i++) expect(points[i]).toBeLessThan(points[i - 1]);
  });

  it('a measured pressure gives the same answer as the elevation with that standard pressure', () => {
    expect(waterBoilingPointC({ pressureKPa: standardPressureKPa(310) })).toBeCloseTo(
      waterBoilingPointC({ elevationM: 310 }),
      12,
    );
  });

  it('a low-pressure day lowers it: 97 kPa at the sugarhouse boils near 98.8 °C (IAPWS-IF97)', () => {
    expect(waterBoilingPointC({ pressureKPa: 97 })).toBeCloseTo(98.8, 1);
  });
});

describe('draw-off temperature (finished syrup boils about 7 °F / 4 °C above water: trade practice)', () => {
  it('defaults to water + 3.9 °C', () => {
    const place = { elevationM: 310 };
    expect(drawOffTemperatureC(place)).toBeCloseTo(waterBoilingPointC(place) + 3.9, 12);
  });

  it('takes the offset as a setting (7.1 °F, commonly attributed to University of Maine Cooperative Extension)', () => {
    const place = { elevationM: 0 };
    const offsetC = (7.1 * 5) / 9;
    expect(celsiusToFahrenheit(drawOffTemperatureC(place, offsetC))).toBeCloseTo(
      celsiusToFahrenheit(waterBoilingPointC(place)) + 7.1,
      10,
    );
  });

  it('is about 219 °F at sea level', () => {
    expect(celsiusToFahrenheit(drawOffTemperatureC({ elevationM: 0 }))).toBeCloseTo(218.97, 1);
  });
});
