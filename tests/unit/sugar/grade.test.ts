import { describe, expect, it } from 'vitest';
import { GRADE_CLASSES, GRADE_CLASS_INFO, gradeClass } from '@/lib/sugar';

// United States Standards for Grades of Maple Syrup, USDA AMS, Federal Register 80(19),
// 29 Jan 2015: Golden ≥ 75.0 %Tc, Amber 50.0–74.9, Dark 25.0–49.9, Very Dark < 25.0.
describe('gradeClass (USDA AMS, United States Standards for Grades of Maple Syrup, 2015)', () => {
  it.each([
    { tc: 100, expected: 'golden' },
    { tc: 75.0, expected: 'golden' },
    { tc: 74.9, expected: 'amber' },
    { tc: 50.0, expected: 'amber' },
    { tc: 49.9, expected: 'dark' },
    { tc: 25.0, expected: 'dark' },
    { tc: 24.9, expected: 'very-dark' },
    { tc: 0, expected: 'very-dark' },
    { tc: 62.3, expected: 'amber' },
    { tc: 80.5, expected: 'golden' },
    { tc: 10, expected: 'very-dark' },
  ] as const)('transmittance $tc is $expected (USDA AMS, United States Standards for Grades of Maple Syrup, 2015)', ({ tc, expected }) => {
    expect(gradeClass(tc)).toBe(expected);
  });

  it('lists the four classes lightest first (USDA AMS, United States Standards for Grades of Maple Syrup, 2015)', () => {
    expect(GRADE_CLASSES).toEqual(['golden', 'amber', 'dark', 'very-dark']);
  });

  it("carries the standard's names, taste words and ranges (USDA AMS, United States Standards for Grades of Maple Syrup, 2015)", () => {
    expect(GRADE_CLASS_INFO.golden).toMatchObject({ name: 'Golden Color', taste: 'Delicate Taste', rangeText: '75.0 %Tc or more' });
    expect(GRADE_CLASS_INFO.amber).toMatchObject({ name: 'Amber Color', taste: 'Rich Taste', rangeText: '50.0–74.9 %Tc' });
    expect(GRADE_CLASS_INFO.dark).toMatchObject({ name: 'Dark Color', taste: 'Robust Taste', rangeText: '25.0–49.9 %Tc' });
    expect(GRADE_CLASS_INFO['very-dark']).toMatchObject({ name: 'Very Dark Color', taste: 'Strong Taste', rangeText: 'less than 25.0 %Tc' });
  });

  it('each class starts where gradeClass says it does (USDA AMS, United States Standards for Grades of Maple Syrup, 2015)', () => {
    for (const c of GRADE_CLASSES) expect(gradeClass(GRADE_CLASS_INFO[c].minTc)).toBe(c);
  });
});
