import { beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn } from './http';

let member: Client;
beforeAll(async () => {
  member = await signedIn('ferreira@larkspur.example');
});

// Check values computed here from published figures only, never from lib/sugar:
// CRC Handbook of Chemistry and Physics, sucrose solutions at 20 °C (after NBS Circular
// C440, 1942): 2 °Bx 1.0060, 3 °Bx 1.0099, 66 °Bx 1.3224, 68 °Bx 1.3348 g/cm³.
const crc = (lo: number, hi: number, rhoLo: number, rhoHi: number, brix: number) => rhoLo + ((rhoHi - rhoLo) * (brix - lo)) / (hi - lo);
const SAP_DENSITY = crc(2, 3, 1.006, 1.0099, 2.2); // 1.00678
const SYRUP_DENSITY = crc(66, 68, 1.3224, 1.3348, 66.9); // 1.32798
const SAP_SUGAR_KG = 400 * SAP_DENSITY * 0.022; // 8.8597 kg
const SYRUP_L = SAP_SUGAR_KG / (SYRUP_DENSITY * 0.669); // 9.972 L
const WATER_KG = 400 * SAP_DENSITY - SYRUP_L * SYRUP_DENSITY; // 389.5 kg

describe('GET /api/estimate', () => {
  it('gives the sugar, syrup, water and boiling of a lot at the co-op’s 66.9 °Brix and 150 L/h evaporator (CRC Handbook densities, NBS Circular C440, 1942)', async () => {
    const r = await member.get('/api/estimate?volumeL=400&brix=2.2');
    expect(r.status).toBe(200);
    expect(Math.abs(r.body.sugarKg - SAP_SUGAR_KG)).toBeLessThan(0.005);
    expect(Math.abs(r.body.syrupL / SYRUP_L - 1)).toBeLessThan(0.002);
    expect(Math.abs(r.body.waterL - WATER_KG)).toBeLessThan(0.5);
    expect(Math.abs(r.body.boilHours - WATER_KG / 150)).toBeLessThan(0.005);
    expect(Math.abs(r.body.ratio - 400 / SYRUP_L)).toBeLessThan(0.1);
  });

  it('agrees with the rule of 86 within 2 % (OSU Extension Bulletin 856, 2006): 86 / 2.2 = 39.1 L of sap a litre of syrup, 400 − 400/39.1 L of water', async () => {
    const r = await member.get('/api/estimate?volumeL=400&brix=2.2&syrupBrix=65.5');
    expect(r.status).toBe(200);
    const sapPerSyrup = 86 / 2.2;
    expect(Math.abs(r.body.ratio / sapPerSyrup - 1)).toBeLessThan(0.02);
    expect(Math.abs(r.body.syrupL / (400 / sapPerSyrup) - 1)).toBeLessThan(0.02);
    expect(Math.abs(r.body.waterL / (400 - 400 / sapPerSyrup) - 1)).toBeLessThan(0.02);
  });

  it('agrees with the revised Jones rule for 66.0 °Brix syrup within 1 % (UVM Extension, “Sap pricing”, year not verified): 87.1 / 2.2 − 0.32 = 39.27', async () => {
    const r = await member.get('/api/estimate?volumeL=400&brix=2.2&syrupBrix=66');
    expect(r.status).toBe(200);
    expect(Math.abs(r.body.ratio / (87.1 / 2.2 - 0.32) - 1)).toBeLessThan(0.01);
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
