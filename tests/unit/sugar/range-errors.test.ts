import { describe, expect, it } from 'vitest';
import * as sugar from '@/lib/sugar';

type Case = [label: string, call: () => unknown, message: RegExp];

const collectedAt = new Date('2025-03-10T12:00:00Z');

// Each invalid call must throw a RangeError whose message names the argument.
const cases: Case[] = [
  ['densityFromBrix NaN', () => sugar.densityFromBrix(Number.NaN), /^brix must be a number from 0 to 85 \(got NaN\)$/],
  ['densityFromBrix 90', () => sugar.densityFromBrix(90), /^brix must be a number from 0 to 85 \(got 90\)$/],
  ['densityFromBrix -1', () => sugar.densityFromBrix(-1), /^brix .*0 to 85/],
  ['icumsaSucroseDensity20C Infinity', () => sugar.icumsaSucroseDensity20C(Infinity), /^brix .*got Infinity/],
  ['sugarKg negative volume', () => sugar.sugarKg(-1, 2), /^volumeL must be a non-negative number \(got -1\)$/],
  ['sugarKg infinite volume', () => sugar.sugarKg(Infinity, 2), /^volumeL /],
  ['sugarKg brix 86', () => sugar.sugarKg(10, 86), /^brix .*0 to 85/],
  ['sapToSyrupRatio 0 °Bx', () => sugar.sapToSyrupRatio(0), /^sapBrix must be a number greater than 0 and less than 66.9 \(got 0\)$/],
  ['sapToSyrupRatio sap as sweet as syrup', () => sugar.sapToSyrupRatio(70, { syrupBrix: 66 }), /^sapBrix .*less than 66 /],
  ['sapToSyrupRatio NaN, revised', () => sugar.sapToSyrupRatio(Number.NaN, { rule: 'revised' }), /^sapBrix .*less than 66 /],
  ['sapToSyrupRatio syrupBrix 90', () => sugar.sapToSyrupRatio(2, { syrupBrix: 90 }), /^syrupBrix .*at most 85/],
  ['sapToSyrupRatio unknown rule', () => sugar.sapToSyrupRatio(2, { rule: 'rule-of-thumb' as never }), /^rule must be one of 'jones86', 'revised', 'mass-balance'/],
  ['syrupLitres negative sap', () => sugar.syrupLitres(-5, 2), /^sapL must be a non-negative number/],
  ['syrupLitres sap above syrup', () => sugar.syrupLitres(5, 70), /^sapBrix must be a number from 0 to 66.9 \(got 70\)$/],
  ['syrupLitres syrupBrix 0', () => sugar.syrupLitres(5, 0, 0), /^syrupBrix /],
  ['waterToEvaporateL NaN sap', () => sugar.waterToEvaporateL(Number.NaN, 2), /^sapL /],
  ['waterToEvaporateL brix -0.5', () => sugar.waterToEvaporateL(100, -0.5), /^sapBrix /],
  ['boilHours zero evaporation', () => sugar.boilHours(100, 2, 0), /^evaporationLph must be a positive number \(got 0\)$/],
  ['boilHours negative sap', () => sugar.boilHours(-100, 2, 150), /^sapL /],
  ['standardPressureKPa 20 km', () => sugar.standardPressureKPa(20_000), /^elevationM must be a number from -500 to 11000 \(got 20000\)$/],
  ['saturationTemperatureK 0 kPa', () => sugar.saturationTemperatureK(0), /^pressureKPa must be a number from 0.611213 to 22064 \(got 0\)$/],
  ['waterBoilingPointC elevation NaN', () => sugar.waterBoilingPointC({ elevationM: Number.NaN }), /^elevationM /],
  ['waterBoilingPointC pressure too high', () => sugar.waterBoilingPointC({ pressureKPa: 30_000 }), /^pressureKPa /],
  ['waterBoilingPointC neither', () => sugar.waterBoilingPointC({} as never), /^place must give exactly one of elevationM or pressureKPa$/],
  ['waterBoilingPointC both', () => sugar.waterBoilingPointC({ elevationM: 300, pressureKPa: 97 } as never), /^place must give exactly one/],
  ['saturationPressureKPa below the triple point', () => sugar.saturationPressureKPa(200), /^temperatureK must be a number from 273.15 to 647.096 \(got 200\)$/],
  ['boilingPointElevationC 90 °Bx', () => sugar.boilingPointElevationC(90), /^brix must be a number from 0 to 85 \(got 90\)$/],
  ['boilingPointElevationC 1 kPa', () => sugar.boilingPointElevationC(66.9, 1), /^pressureKPa must be a number from 5 to 250 \(got 1\)$/],
  ['sucroseWaterActivity 200 °C', () => sugar.sucroseWaterActivity(66.9, 200), /^tempC must be a number from 0 to 150 \(got 200\)$/],
  ['drawOffTargetC no finishBrix', () => sugar.drawOffTargetC({ elevationM: 310 } as never), /^finishBrix must be a number from 0 to 85 \(got undefined\)$/],
  ['drawOffTargetC neither place', () => sugar.drawOffTargetC({ finishBrix: 66.9 } as never), /^place must give exactly one of elevationM or pressureKPa$/],
  ['drawOffTargetC not an object', () => sugar.drawOffTargetC(null as never), /^input must be an object/],
  ['hydrometerReadingBrix sap', () => sugar.hydrometerReadingBrix(2, 20), /^brix must be a number from 60 to 70 \(got 2\)$/],
  ['hydrometerReadingBrix frozen', () => sugar.hydrometerReadingBrix(66.9, -5), /^tempC must be a number from 10 to 110 \(got -5\)$/],
  ['gradeClass 101', () => sugar.gradeClass(101), /^transmittancePct must be a number from 0 to 100 \(got 101\)$/],
  ['gradeClass -0.1', () => sugar.gradeClass(-0.1), /^transmittancePct /],
  ['gradeClass NaN', () => sugar.gradeClass(Number.NaN), /^transmittancePct .*got NaN/],
  ['spoilageDeadline invalid date', () => sugar.spoilageDeadline(new Date('nope'), { sapTempC: 3 }), /^collectedAt must be a valid Date \(got Invalid Date\)$/],
  ['spoilageDeadline sap temperature NaN', () => sugar.spoilageDeadline(collectedAt, { sapTempC: Number.NaN }), /^sapTempC /],
  ['spoilageDeadline negative shelf', () => sugar.spoilageDeadline(collectedAt, { sapTempC: 3, shelfDays: -1 }), /^shelfDays /],
  ['spoilageDeadline warm keeps longer', () => sugar.spoilageDeadline(collectedAt, { sapTempC: 3, shelfDays: 2, warmShelfDays: 3 }), /^warmShelfDays must be a number from 0 to 2 \(got 3\)$/],
  ['spoilageState invalid now', () => sugar.spoilageState(collectedAt, new Date(Number.NaN)), /^now must be a valid Date/],
  ['spoilageState invalid deadline', () => sugar.spoilageState(new Date(Number.NaN), collectedAt), /^deadline /],
  ['spoilageState watch below urgent', () => sugar.spoilageState(collectedAt, collectedAt, { urgentHours: 48, watchHours: 24 }), /^watchHours /],
  ['allocate fractional total', () => sugar.allocate([{ key: 'a', weight: 1 }], 2.5), /^total must be a whole number from 0 to 9007199254740991 \(got 2.5\)$/],
  ['allocate negative total', () => sugar.allocate([{ key: 'a', weight: 1 }], -1), /^total /],
  ['allocate negative weight', () => sugar.allocate([{ key: 'a', weight: -1 }], 1), /^weights\[0\]\.weight must be a non-negative number \(got -1\)$/],
  ['allocate NaN weight', () => sugar.allocate([{ key: 'a', weight: 1 }, { key: 'b', weight: Number.NaN }], 1), /^weights\[1\]\.weight /],
  ['allocate all-zero weights', () => sugar.allocate([{ key: 'a', weight: 0 }], 3), /^weights must include a positive weight when total is more than 0/],
  ['allocate no weights', () => sugar.allocate([], 1), /^weights must include a positive weight/],
  ['allocate duplicate key', () => sugar.allocate([{ key: 'a', weight: 1 }, { key: 'a', weight: 2 }], 1), /^weights must have unique keys \(got "a" twice\)$/],
  ['allocateRun fractional mL', () => sugar.allocateRun([{ household: 'Okafor', sugarKg: 1 }], { syrupMl: 1.5, fuelCents: 0 }), /^syrupMl /],
  ['allocateRun negative cents', () => sugar.allocateRun([{ household: 'Okafor', sugarKg: 1 }], { syrupMl: 1, fuelCents: -3 }), /^fuelCents /],
  ['allocateRun negative sugar', () => sugar.allocateRun([{ household: 'Okafor', sugarKg: -1 }], { syrupMl: 1, fuelCents: 0 }), /^inputs\[0\]\.sugarKg /],
  ['allocateRun empty household', () => sugar.allocateRun([{ household: '', sugarKg: 1 }], { syrupMl: 1, fuelCents: 0 }), /^inputs\[0\]\.household /],
  ['allocateRun fuel but no sugar', () => sugar.allocateRun([{ household: 'Okafor', sugarKg: 0 }], { syrupMl: 0, fuelCents: 100 }), /^inputs must include a positive weight when fuelCents is more than 0/],
  ['litresToGallons NaN', () => sugar.litresToGallons(Number.NaN), /^litres must be a finite number/],
  ['celsiusToFahrenheit Infinity', () => sugar.celsiusToFahrenheit(-Infinity), /^celsius /],
];

