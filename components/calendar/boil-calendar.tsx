'use client';

import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import useSWR, { useSWRConfig } from 'swr';
import { DateTime } from 'luxon';
import dynamic from 'next/dynamic';
import type FullCalendar from '@fullcalendar/react';
import type { DateClickArg, EventResizeDoneArg } from '@fullcalendar/interaction';
import type { DateSelectArg, DateSpanApi, DatesSetArg, EventClickArg, EventContentArg, EventDropArg, EventInput, EventMountArg } from '@fullcalendar/core';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { toast } from '@/components/ui/toaster';
import { ApiClientError, fetcher } from '@/lib/client/api';
import type { PlanningDto } from '@/lib/planning/types';
import type { SlotDto } from '@/lib/slots/types';
import { formatSlotRange } from '@/lib/time';
import { cn } from '@/lib/utils';
import type { CalendarSetup } from './calendar-types';
import { BookingDialog, type BookingDraft, type NewSlot } from './booking-dialog';
import { PLANNING_KEY, PlanningStrip } from './planning-strip';
import { SlotDialog, type SlotChange } from './slot-dialog';
import { closingOn, defaultEnd, defaultStart } from './slot-time';
import { useLiveSlots, type LiveStatus } from './use-live-slots';
import { useSlotMutation } from './use-slot-mutation';
import styles from './calendar.module.css';

type ViewName = 'dayGridMonth' | 'timeGridWeek' | 'timeGridDay';

const VIEWS: { name: ViewName; label: string; unit: string }[] = [
  { name: 'dayGridMonth', label: 'Month', unit: 'month' },
  { name: 'timeGridWeek', label: 'Week', unit: 'week' },
  { name: 'timeGridDay', label: 'Day', unit: 'day' },
];

// Phones (below Tailwind's sm) get the day view and a shorter calendar.
const NARROW = '(max-width: 639.98px)';
const HEIGHT = { narrow: 620, wide: 760 };

/** Holds the calendar's final place (its height on phones and wider screens) until it is drawn, so nothing below moves. */
function CalendarSkeleton() {
  return <div className="h-[620px] rounded-lg bg-birch motion-safe:animate-pulse sm:h-[760px]" aria-hidden="true" data-testid="calendar-skeleton" />;
}

// FullCalendar and its plugins are the page's heaviest code: not in the page's first scripts, but
// fetched as soon as this module runs in the browser, beside hydration, and drawn once it is there.
if (typeof window !== 'undefined') void import('./calendar-view');
const CalendarView = dynamic(() => import('./calendar-view'), { ssr: false, loading: CalendarSkeleton });
const isSlotsKey = (key: unknown) => typeof key === 'string' && key.startsWith('/api/slots?');

let pendingCount = 0;

