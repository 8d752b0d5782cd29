import { beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from './http';
import { boilHours, sugarKg, syrupLitres } from '@/lib/sugar';

let member: Client;
beforeAll(async () => {
  member = await signedIn('ferreira@larkspur.example');
});

describe('GET /api/estimate', () => {
  it('gives the sugar, syrup and boiling of a lot at the co-op’s evaporator rate', async () => {
    const r = await member.get('/api/estimate?volumeL=400&brix=2.2');
    expect(r.status).toBe(200);
    // 400 L at 2.2 °Bx: density 1.00678 g/cm³ interpolated between the CRC rows for 2 and 3 °Bx (1.0060, 1.0099) → 8.86 kg of sucrose.
    expect(r.body.sugarKg).toBeCloseTo(sugarKg(400, 2.2), 9);
    expect(r.body.sugarKg).toBeCloseTo(8.86, 2);
    expect(r.body.syrupL).toBeCloseTo(syrupLitres(400, 2.2, 66.9), 9);
    expect(r.body.boilHours).toBeCloseTo(boilHours(400, 2.2, 150, 66.9), 9);
    expect(r.body.waterL).toBeGreaterThan(380);
    // About 40 L of sap to a litre of syrup at 2.2 °Bx (rule of 86: 86 / 2.2 = 39.1).
    expect(r.body.ratio).toBeGreaterThan(38);
    expect(r.body.ratio).toBeLessThan(41);
  });

  it('answers 400 with a message naming the bad value', async () => {
    const r = await member.get('/api/estimate?volumeL=-3&brix=abc');
    expect(r.status).toBe(400);
    expect(r.body.error.fields.volumeL).toMatch(/at least 0/);
    expect(r.body.error.fields.brix).toMatch(/number/);
    const high = await member.get('/api/estimate?volumeL=10&brix=90');
    expect(high.status).toBe(400);
    expect(high.body.error.fields.brix).toMatch(/at most 85/);
    expect((await new Client().get('/api/estimate?volumeL=1&brix=2')).status).toBe(401);
  });
});
