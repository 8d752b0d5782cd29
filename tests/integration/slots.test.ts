import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DateTime } from 'luxon';
import { Client, signedIn } from './http';
import { closeTestDb, larkspurHouseholds, rows, testDb } from './db';
import { attachmentText, clearMail, waitForMail } from '../mailbox';
import { formatSlotRange } from '@/lib/time';

const ZONE = 'America/New_York';
let sugarmaker: Client;
let okafor: Client;
let lindqvist: Client;
let evaporatorId: string;
let households: Record<string, string>;

/** A local wall-clock time `days` ahead in the co-op's zone, as ISO with its offset. */
const at = (days: number, hour: number, minute = 0) =>
  DateTime.now().setZone(ZONE).startOf('day').plus({ days }).set({ hour, minute }).toISO()!;

/** Live slots on the demo co-op's evaporator in a time window (other suites' co-ops share the database). */
const slotRows = (from: string, to: string) =>
  rows("SELECT id FROM boil_slots WHERE evaporator_id = :e AND status <> 'cancelled' AND starts_at < :to AND ends_at > :from", { from, to, e: evaporatorId });

beforeAll(async () => {
  sugarmaker = await signedIn('sugarmaker@larkspur.example');
  okafor = await signedIn('okafor@larkspur.example');
  lindqvist = await signedIn('lindqvist@larkspur.example');
  evaporatorId = (await okafor.get('/api/evaporators')).body[0].id;
  households = await larkspurHouseholds();
});

afterAll(closeTestDb);