// Where each accepted range comes from, named beside the check.
const RANGE_SOURCES: Record<string, string> = {
  densityFromBrix: 'CRC Handbook sucrose table, 0–85 %, after NBS Circular C440, 1942',
  icumsaSucroseDensity20C: 'CRC Handbook sucrose table, 0–85 %, after NBS Circular C440, 1942',
  sugarKg: 'CRC Handbook sucrose table, 0–85 %, after NBS Circular C440, 1942',
  sapToSyrupRatio: 'rule of 86, OSU Extension Bulletin 856, 2006; sap below syrup',
  syrupLitres: 'mass balance on sugar, CRC Handbook / NBS C440, 1942: sap below syrup',
  waterToEvaporateL: 'mass balance on sugar, CRC Handbook / NBS C440, 1942: sap below syrup',
  boilHours: 'rated evaporation above 0: Farming Magazine, “Boiling it down”, year not verified',
  standardPressureKPa: 'ASHRAE Handbook – Fundamentals, 2017: troposphere',
  saturationTemperatureK: 'IAPWS-IF97 region 4, 2007: triple to critical point',
  saturationPressureKPa: 'IAPWS-IF97 region 4, 2007: triple to critical point',
  waterBoilingPointC: 'ASHRAE 2017 / IAPWS-IF97 ranges',
  boilingPointElevationC: 'Starzak & Peacock, Zuckerindustrie, 1997; CRC table range',
  sucroseWaterActivity: 'Starzak & Peacock, Zuckerindustrie, 1997',
  drawOffTargetC: 'Starzak & Peacock, 1997; IAPWS-IF97',
  hydrometerReadingBrix: 'Vermont density chart, year not verified: 50 °F to boiling, finished syrup',
  gradeClass: 'USDA AMS grade standard, 2015: %Tc 0–100',
  spoilageDeadline: 'co-op settings; common practice',
  spoilageState: 'co-op settings; common practice',
  allocate: 'Hamilton’s method, Balinski & Young, 1982',
  allocateRun: 'Hamilton’s method, Balinski & Young, 1982',
  litresToGallons: 'NIST SP 811, 2008',
  celsiusToFahrenheit: 'NIST SP 811, 2008',
};
const named = cases.map(([label, call, message]) => {
  const source = RANGE_SOURCES[label.split(' ')[0]];
  if (!source) throw new Error(`no source named for ${label}`);
  return [`${label} (${source})`, call, message] as Case;
});

describe('invalid arguments throw a RangeError naming the argument and its range', () => {
  it.each(named)('%s', (_label, call, message) => {
    expect(call).toThrow(RangeError);
    expect(call).toThrow(message);
  });
});