/** The co-op's Boil calendar: who crews the evaporator when, booking, and changes made live. */
export function BoilCalendar({ setup, initialPlanning }: { setup: CalendarSetup; initialPlanning?: PlanningDto }) {
  const zone = setup.timeZone;
  const calendarRef = useRef<FullCalendar>(null);
  const [narrow, setNarrow] = useState<boolean | null>(null);
  const [range, setRange] = useState<{ from: string; to: string } | null>(null);
  const [view, setView] = useState<{ type: ViewName; title: string } | null>(null);
  const [draft, setDraft] = useState<BookingDraft | null>(null);
  const [selected, setSelected] = useState<SlotDto | null>(null);

  // The first view depends on the screen, which the server cannot know.
  useEffect(() => {
    const query = window.matchMedia(NARROW);
    const update = () => setNarrow(query.matches);
    update();
    query.addEventListener('change', update);
    return () => query.removeEventListener('change', update);
  }, []);

  const key = range ? `/api/slots?from=${encodeURIComponent(range.from)}&to=${encodeURIComponent(range.to)}` : null;
  const slots = useSWR<SlotDto[]>(key, fetcher, { keepPreviousData: true });
  const { mutate: mutateAny } = useSWRConfig();

  const refreshAll = useCallback(() => {
    void mutateAny(isSlotsKey);
    void mutateAny(PLANNING_KEY);
  }, [mutateAny]);
  const live = useLiveSlots(refreshAll);
  const mutateSlot = useSlotMutation(slots);

  const canBook = !!setup.season && setup.evaporators.length > 0 && (setup.user.staff || !!setup.user.householdId);
  const isMine = useCallback((s: SlotDto) => !setup.user.staff && s.householdId === setup.user.householdId, [setup.user]);
  const isHighlighted = useCallback((s: SlotDto) => setup.user.staff || s.householdId === setup.user.householdId, [setup.user]);

  const events = useMemo<EventInput[]>(
    () =>
      (slots.data ?? []).map((s) => ({
        id: s.id,
        start: s.startsAt,
        end: s.endsAt,
        title: `${s.householdName} household`,
        extendedProps: { slot: s },
        // Own booked slots move by dragging and change length by their lower edge.
        startEditable: s.editable && s.status === 'booked',
        durationEditable: s.editable && s.status === 'booked',
        classNames: [
          s.id.startsWith('pending-')
            ? styles.pending
            : s.status === 'done'
              ? styles.done
              : isHighlighted(s)
                ? styles.own
                : styles.other,
        ],
      })),
    [slots.data, isHighlighted],
  );

  const onDatesSet = useCallback(
    (arg: DatesSetArg) => {
      setRange((r) => (r && r.from === arg.startStr && r.to === arg.endStr ? r : { from: arg.startStr, to: arg.endStr }));
      setView({ type: arg.view.type as ViewName, title: titleOf(arg.view.type as ViewName, arg.view.currentStart, arg.view.currentEnd, zone) });
    },
    [zone],
  );

  const api = () => calendarRef.current?.getApi();
  const dayStart = useCallback((day: DateTime) => defaultStart(day, setup.opensAt), [setup.opensAt]);

  const openDraft = useCallback(
    (start: DateTime, end?: DateTime) => {
      const shortest = setup.slotMinMinutes;
      const finish = end && end.diff(start, 'minutes').minutes >= shortest ? end : defaultEnd(start, setup);
      setSelected(null);
      setDraft({ start, end: finish });
    },
    [setup],
  );

  const onSelect = useCallback(
    (arg: DateSelectArg) => {
      const start = DateTime.fromJSDate(arg.start, { zone });
      if (arg.allDay) {
        openDraft(dayStart(start));
      } else {
        openDraft(start, DateTime.fromJSDate(arg.end, { zone }));
      }
    },
    [zone, openDraft, dayStart],
  );

  // A tap on a phone does not start a selection (that needs a long press), so a tap books too.
  const onDateClick = useCallback(
    (arg: DateClickArg) => {
      const touch = typeof TouchEvent !== 'undefined' && (arg.jsEvent as unknown) instanceof TouchEvent;
      if (!touch || !canBook) return;
      const at = DateTime.fromJSDate(arg.date, { zone });
      if (at.plus({ minutes: 30 }) < DateTime.now() && !setup.user.staff) return;
      openDraft(arg.allDay ? dayStart(at) : at);
    },
    [zone, canBook, openDraft, dayStart, setup.user.staff],
  );

  const selectAllow = useCallback(
    (span: DateSpanApi) => setup.user.staff || span.end.getTime() > Date.now(),
    [setup.user.staff],
  );

  const onEventClick = useCallback((arg: EventClickArg) => {
    arg.jsEvent.preventDefault();
    const slot = arg.event.extendedProps.slot as SlotDto;
    if (slot.id.startsWith('pending-')) return;
    setDraft(null);
    setSelected(slot);
  }, []);

  /** "Book a slot" without a pointer: the first bookable time on the day in view. */
  function openBookingButton() {
    const now = DateTime.now().setZone(zone);
    const visible = api()?.view.currentStart;
    let day = visible ? DateTime.fromJSDate(visible, { zone }).startOf('day') : now.startOf('day');
    if (day < now.startOf('day')) day = now.startOf('day');
    let start = dayStart(day);
    if (start < now) start = now.plus({ hours: 1 }).startOf('hour');
    const closing = closingOn(start, setup.closesAt);
    if (start.plus({ minutes: setup.slotMinMinutes }) > closing) {
      start = dayStart(start.plus({ days: 1 }));
    }
    openDraft(start);
  }

  function closeBooking() {
    setDraft(null);
    api()?.unselect();
  }

  async function book(input: NewSlot, householdName: string) {
    const placeholder: SlotDto = {
      id: `pending-${Date.now()}-${++pendingCount}`,
      evaporatorId: input.evaporatorId,
      householdId: input.householdId ?? setup.user.householdId ?? '',
      householdName,
      startsAt: input.startsAt,
      endsAt: input.endsAt,
      status: 'booked',
      crew: input.crew,
      expectedSapL: input.expectedSapL,
      note: input.note,
      editable: false,
    };
    const slot = await mutateSlot({ kind: 'book', input, placeholder });
    if (!slot) return;
    closeBooking();
    toast.success(`Booked for the ${slot.householdName} household: ${formatSlotRange(slot.startsAt, slot.endsAt, zone)}.`, {
      description: 'A confirmation e-mail with a calendar file is on its way.',
    });
    const calendar = api();
    const startsAt = new Date(slot.startsAt);
    if (calendar && (startsAt < calendar.view.activeStart || startsAt >= calendar.view.activeEnd)) calendar.gotoDate(startsAt);
  }

  async function cancel(slot: SlotDto) {
    try {
      await mutateSlot({ kind: 'cancel', slot });
    } catch (err) {
      toast.error(err instanceof ApiClientError ? err.message : 'The slot could not be cancelled.');
      throw err;
    }
    setSelected(null);
    toast.success(`Cancelled the ${slot.householdName} household’s slot; ${formatSlotRange(slot.startsAt, slot.endsAt, zone)} is free again.`);
  }

  async function change(slot: SlotDto, patch: SlotChange) {
    const fresh = await mutateSlot({ kind: 'change', slot, patch });
    if (fresh) setSelected(fresh);
    toast.success('Saved the crew and note.');
  }

  /** A slot dragged or stretched to a new time: PATCH it, or put it back with the server's reason. */
  async function move(arg: EventDropArg | EventResizeDoneArg) {
    const slot = arg.event.extendedProps.slot as SlotDto;
    const startsAt = DateTime.fromJSDate(arg.event.start!, { zone }).toISO()!;
    const endsAt = DateTime.fromJSDate(arg.event.end!, { zone }).toISO()!;
    try {
      await mutateSlot({ kind: 'move', slot, startsAt, endsAt });
      toast.success(`Moved the ${slot.householdName} household’s slot to ${formatSlotRange(startsAt, endsAt, zone)}.`, {
        description: 'The household gets an e-mail with the new time.',
      });
    } catch (err) {
      arg.revert();
      toast.error(err instanceof ApiClientError ? err.message : 'The slot could not be moved.');
    }
  }

  // The dialog shows the latest copy of the slot, but keeps its last copy while it is being removed.
  const shownSlot = selected ? (slots.data?.find((s) => s.id === selected.id) ?? selected) : null;

  const renderEvent = useCallback(
    (arg: EventContentArg) => {
      const slot = arg.event.extendedProps.slot as SlotDto | undefined;
      // The selection's mirror is drawn as an event too, with no slot behind it.
      if (!slot) {
        return (
          <div className="flex h-full flex-col px-1 py-0.5 leading-tight">
            <span className="text-sm font-semibold">{arg.timeText}</span>
            <span className="font-bold">New slot</span>
          </div>
        );
      }
      const pending = slot.id.startsWith('pending-');
      const done = slot.status === 'done';
      const mine = isMine(slot);
      const compact = arg.view.type === 'dayGridMonth';
      return (
        <div className={cn('flex h-full min-w-0 overflow-hidden px-1 py-0.5 leading-tight', compact ? 'flex-row flex-wrap gap-x-1' : 'flex-col gap-0.5')}>
          <span className="text-sm font-semibold">{arg.timeText}</span>
          <span className={cn('font-bold', compact && 'max-w-full truncate')}>{slot.householdName} household</span>
          {mine ? <span className={cn('text-sm', compact && 'max-w-full truncate')}>Your household</span> : null}
          {done ? <span className="text-sm font-semibold uppercase tracking-wide">Done</span> : null}
          {pending ? <span className="text-sm font-semibold">Booking…</span> : null}
        </div>
      );
    },
    [isMine],
  );

  const onEventDidMount = useCallback((arg: EventMountArg) => {
    if (arg.isMirror) return;
    arg.el.setAttribute('role', 'button');
    arg.el.setAttribute('data-testid', 'slot-event');
  }, []);

  const activeView = view?.type ?? (narrow ? 'timeGridDay' : 'timeGridWeek');
  const unit = VIEWS.find((v) => v.name === activeView)?.unit ?? 'week';
  // The calendar itself loads on demand: until it has drawn its first dates, the controls that
  // drive it would do nothing, so they wait (disabled) rather than lose a tap.
  const ready = view !== null;

  return (
    <div className="flex flex-col gap-4">
      <PlanningStrip timeZone={zone} unitSystem={setup.unitSystem} initialData={initialPlanning} />

      <section aria-labelledby="calendar-title" className="flex flex-col gap-3 rounded-xl border border-birch-line bg-birch-raised p-3 shadow-sm sm:p-4">
        <div className="flex flex-wrap items-center gap-2">
          <h2 id="calendar-title" className="w-full text-xl font-bold md:w-auto md:flex-1" aria-live="polite">
            {view?.title ?? 'Boil slots'}
          </h2>
          <div role="group" aria-label="Move through the calendar" className="flex gap-1">
            <Button variant="secondary" size="sm" aria-label={`Previous ${unit}`} disabled={!ready} onClick={() => api()?.prev()}>
              <Chevron direction="left" />
            </Button>
            <Button variant="secondary" size="sm" aria-label={`Next ${unit}`} disabled={!ready} onClick={() => api()?.next()}>
              <Chevron direction="right" />
            </Button>
            <Button variant="secondary" size="sm" disabled={!ready} onClick={() => api()?.today()}>
              Today
            </Button>
          </div>
          <div
            role="group"
            aria-label="Calendar view"
            className="order-last grid w-full grid-cols-3 gap-1 rounded-lg border border-birch-line p-0.5 md:order-none md:flex md:w-auto"
          >
            {VIEWS.map((v) => (
              <Button
                key={v.name}
                size="sm"
                variant={activeView === v.name ? 'primary' : 'ghost'}
                aria-pressed={activeView === v.name}
                disabled={!ready}
                onClick={() => api()?.changeView(v.name)}
              >
                {v.label}
              </Button>
            ))}
          </div>
          {canBook ? (
            <Button onClick={openBookingButton} data-testid="book-slot" className="ml-auto md:ml-0">
              Book a slot
            </Button>
          ) : null}
        </div>

        <StatusLine live={live} loading={!!key && slots.isLoading} />

        {slots.error && !slots.data ? (
          <Alert tone="danger" title="The slots could not be loaded.">
            <p>{(slots.error as Error).message}</p>
            <div>
              <Button variant="secondary" size="sm" onClick={() => void slots.mutate()}>
                Try again
              </Button>
            </div>
          </Alert>
        ) : null}

        <div className={styles.calendar} data-testid="boil-calendar">
          {narrow === null ? (
            <CalendarSkeleton />
          ) : (
            <CalendarView
              calendarRef={calendarRef}
              timeZone={zone}
              initialView={narrow ? 'timeGridDay' : 'timeGridWeek'}
              headerToolbar={false}
              height={narrow ? HEIGHT.narrow : HEIGHT.wide}
              allDaySlot={false}
              slotDuration="00:30:00"
              scrollTime={setup.opensAt}
              scrollTimeReset={false}
              nowIndicator
              businessHours={{ daysOfWeek: [0, 1, 2, 3, 4, 5, 6], startTime: setup.opensAt, endTime: setup.closesAt }}
              slotLabelFormat="HH:mm"
              eventTimeFormat="HH:mm"
              eventDisplay="block"
              defaultRangeSeparator=" – "
              views={{
                dayGridMonth: { dayHeaderFormat: 'ccc', dayMaxEvents: 3 },
                timeGridWeek: { dayHeaderFormat: narrow ? 'ccc d' : 'ccc d LLL' },
                timeGridDay: { dayHeaderFormat: 'cccc d LLLL' },
              }}
              selectable={canBook}
              selectMirror
              selectOverlap={false}
              selectAllow={selectAllow}
              selectLongPressDelay={400}
              unselectCancel="[role='dialog']"
              select={onSelect}
              dateClick={onDateClick}
              events={events}
              eventContent={renderEvent}
              eventDidMount={onEventDidMount}
              eventClick={onEventClick}
              eventOverlap={false}
              eventLongPressDelay={400}
              eventDrop={(arg) => void move(arg)}
              eventResize={(arg) => void move(arg)}
              datesSet={onDatesSet}
              // Slots are reached with Tab and opened with Enter, which also makes the time
              // grid's scrolling box reachable by keyboard.
              eventInteractive
            />
          )}
        </div>

        <p className="text-sm text-slate">
          <span className="font-bold uppercase tracking-wide text-ember-strong">Caution:</span> boiling sap and syrup burn. Never leave a
          firing evaporator unattended, keep the sugarhouse ventilated against carbon monoxide, and follow your local fire code.
        </p>
      </section>

      <BookingDialog setup={setup} draft={draft} onClose={closeBooking} onBook={book} />
      <SlotDialog setup={setup} slot={shownSlot} onClose={() => setSelected(null)} onCancel={cancel} onChange={change} />
    </div>
  );
}