describe('booking a slot', () => {
  it('20 concurrent bookings of overlapping times give one 201, nineteen 409s and one row', async () => {
    const startsAt = at(15, 8);
    const results = await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        sugarmaker.post('/api/slots', {
          evaporatorId,
          householdId: Object.values(households)[i % 7],
          startsAt: at(15, 8, (i % 4) * 15),
          endsAt: at(15, 11),
        }),
      ),
    );
    const statuses = results.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 201)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(19);
    const conflict = results.find((r) => r.status === 409)!;
    expect(conflict.body.error.message).toMatch(/overlaps the .+ household’s slot/);
    expect(conflict.body.error.conflict.id).toBe(results.find((r) => r.status === 201)!.body.id);
    expect(await slotRows(startsAt, at(15, 11))).toHaveLength(1);
  });

  it('allows a slot that ends when the next starts', async () => {
    const a = await okafor.post('/api/slots', { evaporatorId, startsAt: at(16, 8), endsAt: at(16, 10) });
    expect(a.status).toBe(201);
    const b = await lindqvist.post('/api/slots', { evaporatorId, startsAt: at(16, 10), endsAt: at(16, 12) });
    expect(b.status).toBe(201);
    expect(b.body.householdName).toBe('Lindqvist');
  });

  it('frees the time of a cancelled slot', async () => {
    const a = await okafor.post('/api/slots', { evaporatorId, startsAt: at(17, 14), endsAt: at(17, 16) });
    expect(a.status).toBe(201);
    expect((await lindqvist.post('/api/slots', { evaporatorId, startsAt: at(17, 15), endsAt: at(17, 17) })).status).toBe(409);
    expect((await lindqvist.delete(`/api/slots/${a.body.id}`)).status).toBe(403);
    const cancel = await okafor.delete(`/api/slots/${a.body.id}`);
    expect(cancel.status).toBe(200);
    expect(cancel.body.status).toBe('cancelled');
    const b = await lindqvist.post('/api/slots', { evaporatorId, startsAt: at(17, 15), endsAt: at(17, 17) });
    expect(b.status).toBe(201);
  });

  it('refuses a member booking for another household (403) or outside the season (422)', async () => {
    const other = await okafor.post('/api/slots', { evaporatorId, householdId: households.Brennan, startsAt: at(18, 8), endsAt: at(18, 10) });
    expect(other.status).toBe(403);
    const outside = await okafor.post('/api/slots', { evaporatorId, startsAt: at(40, 8), endsAt: at(40, 10) });
    expect(outside.status).toBe(422);
    expect(outside.body.error.fields.startsAt).toMatch(/season/);
    const night = await okafor.post('/api/slots', { evaporatorId, startsAt: at(18, 3), endsAt: at(18, 5) });
    expect(night.status).toBe(422);
    expect(night.body.error.fields.startsAt).toMatch(/06:00–22:00/);
    expect(await slotRows(at(18, 0), at(18, 23))).toHaveLength(0);
  });

  it('answers 422 with a message per field for bad input, and writes nothing', async () => {
    const before = (await rows('SELECT id FROM boil_slots')).length;
    const r = await okafor.post('/api/slots', { evaporatorId: 'nope', startsAt: 'tomorrow', endsAt: at(19, 9), expectedSapL: -5 });
    expect(r.status).toBe(422);
    expect(Object.keys(r.body.error.fields).sort()).toEqual(['evaporatorId', 'expectedSapL', 'startsAt']);
    const backwards = await okafor.post('/api/slots', { evaporatorId, startsAt: at(19, 10), endsAt: at(19, 9) });
    expect(backwards.status).toBe(422);
    expect(backwards.body.error.fields.endsAt).toMatch(/end after/);
    const tooLong = await okafor.post('/api/slots', { evaporatorId, startsAt: at(19, 6), endsAt: at(19, 20) });
    expect(tooLong.status).toBe(422);
    expect(tooLong.body.error.fields.endsAt).toMatch(/1 to 12 hours/);
    expect((await rows('SELECT id FROM boil_slots')).length).toBe(before);
    expect((await new Client().post('/api/slots', { evaporatorId, startsAt: at(19, 8), endsAt: at(19, 9) })).status).toBe(401);
  });

  it('e-mails the household a confirmation with an .ics, and a notice when moved or cancelled', async () => {
    await clearMail();
    const r = await okafor.post('/api/slots', { evaporatorId, startsAt: at(20, 9), endsAt: at(20, 12), crew: ['Adaeze Okafor'] });
    expect(r.status).toBe(201);
    // Mail from earlier tests may still be on its way: wait for this slot's own subject.
    const when = formatSlotRange(at(20, 9), at(20, 12), ZONE);
    const mail = await waitForMail({ to: 'okafor@larkspur.example', subject: `Boil slot booked: ${when}` });
    const ics = await attachmentText(mail, 'boil-slot.ics');
    expect(ics).toContain('BEGIN:VCALENDAR');
    const utc = DateTime.fromISO(at(20, 9)).toUTC().toFormat("yyyyMMdd'T'HHmmss'Z'");
    expect(ics).toContain(`DTSTART:${utc}`);

    const moved = await okafor.patch(`/api/slots/${r.body.id}`, { startsAt: at(20, 13), endsAt: at(20, 15), note: 'Bring dry wood' });
    expect(moved.status).toBe(200);
    expect(moved.body.note).toBe('Bring dry wood');
    const movedTo = formatSlotRange(at(20, 13), at(20, 15), ZONE);
    await waitForMail({ to: 'okafor@larkspur.example', subject: `Boil slot moved: ${movedTo}` });
    expect((await okafor.delete(`/api/slots/${r.body.id}`)).status).toBe(200);
    const cancelled = await waitForMail({ to: 'okafor@larkspur.example', subject: `Boil slot cancelled: ${movedTo}` });
    expect(await attachmentText(cancelled, 'boil-slot.ics')).toContain('STATUS:CANCELLED');
  });

  it('shows other households’ slots by household name only', async () => {
    const r = await okafor.post('/api/slots', { evaporatorId, startsAt: at(21, 9), endsAt: at(21, 11), crew: ['Adaeze Okafor'], note: 'Our turn' });
    expect(r.status).toBe(201);
    const seen = (await lindqvist.get(`/api/slots?from=${encodeURIComponent(at(21, 0))}&to=${encodeURIComponent(at(22, 0))}`)).body;
    const slot = seen.find((s: { id: string }) => s.id === r.body.id);
    expect(slot).toMatchObject({ householdName: 'Okafor', crew: [], note: null, editable: false });
  });

  it('lists a booking, a move and a cancellation at once to staff and members (the kept lists follow every change)', async () => {
    const range = `from=${encodeURIComponent(at(23, 0))}&to=${encodeURIComponent(at(24, 0))}`;
    const listed = async (who: Client) => {
      const res = await who.get(`/api/slots?${range}`);
      expect(res.status).toBe(200);
      return res.body as { id: string; startsAt: string; status: string; note: string | null }[];
    };
    // Read first, so a list of this range is kept before the changes.
    for (const who of [sugarmaker, okafor, lindqvist]) await listed(who);
    const r = await okafor.post('/api/slots', { evaporatorId, startsAt: at(23, 9), endsAt: at(23, 11), note: 'Kept list check' });
    expect(r.status).toBe(201);
    for (const who of [sugarmaker, okafor, lindqvist]) expect((await listed(who)).map((x) => x.id)).toContain(r.body.id);
    // Its own household sees the note; another household does not.
    expect((await listed(okafor)).find((x) => x.id === r.body.id)?.note).toBe('Kept list check');
    expect((await listed(lindqvist)).find((x) => x.id === r.body.id)?.note).toBeNull();
    expect((await okafor.patch(`/api/slots/${r.body.id}`, { startsAt: at(23, 13), endsAt: at(23, 15) })).status).toBe(200);
    for (const who of [sugarmaker, okafor, lindqvist]) {
      expect(DateTime.fromISO((await listed(who)).find((x) => x.id === r.body.id)!.startsAt).toMillis()).toBe(DateTime.fromISO(at(23, 13)).toMillis());
    }
    expect((await okafor.delete(`/api/slots/${r.body.id}`)).status).toBe(200);
    for (const who of [sugarmaker, okafor, lindqvist]) expect((await listed(who)).find((x) => x.id === r.body.id)?.status ?? 'cancelled').toBe('cancelled');
  });

  it('does not let a member cancel inside the notice period', async () => {
    const soon = DateTime.now().setZone(ZONE).plus({ hours: 3 });
    // A second evaporator of its own, so this slot cannot meet the demo bookings.
    const [[spare]] = (await testDb().query(
      `INSERT INTO evaporators (cooperative_id, name, evaporation_lph, fuel_kind)
       SELECT cooperative_id, 'Spare arch', 40, 'wood' FROM evaporators WHERE id = :e RETURNING id`,
      { replacements: { e: evaporatorId } },
    )) as [{ id: string }[], unknown];
    const [{ id }] = (await testDb().query(
      `INSERT INTO boil_slots (cooperative_id, season_id, evaporator_id, household_id, starts_at, ends_at)
       SELECT s.cooperative_id, s.id, :e, :h, :start, :end FROM seasons s WHERE s.status = 'open' AND s.cooperative_id =
         (SELECT cooperative_id FROM evaporators WHERE id = :e) RETURNING id`,
      { replacements: { e: spare.id, h: households.Okafor, start: soon.toISO(), end: soon.plus({ minutes: 30 }).toISO() } },
    ))[0] as { id: string }[];
    const r = await okafor.delete(`/api/slots/${id}`);
    expect(r.status).toBe(422);
    expect(r.body.error.message).toMatch(/12 hours before/);
    expect((await sugarmaker.delete(`/api/slots/${id}`)).status).toBe(200);
  });
});

