import type { CalendarDto, MaintenanceDto, BookingDto } from '@femtoslot/shared';
import type { DatesSetArg, DateSelectArg, EventClickArg, EventContentArg, EventDropArg, EventMountArg } from '@fullcalendar/core';
import dayGridPlugin from '@fullcalendar/daygrid';
import interactionPlugin, { type EventResizeDoneArg } from '@fullcalendar/interaction';
import FullCalendar from '@fullcalendar/react';
import timeGridPlugin from '@fullcalendar/timegrid';
import { useLayoutEffect, useMemo, useRef } from 'react';
import { type CalendarItem, type GridOptions, eventDataAttributes, toGridEvents } from '../lib/calendar-events';
import { firstDayOfWeek } from '../lib/calendar-week';
import { intlTimeZonePlugin } from '../lib/intl-time-zone-plugin';

export interface MaintenanceChange {
  maintenance: MaintenanceDto;
  startsAt: string;
  endsAt: string;
  /** puts the block back where it was, when the server refuses the change */
  revert: () => void;
}

export interface BeamTimeCalendarProps {
  timeZone: string;
  calendar: CalendarDto | undefined;
  configurationName: GridOptions['configurationName'];
  canEditMaintenance: boolean;
  stationName?: GridOptions['stationName'];
  onRangeChange: (range: { from: string; to: string }) => void;
  onSelectRange: (range: { startsAt: string; endsAt: string }) => void;
  onBookingClick: (booking: BookingDto) => void;
  onMaintenanceClick: (maintenance: MaintenanceDto) => void;
  onMaintenanceChange: (change: MaintenanceChange) => void;
}

const plugins = [timeGridPlugin, dayGridPlugin, interactionPlugin, intlTimeZonePlugin];
const hourMinute = { hour: '2-digit', minute: '2-digit', hour12: false } as const;

// FullCalendar formats a range's end with a new Intl.DateTimeFormat for every event; one kept per locale gives
// the same text. Markers are wall times coded as UTC, hence timeZone 'UTC', as FullCalendar's own formatter does.
const clocks = new Map<string, Intl.DateTimeFormat>();
function clockText(marker: Date, localeCodes: string[]): string {
  const key = localeCodes.join(',');
  let clock = clocks.get(key);
  if (!clock) {
    clock = new Intl.DateTimeFormat(localeCodes, { ...hourMinute, timeZone: 'UTC' });
    clocks.set(key, clock);
  }
  return clock.format(marker);
}

interface EventTimeArg {
  start: { marker: Date };
  end?: { marker: Date } | null;
  localeCodes: string[];
  defaultSeparator: string;
}

export function eventTimeText(arg: EventTimeArg): string {
  const start = clockText(arg.start.marker, arg.localeCodes);
  if (!arg.end) return start;
  const end = clockText(arg.end.marker, arg.localeCodes);
  return start === end ? start : `${start}${arg.defaultSeparator}${end}`;
}
const headerToolbar = { left: 'prev,next today', center: 'title', right: 'timeGridWeek,timeGridDay,dayGridMonth' };
const buttonText = { today: 'Today', week: 'Week', day: 'Day', month: 'Month' };
const dayHeaderFormat = { weekday: 'short', day: 'numeric', month: 'numeric', omitCommas: true } as const;
// A month's columns stand for weekdays: FullCalendar formats their headers from a fixed week of January 1970, so a
// format with a date in it prints "Mon 1/5 … Sun 1/4" whatever the month. The weekday alone is the right header.
const views = { dayGridMonth: { dayHeaderFormat: { weekday: 'short' } } } as const;

/** The booking, window or band behind an event; undefined for the mirror FullCalendar draws while a range is dragged. */
function itemOf(arg: { event: { extendedProps: Record<string, unknown> } }): CalendarItem | undefined {
  return arg.event.extendedProps.item as CalendarItem | undefined;
}

/** FullCalendar's own (Preact) element factory, handed to content hooks as their second argument. */
type CreateElement = (type: string, props: { className: string } | null, ...children: unknown[]) => unknown;

