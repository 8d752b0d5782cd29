import { DateTime } from 'luxon';
import type { Page } from '@playwright/test';
import { SignInPage, expect, test } from './fixtures';
import { attachmentText, clearMail, waitForMail } from '../mailbox';

// The demo co-op's zone; demo slots sit at 07:00–12:00 or 13:00–19:00, so the evening is free.
const ZONE = 'America/New_York';
const DAYS_AHEAD = 4;

// Several sign-ins, page loads and e-mails per test: a shared two-core machine needs more than the default minute.
test.describe.configure({ timeout: 240_000 });

const bookingDay = () => DateTime.now().setZone(ZONE).startOf('day').plus({ days: DAYS_AHEAD });

/** Opens the Boil calendar in day view on the booking day, with live updates connected. */
async function openBookingDay(page: Page, day: DateTime) {
  await page.goto('/calendar');
  // A loaded two-core machine can take many seconds to hydrate the calendar before the socket opens.
  await expect(page.getByTestId('live-status')).toHaveAttribute('data-status', 'live', { timeout: 45_000 });
  await page.getByRole('button', { name: 'Day', exact: true }).click();
  await page.getByRole('button', { name: 'Today', exact: true }).click();
  const ahead = Math.round(day.diff(DateTime.now().setZone(ZONE).startOf('day'), 'days').days);
  for (let i = 0; i < ahead; i++) await page.getByRole('button', { name: 'Next day' }).click();
  await expect(page.locator(`.fc-timegrid-col[data-date="${day.toISODate()}"]`)).toBeVisible();
  await expect(page.getByRole('heading', { name: day.toFormat('cccc d LLLL yyyy') })).toBeVisible();
}

/** Drags out a selection on the time grid, from the start of one half-hour row to the end of another. */
async function dragTime(page: Page, from: string, lastRow: string) {
  const first = page.locator(`td.fc-timegrid-slot-lane[data-time="${from}:00"]`);
  const last = page.locator(`td.fc-timegrid-slot-lane[data-time="${lastRow}:00"]`);
  await first.scrollIntoViewIfNeeded();
  await last.scrollIntoViewIfNeeded();
  const a = (await first.boundingBox())!;
  const b = (await last.boundingBox())!;
  await page.mouse.move(a.x + a.width / 2, a.y + a.height / 2);
  await page.mouse.down();
  await page.mouse.move(a.x + a.width / 2, (a.y + b.y) / 2 + a.height / 2, { steps: 5 });
  await page.mouse.move(b.x + b.width / 2, b.y + b.height / 2, { steps: 5 });
  await page.mouse.up();
}

const slotEvent = (page: Page, household: string) =>
  page.locator('.fc-event', { hasText: `${household} household` }).filter({ hasText: '19:30 – 21:30' });