/**
 * The next spring change of clock in the co-op's zone at least 60 days ahead (so a season around it
 * stays clear of the demo season around today): the day the UTC offset grows.
 */
function nextSpringChange(): DateTime {
  const soon = DateTime.now().setZone(ZONE).plus({ days: 60 });
  for (let year = soon.year; ; year++) {
    for (let d = DateTime.fromObject({ year, month: 3, day: 1 }, { zone: ZONE }); d.month === 3; d = d.plus({ days: 1 })) {
      if (d.endOf('day').offset > d.offset && d > soon) return d;
    }
  }
}

describe('daylight-saving time', () => {
  it('keeps the wall-clock start and end across the spring change in the co-op’s zone', async () => {
    // In America/New_York 02:00 EST becomes 03:00 EDT on the second Sunday of March (IANA tz database).
    const change = nextSpringChange();
    const eve = change.minus({ days: 1 });
    const ymd = (d: DateTime) => d.toISODate()!;
    const [{ cooperative_id }] = await rows<{ cooperative_id: string }>('SELECT cooperative_id FROM evaporators WHERE id = :e', { e: evaporatorId });
    await testDb().query(
      `INSERT INTO seasons (cooperative_id, label, starts_on, ends_on, status) VALUES (:c, :label, :from, :to, 'planned')`,
      { replacements: { c: cooperative_id, label: `Season ${change.year} (spring)`, from: ymd(change.minus({ days: 22 })), to: ymd(change.plus({ days: 27 })) } },
    );
    const overnight = await sugarmaker.post('/api/slots', {
      evaporatorId,
      householdId: households.Nakamura,
      startsAt: `${ymd(eve)}T22:00:00-05:00`,
      endsAt: `${ymd(change)}T06:00:00-04:00`,
    });
    expect(overnight.status).toBe(201);
    expect(overnight.body.startsAt).toBe(`${ymd(eve)}T22:00:00.000-05:00`);
    expect(overnight.body.endsAt).toBe(`${ymd(change)}T06:00:00.000-04:00`);
    const [{ hours }] = await rows<{ hours: number }>('SELECT extract(epoch FROM ends_at - starts_at) / 3600 AS hours FROM boil_slots WHERE id = :id', { id: overnight.body.id });
    expect(Number(hours)).toBe(7);

    // Booked in winter time for a day after the change: 09:00–13:00 stays 09:00–13:00 local.
    const after = change.plus({ days: 2 });
    const day = DateTime.fromObject({ year: after.year, month: after.month, day: after.day, hour: 9 }, { zone: ZONE });
    const member = await okafor.post('/api/slots', { evaporatorId, startsAt: day.toISO(), endsAt: day.plus({ hours: 4 }).toISO() });
    expect(member.status).toBe(201);
    const listed = (await okafor.get(`/api/slots?from=${ymd(eve)}&to=${ymd(change.plus({ days: 3 }))}`)).body as { id: string; startsAt: string; endsAt: string }[];
    const mine = listed.find((s) => s.id === member.body.id)!;
    expect(mine.startsAt).toBe(`${ymd(after)}T09:00:00.000-04:00`);
    expect(mine.endsAt).toBe(`${ymd(after)}T13:00:00.000-04:00`);
    expect(listed.find((s) => s.id === overnight.body.id)!.startsAt).toBe(`${ymd(eve)}T22:00:00.000-05:00`);
  });
});
