import { describe, expect, it } from 'vitest';
import { digitsFor, showBrix, showMass, showRate, showSyrup, showTemperature, showVolume } from '@/lib/figures';

// Conversion factors: 1 US gallon = 3.785411784 L and 1 lb = 0.45359237 kg exactly (NIST Special
// Publication 811, Guide for the Use of the International System of Units, NIST, 2008, appendix B).

describe('digitsFor', () => {
  it('shows sap volumes and sugar masses to 0.01 below 10 and to 0.1 from 10 up', () => {
    expect(digitsFor('volume', 9.5)).toBe(2);
    expect(digitsFor('volume', 10)).toBe(1);
    expect(digitsFor('volume', 5147.3)).toBe(1);
    expect(digitsFor('mass', 8.17)).toBe(2);
    expect(digitsFor('mass', 190.44)).toBe(1);
    // 9.996 would round to "10.00": it is shown as "10.0" like the tens above it.
    expect(digitsFor('volume', 9.996)).toBe(1);
    expect(digitsFor('volume', 0)).toBe(1);
  });

  it('keeps syrup to the hundredth, temperatures and °Brix to the tenth', () => {
    expect(digitsFor('syrup', 0.5)).toBe(2);
    expect(digitsFor('syrup', 117.69)).toBe(2);
    expect(digitsFor('temperature', 219.234)).toBe(1);
    expect(digitsFor('brix', 2.654)).toBe(1);
  });

  it('gives rates three significant figures up to the hundreds', () => {
    expect(digitsFor('rate', 4.2)).toBe(2);
    expect(digitsFor('rate', 39.63)).toBe(1);
    expect(digitsFor('rate', 150)).toBe(0);
  });
});

describe('figures as shown', () => {
  it('shows a rated 150 L/h evaporator as 39.6 gal/h (150 / 3.785411784 = 39.626)', () => {
    expect(showRate(150, 'us')).toBe('39.6 gal/h');
    expect(showRate(150, 'metric')).toBe('150 L/h');
    expect(showRate(30, 'metric')).toBe('30.0 L/h');
  });

  it('shows 1,456.2 L of sap waiting as 384.7 gal (1456.2 / 3.785411784 = 384.69)', () => {
    expect(showVolume(1456.2, 'us')).toBe('384.7 gal');
    expect(showVolume(1456.2, 'metric')).toBe('1,456.2 L');
    // 30 L = 7.925 gal: a small volume keeps its hundredths.
    expect(showVolume(30, 'us')).toBe('7.93 gal');
  });

  it('shows syrup to the hundredth: 5.678 L = 1.50 gal (5.678 / 3.785411784 = 1.49997)', () => {
    expect(showSyrup(5.678, 'us')).toBe('1.50 gal');
    expect(showSyrup(12.74, 'metric')).toBe('12.74 L');
  });

  it('shows 86.38 kg of sugar as 190.4 lb (86.38 / 0.45359237 = 190.435) and 3.706 kg as 8.17 lb', () => {
    expect(showMass(86.38, 'us')).toBe('190.4 lb');
    expect(showMass(3.706, 'us')).toBe('8.17 lb');
    expect(showMass(86.38, 'metric')).toBe('86.4 kg');
  });

  it('shows temperatures to the tenth: 104 °C = 219.2 °F (104 × 9/5 + 32)', () => {
    expect(showTemperature(104, 'us')).toBe('219.2 °F');
    expect(showTemperature(3.456, 'metric')).toBe('3.5 °C');
  });

  it('shows °Brix to the tenth', () => {
    expect(showBrix(2.654)).toBe('2.7 °Bx');
    expect(showBrix(66.9)).toBe('66.9 °Bx');
  });
});
