'use client';

import type { RefObject } from 'react';
import FullCalendar from '@fullcalendar/react';
import dayGridPlugin from '@fullcalendar/daygrid';
import timeGridPlugin from '@fullcalendar/timegrid';
import interactionPlugin from '@fullcalendar/interaction';
import luxonPlugin from '@fullcalendar/luxon3';
import type { CalendarOptions } from '@fullcalendar/core';

const PLUGINS = [dayGridPlugin, timeGridPlugin, interactionPlugin, luxonPlugin];

export interface CalendarViewProps extends Omit<CalendarOptions, 'plugins'> {
  calendarRef: RefObject<FullCalendar | null>;
}

/**
 * FullCalendar with the plugins the Boil calendar uses. Its own module, so the page loads this
 * heavy code only when the calendar is drawn (next/dynamic in boil-calendar.tsx).
 */
export default function CalendarView({ calendarRef, ...options }: CalendarViewProps) {
  return <FullCalendar ref={calendarRef} plugins={PLUGINS} {...options} />;
}