// Built with FullCalendar's factory rather than as React elements: React content is mounted through one portal
// per event and re-renders the whole grid each time one changes, which made a 300-event week slow to appear.
function eventInner(arg: EventContentArg, h: CreateElement) {
  const item = itemOf(arg);
  if (!item) return true;
  const span = (className: string, text: string) => h('span', { className }, text);
  if (item.kind === 'changeover') return span('fs-changeover-label', arg.event.title);
  if (item.kind === 'maintenance') {
    return h('div', { className: 'fs-event-inner' }, span('fs-event-kicker', 'Maintenance'), span('fs-event-title', arg.event.title));
  }
  return h(
    'div',
    { className: 'fs-event-inner' },
    arg.timeText ? span('fs-event-time', arg.timeText) : null,
    span('fs-event-title', arg.event.title),
    item.booking.status === 'requested' ? span('fs-event-kicker', 'awaiting staff') : null,
    item.booking.detail && arg.view.type !== 'dayGridMonth' ? span('fs-event-sub', item.booking.detail.userName) : null,
  );
}

function mountEvent(arg: EventMountArg) {
  const item = itemOf(arg);
  if (!item) return;
  for (const [key, value] of Object.entries(eventDataAttributes(item))) arg.el.dataset[key] = value;
  if (item.kind === 'booking') {
    const b = item.booking;
    arg.el.setAttribute(
      'aria-label',
      `${arg.event.title}, ${b.status === 'requested' ? 'awaiting staff approval' : b.status}, ${arg.timeText ?? ''}`.trim(),
    );
  }
}

/**
 * The beam-time grid: bookings by configuration colour, hatched maintenance, changeover bands.
 * Each update of the FullCalendar component resets all its options and re-measures the whole grid, so its element
 * is memoised on the events and the zone, and the handlers reach the latest props through a ref.
 */
export function BeamTimeCalendar(props: BeamTimeCalendarProps) {
  const { calendar, configurationName, canEditMaintenance, timeZone, stationName } = props;
  const latest = useRef(props);
  useLayoutEffect(() => {
    latest.current = props;
  });
  const events = useMemo(
    () => (calendar ? toGridEvents(calendar, { configurationName, canEditMaintenance, stationName }) : []),
    [calendar, configurationName, canEditMaintenance, stationName],
  );

  const handlers = useMemo(() => {
    const onMaintenanceMoved = (arg: EventDropArg | EventResizeDoneArg) => {
      const item = itemOf(arg);
      if (item?.kind !== 'maintenance' || !arg.event.start || !arg.event.end) return arg.revert();
      latest.current.onMaintenanceChange({
        maintenance: item.maintenance,
        startsAt: new Date(arg.event.startStr).toISOString(),
        endsAt: new Date(arg.event.endStr).toISOString(),
        revert: arg.revert,
      });
    };
    return {
      datesSet: (arg: DatesSetArg) =>
        latest.current.onRangeChange({ from: new Date(arg.startStr).toISOString(), to: new Date(arg.endStr).toISOString() }),
      select: (arg: DateSelectArg) => {
        arg.view.calendar.unselect();
        latest.current.onSelectRange({ startsAt: new Date(arg.startStr).toISOString(), endsAt: new Date(arg.endStr).toISOString() });
      },
      eventClick: (arg: EventClickArg) => {
        const item = itemOf(arg);
        if (item?.kind === 'booking') latest.current.onBookingClick(item.booking);
        if (item?.kind === 'maintenance') latest.current.onMaintenanceClick(item.maintenance);
      },
      eventDrop: onMaintenanceMoved,
      eventResize: onMaintenanceMoved,
    };
  }, []);

  const grid = useMemo(
    () => (
      <FullCalendar
        plugins={plugins}
        timeZone={timeZone}
        initialView="timeGridWeek"
        headerToolbar={headerToolbar}
        buttonText={buttonText}
        firstDay={firstDayOfWeek}
        allDaySlot={false}
        nowIndicator
        height={820}
        expandRows
        slotDuration="00:30:00"
        scrollTime="07:00:00"
        slotLabelFormat={hourMinute}
        eventTimeFormat={eventTimeText}
        dayHeaderFormat={dayHeaderFormat}
        views={views}
        selectable
        selectMirror
        unselectAuto
        editable={false}
        eventOverlap={false}
        events={events}
        {...handlers}
        eventContent={eventInner}
        eventDidMount={mountEvent}
      />
    ),
    [timeZone, events, handlers],
  );

  return (
    <div data-testid="calendar" data-time-zone={timeZone} className="fs-calendar">
      {grid}
    </div>
  );
}
