import { fahrenheitToCelsius, gallonsToLitres, type UnitSystem } from '@/lib/sugar';
import type { Clarity, Contamination, Decision } from './schema';

/** What the Drop-off desk form holds: text as typed, in the co-op's display units. */
export interface DeliveryFormValues {
  householdId: string;
  /** Gallons for a US co-op, litres for a metric one. */
  volume: string;
  brix: string;
  /** °F for a US co-op, °C for a metric one. */
  sapTemp: string;
  collectedOn: string;
  clarity: Clarity;
  contamination: Contamination;
  /** '' follows the rules' recommendation. */
  decision: Decision | '';
  reason: string;
  note: string;
  photoKey: string;
  mixOn: boolean;
  sugarMaple: string;
  redMaple: string;
  other: string;
}

/** A number as typed ("12,5" too); NaN when it is not one. */
export function parseNumber(text: string): number {
  const t = text.trim().replace(',', '.');
  return t === '' || !/^[-+]?\d*\.?\d+$|^[-+]?\d+\.$/.test(t) ? NaN : Number(t);
}

/** Form values → the API's body in SI units (litres, °C); validation is the shared schema's job. */
export function toDeliveryInput(v: DeliveryFormValues, units: UnitSystem, idempotencyKey: string) {
  const volume = parseNumber(v.volume);
  const temp = parseNumber(v.sapTemp);
  return {
    householdId: v.householdId,
    volumeL: Number.isNaN(volume) ? volume : units === 'us' ? gallonsToLitres(volume) : volume,
    brix: parseNumber(v.brix),
    sapTempC: Number.isNaN(temp) ? temp : units === 'us' ? fahrenheitToCelsius(temp) : temp,
    collectedOn: v.collectedOn,
    clarity: v.clarity,
    contamination: v.contamination,
    ...(v.decision ? { decision: v.decision } : {}),
    ...(v.reason.trim() ? { reason: v.reason.trim() } : {}),
    ...(v.note.trim() ? { note: v.note.trim() } : {}),
    ...(v.photoKey ? { photoKey: v.photoKey } : {}),
    ...(v.mixOn
      ? { mix: { sugarMaple: parseNumber(v.sugarMaple), redMaple: parseNumber(v.redMaple), other: parseNumber(v.other) } }
      : {}),
    idempotencyKey,
  };
}

/** Where an API field's error shows on the form. */
export const FORM_FIELD_OF: Record<string, keyof DeliveryFormValues> = {
  householdId: 'householdId',
  volumeL: 'volume',
  brix: 'brix',
  sapTempC: 'sapTemp',
  collectedOn: 'collectedOn',
  clarity: 'clarity',
  contamination: 'contamination',
  decision: 'decision',
  reason: 'reason',
  note: 'note',
  photoKey: 'photoKey',
  mix: 'sugarMaple',
  'mix.sugarMaple': 'sugarMaple',
  'mix.redMaple': 'redMaple',
  'mix.other': 'other',
};
