import { describe, expect, it } from 'vitest';
import { collectionStart, decide, recommend } from '@/lib/deliveries/rules';
import { toDeliveryInput, parseNumber } from '@/lib/deliveries/form';
import { DeliveryInput } from '@/lib/deliveries/schema';

// Shelf-life defaults of the co-op settings: common practice (unfrozen sap keeps about a week
// when cold, much less warm; Cornell, "Reducing Maple Sap Spoilage", 2025, on perishability).
const SHELF = { shelfDays: 7, warmAboveC: 7, warmShelfDays: 3 };
const DAY = 86_400_000;
const collectedAt = new Date('2027-03-10T05:00:00Z');
const base = { clarity: 'clear' as const, contamination: 'none' as const, sapTempC: 3, collectedAt, receivedAt: new Date(collectedAt.getTime() + DAY) };

describe('recommend', () => {
  it('accepts clear, clean, cold sap inside its shelf life, with its deadline', () => {
    const r = recommend(base, SHELF);
    expect(r).toMatchObject({ decision: 'accept', causes: [], text: '' });
    expect(r.deadline.getTime()).toBe(collectedAt.getTime() + 7 * DAY);
  });

  it('recommends rejecting cloudy sap (cloudy sap has spoiled: common practice)', () => {
    expect(recommend({ ...base, clarity: 'cloudy' }, SHELF)).toMatchObject({ decision: 'reject', causes: ['cloudy'], text: 'Rejected: cloudy sap.' });
  });

  it('recommends rejecting contaminated and off-odour sap, naming every cause', () => {
    expect(recommend({ ...base, contamination: 'insects' }, SHELF).causes).toEqual(['contaminated']);
    const r = recommend({ ...base, clarity: 'cloudy', contamination: 'off-odour' }, SHELF);
    expect(r.causes).toEqual(['cloudy', 'off-odour']);
    expect(r.text).toBe('Rejected: cloudy sap and an off odour.');
  });

  it('recommends rejecting sap past the shelf life, shorter when it arrives warm', () => {
    expect(recommend({ ...base, receivedAt: new Date(collectedAt.getTime() + 7 * DAY) }, SHELF).causes).toEqual(['past-shelf-life']);
    expect(recommend({ ...base, receivedAt: new Date(collectedAt.getTime() + 7 * DAY - 1) }, SHELF).decision).toBe('accept');
    const warm = recommend({ ...base, sapTempC: 9, receivedAt: new Date(collectedAt.getTime() + 4 * DAY) }, SHELF);
    expect(warm.causes).toEqual(['past-shelf-life']);
    expect(warm.text).toBe('Rejected: warm sap older than 3 days.');
  });
});

describe('decide', () => {
  const ok = { decision: 'accept' as const, text: '' };
  const bad = { decision: 'reject' as const, text: 'Rejected: cloudy sap.' };
  it('follows the recommendation when no decision is given', () => {
    expect(decide(ok, undefined, null)).toEqual({ status: 'accepted', reason: null });
    expect(decide(bad, undefined, null)).toEqual({ status: 'rejected', reason: 'Rejected: cloudy sap.' });
  });
  it('needs a reason to go against the recommendation, and keeps it', () => {
    expect(decide(bad, 'accept', '  ')).toEqual({ needsReason: true });
    expect(decide(bad, 'accept', 'Cold haze only')).toEqual({ status: 'accepted', reason: 'Cold haze only' });
    expect(decide(ok, 'reject', undefined)).toEqual({ needsReason: true });
    expect(decide(ok, 'reject', 'Smells of diesel')).toEqual({ status: 'rejected', reason: 'Smells of diesel' });
  });
});

describe('collectionStart', () => {
  it('is the start of the collection day in the co-op’s zone, across a daylight-saving change', () => {
    expect(collectionStart('2027-03-14', 'America/New_York').toISOString()).toBe('2027-03-14T05:00:00.000Z');
    expect(collectionStart('2027-03-15', 'America/New_York').toISOString()).toBe('2027-03-15T04:00:00.000Z');
  });
});

describe('the form’s conversion to the API body', () => {
  const values = {
    householdId: '6f1c3a52-7a4e-4d0b-9c39-3f1f0a0b9e11',
    volume: '10',
    brix: '2,4',
    sapTemp: '38',
    collectedOn: '2027-03-14',
    clarity: 'clear' as const,
    contamination: 'none' as const,
    decision: '' as const,
    reason: '',
    note: '',
    photoKey: '',
    mixOn: true,
    sugarMaple: '70',
    redMaple: '25',
    other: '5',
  };
  it('converts gallons and °F to litres and °C (1 US gal = 3.785411784 L exactly, NIST Handbook 44)', () => {
    const body = toDeliveryInput(values, 'us', 'key-12345678');
    expect(body.volumeL).toBeCloseTo(37.85411784, 9);
    expect(body.sapTempC).toBeCloseTo((38 - 32) * (5 / 9), 9);
    expect(body.brix).toBe(2.4);
    expect(DeliveryInput.safeParse(body).success).toBe(true);
  });
  it('keeps metric values, and lets the shared schema name what is wrong', () => {
    const body = toDeliveryInput({ ...values, volume: 'abc', sugarMaple: '80' }, 'metric', 'key-12345678');
    expect(body.volumeL).toBeNaN();
    const parsed = DeliveryInput.safeParse(body);
    expect(parsed.success).toBe(false);
    const paths = parsed.error!.issues.map((i) => i.path.join('.'));
    expect(paths).toContain('volumeL');
    expect(paths).toContain('mix.sugarMaple');
  });
  it('reads numbers as people type them', () => {
    expect(parseNumber(' 12.5 ')).toBe(12.5);
    expect(parseNumber('12,5')).toBe(12.5);
    expect(parseNumber('')).toBeNaN();
    expect(parseNumber('1e3')).toBeNaN();
  });
});