test('members book a boil slot on the calendar, meet a clash, and free the time by cancelling', async ({ page, signInAs, browser }) => {
  await clearMail();
  const day = bookingDay();
  const startUtc = day.set({ hour: 19, minute: 30 }).toUTC().toFormat("yyyyMMdd'T'HHmmss'Z'");

  // The first member books by dragging out 19:30–21:30 on the time grid.
  await signInAs('nakamura@larkspur.example');
  await openBookingDay(page, day);
  await dragTime(page, '19:30', '21:00');

  const booking = page.getByRole('dialog', { name: 'Book a boil slot' });
  await expect(booking).toBeVisible();
  await expect(booking.getByLabel('Start date')).toHaveValue(day.toISODate()!);
  await expect(booking.getByLabel('Start time')).toHaveValue('19:30');
  await expect(booking.getByLabel('End time')).toHaveValue('21:30');
  await expect(booking.getByText('Nakamura (your household)')).toBeVisible();
  await booking.getByLabel('Crew').fill('Hiroko Nakamura, Ren Nakamura');
  await booking.getByLabel('Expected sap (gal)').fill('150');
  await booking.getByLabel('Note (optional)').fill('Evening boil after the day’s gathering.');
  await booking.getByRole('button', { name: 'Book this slot' }).click();
  await expect(booking).toBeHidden();

  const ownEvent = page.getByRole('button', { name: /19:30 – 21:30\s*Nakamura household\s*Your household/ });
  await expect(ownEvent).toBeVisible();
  await expect(slotEvent(page, 'Nakamura')).not.toContainText('Booking…');

  // The confirmation e-mail carries the slot as an iCalendar file, in UTC.
  const mail = await waitForMail({ to: 'nakamura@larkspur.example', subject: `Boil slot booked: ${day.toFormat('ccc d LLL')}, 19:30` });
  const ics = await attachmentText(mail, 'boil-slot.ics');
  expect(ics).toContain('BEGIN:VCALENDAR');
  expect(ics).toContain(`DTSTART:${startUtc}`);

  // A second member, of another household, types the same time and meets the server's refusal.
  const otherContext = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const other = await otherContext.newPage();
  await new SignInPage(other).signIn('lindqvist@larkspur.example');
  await expect(other.getByTestId('signed-in-as')).toBeVisible();
  await openBookingDay(other, day);
  await expect(slotEvent(other, 'Nakamura')).toBeVisible();
  await expect(slotEvent(other, 'Nakamura')).not.toContainText('Your household');

  await other.getByRole('button', { name: 'Book a slot' }).click();
  const otherBooking = other.getByRole('dialog', { name: 'Book a boil slot' });
  await expect(otherBooking).toBeVisible();
  await otherBooking.getByLabel('Start date').fill(day.toISODate()!);
  await otherBooking.getByLabel('Start time').fill('19:30');
  await otherBooking.getByLabel('End date').fill(day.toISODate()!);
  await otherBooking.getByLabel('End time').fill('21:30');
  await otherBooking.getByRole('button', { name: 'Book this slot' }).click();

  await expect(otherBooking.getByRole('alert').filter({ hasText: 'That time overlaps the Nakamura household’s slot' })).toBeVisible();
  await expect(otherBooking.getByLabel('Start time')).toHaveAttribute('aria-invalid', 'true');
  await expect(other.locator('[data-sonner-toast]', { hasText: 'overlaps the Nakamura household' })).toBeVisible();
  // The optimistic copy was rolled back.
  await expect(slotEvent(other, 'Lindqvist')).toHaveCount(0);

  // The first member cancels; the slot leaves both calendars (the second one live).
  await ownEvent.click();
  const details = page.getByRole('dialog', { name: 'Nakamura household' });
  await expect(details).toContainText('Hiroko Nakamura, Ren Nakamura');
  await details.getByRole('button', { name: 'Cancel this slot' }).click();
  await details.getByRole('button', { name: 'Yes, cancel the slot' }).click();
  await expect(details).toBeHidden();
  await expect(slotEvent(page, 'Nakamura')).toHaveCount(0);
  await expect(slotEvent(other, 'Nakamura')).toHaveCount(0);
  await waitForMail({ to: 'nakamura@larkspur.example', subject: 'Boil slot cancelled' });

  // The freed time can now be booked by the second member.
  await otherBooking.getByRole('button', { name: 'Book this slot' }).click();
  await expect(otherBooking).toBeHidden();
  await expect(other.getByRole('button', { name: /19:30 – 21:30\s*Lindqvist household\s*Your household/ })).toBeVisible();
  await expect(slotEvent(page, 'Lindqvist')).toBeVisible();

  await otherContext.close();
});

test('a member moves its own slot by dragging it, and the household is told', async ({ page, signInAs }) => {
  await clearMail();
  // The day after the other test's booking day, so the two never meet.
  const day = DateTime.now().setZone(ZONE).startOf('day').plus({ days: DAYS_AHEAD + 1 });
  await signInAs('ferreira@larkspur.example');
  const evaporatorId = (await (await page.request.get('/api/evaporators')).json())[0].id;
  const created = await page.request.post('/api/slots', {
    data: { evaporatorId, startsAt: day.set({ hour: 19, minute: 0 }).toISO(), endsAt: day.set({ hour: 20, minute: 0 }).toISO() },
  });
  expect(created.status()).toBe(201);
  const { id } = (await created.json()) as { id: string };

  await openBookingDay(page, day);
  const event = page.getByRole('button', { name: /19:00 – 20:00\s*Ferreira household/ });
  await expect(event).toBeVisible();
  await page.locator('td.fc-timegrid-slot-lane[data-time="21:00:00"]').scrollIntoViewIfNeeded();
  await event.scrollIntoViewIfNeeded();
  const from = (await event.boundingBox())!;
  const row = (await page.locator('td.fc-timegrid-slot-lane[data-time="20:00:00"]').boundingBox())!;
  // Two half-hour rows down: 19:00–20:00 becomes 20:00–21:00.
  await page.mouse.move(from.x + from.width / 2, from.y + 8);
  await page.mouse.down();
  await page.mouse.move(from.x + from.width / 2, from.y + 8 + row.height, { steps: 5 });
  await page.mouse.move(from.x + from.width / 2, from.y + 8 + 2 * row.height, { steps: 5 });
  await page.mouse.up();

  await expect(page.getByRole('button', { name: /20:00 – 21:00\s*Ferreira household/ })).toBeVisible();
  await expect(page.locator('[data-sonner-toast]', { hasText: 'Moved the Ferreira household’s slot' })).toBeVisible();
  await waitForMail({ to: 'ferreira@larkspur.example', subject: `Boil slot moved: ${day.toFormat('ccc d LLL')}, 20:00 – 21:00` });
  const listed = await (await page.request.get(`/api/slots?from=${day.toISODate()}&to=${day.plus({ days: 1 }).toISODate()}`)).json();
  const moved = listed.find((s: { id: string }) => s.id === id);
  expect(moved.startsAt).toBe(day.set({ hour: 20 }).toISO());
  expect(moved.endsAt).toBe(day.set({ hour: 21 }).toISO());
});
