import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DateTime } from 'luxon';
import { type Client, signedIn } from './http';
import { closeTestDb, larkspurHouseholds, rows, testDb } from './db';
import { attachmentText, clearMail, waitForMail } from '../mailbox';
import { formatSlotRange } from '@/lib/time';

const ZONE = 'America/New_York';
let sugarmaker: Client;
let okafor: Client;
let spareId: string;
let okaforId: string;

/** A local wall-clock time `days` ahead in the co-op's zone, as ISO with its offset. */
const at = (days: number, hour: number, minute = 0) =>
  DateTime.now().setZone(ZONE).startOf('day').plus({ days }).set({ hour, minute }).toISO()!;

/** A booked slot of the Okafor household on this file's own evaporator, written straight to the table. */
async function insertSlot(startsAt: DateTime, minutes: number): Promise<string> {
  const [[slot]] = (await testDb().query(
    `INSERT INTO boil_slots (cooperative_id, season_id, evaporator_id, household_id, starts_at, ends_at)
     SELECT s.cooperative_id, s.id, :e, :h, :start, :end FROM seasons s
     WHERE s.status = 'open' AND s.cooperative_id = (SELECT cooperative_id FROM evaporators WHERE id = :e) RETURNING id`,
    { replacements: { e: spareId, h: okaforId, start: startsAt.toISO(), end: startsAt.plus({ minutes }).toISO() } },
  )) as [{ id: string }[], unknown];
  return slot.id;
}

const slotRow = async (id: string) =>
  (await rows<{ starts_at: Date; ends_at: Date; status: string; revision: number }>('SELECT starts_at, ends_at, status, revision FROM boil_slots WHERE id = :id', { id }))[0];

beforeAll(async () => {
  sugarmaker = await signedIn('sugarmaker@larkspur.example');
  okafor = await signedIn('okafor@larkspur.example');
  okaforId = (await larkspurHouseholds()).Okafor;
  // An evaporator of this file's own, so its slots cannot meet the demo bookings or other tests'.
  const [[spare]] = (await testDb().query(
    `INSERT INTO evaporators (cooperative_id, name, evaporation_lph, fuel_kind)
     SELECT cooperative_id, 'Rules test arch', 40, 'wood' FROM households WHERE id = :h RETURNING id`,
    { replacements: { h: okaforId } },
  )) as [{ id: string }[], unknown];
  spareId = spare.id;
});

afterAll(closeTestDb);

describe('moving a slot follows the rules of cancelling it', () => {
  it('refuses a member’s move inside the notice window with 422, as a cancel, and changes nothing', async () => {
    const id = await insertSlot(DateTime.now().setZone(ZONE).plus({ hours: 3 }), 60);
    const before = await slotRow(id);
    const move = await okafor.patch(`/api/slots/${id}`, { startsAt: at(5, 9), endsAt: at(5, 11) });
    expect(move.status).toBe(422);
    expect(move.body.error.message).toMatch(/12 hours before/);
    expect(move.body.error.fields.startsAt).toBeTruthy();
    const cancel = await okafor.delete(`/api/slots/${id}`);
    expect(cancel.status).toBe(422);
    expect(await slotRow(id)).toEqual(before);
    // A sugarmaker may still move it.
    expect((await sugarmaker.patch(`/api/slots/${id}`, { startsAt: at(5, 9), endsAt: at(5, 11) })).status).toBe(200);
  });

  it('refuses a member’s move of a past slot still marked booked', async () => {
    const id = await insertSlot(DateTime.now().setZone(ZONE).minus({ days: 1 }).set({ hour: 10, minute: 0 }), 60);
    const move = await okafor.patch(`/api/slots/${id}`, { startsAt: at(6, 9), endsAt: at(6, 11) });
    expect(move.status).toBe(422);
    expect((await slotRow(id)).status).toBe('booked');
    expect((await okafor.delete(`/api/slots/${id}`)).status).toBe(422);
  });

  it('lets a member move their slot well before its start', async () => {
    const id = await insertSlot(DateTime.now().setZone(ZONE).startOf('day').plus({ days: 7, hours: 9 }), 120);
    const move = await okafor.patch(`/api/slots/${id}`, { startsAt: at(7, 13), endsAt: at(7, 15) });
    expect(move.status).toBe(200);
    expect(move.body.startsAt).toBe(DateTime.fromISO(at(7, 13), { zone: ZONE }).toISO());
  });
});

describe('the revision of a slot and the SEQUENCE of its calendar file', () => {
  const sequenceOf = async (subject: string) => {
    const mail = await waitForMail({ to: 'okafor@larkspur.example', subject });
    const ics = await attachmentText(mail, 'boil-slot.ics');
    const m = /^SEQUENCE:(\d+)\r?$/m.exec(ics);
    if (!m) throw new Error(`no SEQUENCE in:\n${ics}`);
    return Number(m[1]);
  };

  it('rises with every change, and the e-mailed .ics carries it', async () => {
    await clearMail();
    const booked = await okafor.post('/api/slots', { evaporatorId: spareId, startsAt: at(9, 9), endsAt: at(9, 11) });
    expect(booked.status).toBe(201);
    const id = booked.body.id as string;
    const seq: number[] = [await sequenceOf(`Boil slot booked: ${formatSlotRange(at(9, 9), at(9, 11), ZONE)}`)];
    expect(seq[0]).toBe((await slotRow(id)).revision);

    expect((await okafor.patch(`/api/slots/${id}`, { startsAt: at(9, 12), endsAt: at(9, 14) })).status).toBe(200);
    seq.push(await sequenceOf(`Boil slot moved: ${formatSlotRange(at(9, 12), at(9, 14), ZONE)}`));

    // A change of crew sends no e-mail but is a change all the same.
    expect((await okafor.patch(`/api/slots/${id}`, { crew: ['Adaeze Okafor'] })).status).toBe(200);
    const afterCrew = (await slotRow(id)).revision;
    expect(afterCrew).toBeGreaterThan(seq[1]);

    expect((await sugarmaker.patch(`/api/slots/${id}`, { startsAt: at(10, 9), endsAt: at(10, 10) })).status).toBe(200);
    seq.push(await sequenceOf(`Boil slot moved: ${formatSlotRange(at(10, 9), at(10, 10), ZONE)}`));

    // Cancelled a moment after the move: its file still says it is the newer one.
    expect((await okafor.delete(`/api/slots/${id}`)).status).toBe(200);
    seq.push(await sequenceOf(`Boil slot cancelled: ${formatSlotRange(at(10, 9), at(10, 10), ZONE)}`));

    expect(seq[0]).toBe(0);
    for (let i = 1; i < seq.length; i++) expect(seq[i]).toBeGreaterThan(seq[i - 1]);
    expect(seq[2]).toBeGreaterThan(afterCrew);
    expect(seq.at(-1)).toBe((await slotRow(id)).revision);
  });
});
