import { describe, expect, it } from 'vitest';
import { formatBrix, formatMass, formatMoney, formatTemperature, formatVolume } from '@/lib/format/units';

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

type Case = [label: string, call: () => unknown, message: RegExp, source: string];

// Each invalid call throws a RangeError naming the argument; where the accepted range comes from beside it.
const invalid: Case[] = [
  ['formatVolume negative', () => formatVolume(-1, 'metric'), /^litres must be a non-negative number/, 'NIST SP 811, 2008'],
  ['formatVolume unknown system', () => formatVolume(1, 'imperial' as never), /^system must be one of 'metric', 'us'/, 'NIST SP 811, 2008'],
  ['formatVolume digits 2.5', () => formatVolume(1, 'metric', { digits: 2.5 }), /^digits must be a whole number from 0 to 6/, 'NIST SP 811, 2008'],
  ['formatMass NaN', () => formatMass(Number.NaN, 'us'), /^kg /, 'NIST SP 811, 2008'],
  ['formatTemperature below absolute zero', () => formatTemperature(-300, 'us'), /^celsius /, 'NIST SP 811, 2008: absolute zero'],
  ['formatBrix 90', () => formatBrix(90), /^brix .*0 to 85/, 'CRC Handbook sucrose table, 0–85 %, after NBS Circular C440, 1942'],
  ['formatMoney fractional cents', () => formatMoney(1.5, 'USD'), /^cents must be a whole number/, 'ISO 4217:2015'],
  ['formatMoney bad currency', () => formatMoney(100, 'dollars'), /^currency must be a three-letter ISO 4217 code/, 'ISO 4217:2015'],
];

describe('formatters refuse invalid arguments with a RangeError naming the argument and its range', () => {
  it.each(invalid.map(([label, call, message, source]) => [`${label} (${source})`, call, message] as const))('%s', (_label, call, message) => {
    expect(call).toThrow(RangeError);
    expect(call).toThrow(message);
  });
});