function Chevron({ direction }: { direction: 'left' | 'right' }) {
  return (
    <svg aria-hidden="true" viewBox="0 0 20 20" fill="none" className="size-5">
      <path
        d={direction === 'left' ? 'M12.5 5l-5 5 5 5' : 'M7.5 5l5 5-5 5'}
        stroke="currentColor"
        strokeWidth="2"
        strokeLinecap="round"
        strokeLinejoin="round"
      />
    </svg>
  );
}

function StatusLine({ live, loading }: { live: LiveStatus; loading: boolean }) {
  const text =
    live === 'live'
      ? 'Live: bookings by others appear as they are made.'
      : live === 'connecting'
        ? 'Connecting for live updates…'
        : 'Live updates paused; reconnecting…';
  return (
    <p className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm text-slate-muted" aria-live="polite">
      <span data-testid="live-status" data-status={live} className="inline-flex items-center gap-1.5">
        <span aria-hidden="true" className={cn('inline-block size-2 rounded-full', live === 'live' ? 'bg-spruce' : 'bg-birch-edge')} />
        {text}
      </span>
      {loading ? <span>Loading slots…</span> : null}
    </p>
  );
}

function titleOf(type: ViewName, start: Date, end: Date, zone: string): string {
  const s = DateTime.fromJSDate(start, { zone });
  const last = DateTime.fromJSDate(end, { zone }).minus({ days: 1 });
  if (type === 'dayGridMonth') return s.toFormat('LLLL yyyy');
  if (type === 'timeGridDay') return s.toFormat('cccc d LLLL yyyy');
  if (s.hasSame(last, 'month')) return `${s.toFormat('d')} – ${last.toFormat('d LLL yyyy')}`;
  if (s.hasSame(last, 'year')) return `${s.toFormat('d LLL')} – ${last.toFormat('d LLL yyyy')}`;
  return `${s.toFormat('d LLL yyyy')} – ${last.toFormat('d LLL yyyy')}`;
}
