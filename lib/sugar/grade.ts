import { numberInRange } from './guards';

/** Colour classes of Grade A maple syrup, lightest first. */
export type GradeClass = 'golden' | 'amber' | 'dark' | 'very-dark';

export const GRADE_CLASSES: readonly GradeClass[] = ['golden', 'amber', 'dark', 'very-dark'];

export interface GradeClassInfo {
  /** Class name as the standard prints it. */
  name: string;
  /** Flavour descriptor the standard pairs with the class. */
  taste: string;
  /** Light transmittance range, as text. */
  rangeText: string;
  /** Lowest %Tc in the class (inclusive). */
  minTc: number;
}

/**
 * Display information per class, from the United States Standards for Grades of Maple
 * Syrup (USDA AMS, Federal Register 80(19), 2015); Canada's Maple Products Regulations
 * use the same four classes and limits. %Tc is light transmittance at 560 nm through
 * 10 mm, against glycerol = 100 %.
 */
export const GRADE_CLASS_INFO: Readonly<Record<GradeClass, GradeClassInfo>> = Object.freeze({
  golden: { name: 'Golden Color', taste: 'Delicate Taste', rangeText: '75.0 %Tc or more', minTc: 75 },
  amber: { name: 'Amber Color', taste: 'Rich Taste', rangeText: '50.0–74.9 %Tc', minTc: 50 },
  dark: { name: 'Dark Color', taste: 'Robust Taste', rangeText: '25.0–49.9 %Tc', minTc: 25 },
  'very-dark': { name: 'Very Dark Color', taste: 'Strong Taste', rangeText: 'less than 25.0 %Tc', minTc: 0 },
});

/**
 * Colour class for a light transmittance reading (%Tc, 0–100): Golden ≥ 75.0,
 * Amber 50.0–74.9, Dark 25.0–49.9, Very Dark < 25.0 (USDA 2015).
 */
export function gradeClass(transmittancePct: number): GradeClass {
  numberInRange('transmittancePct', transmittancePct, 0, 100);
  if (transmittancePct >= 75) return 'golden';
  if (transmittancePct >= 50) return 'amber';
  if (transmittancePct >= 25) return 'dark';
  return 'very-dark';
}
