import type { CalendarDto, MaintenanceDto, BookingDto } from '@femtoslot/shared';
import type { DatesSetArg, DateSelectArg, EventClickArg, EventContentArg, EventDropArg, EventMountArg } from '@fullcalendar/core';
import dayGridPlugin from '@fullcalendar/daygrid';
import interactionPlugin, { type EventResizeDoneArg } from '@fullcalendar/interaction';
import luxonPlugin from '@fullcalendar/luxon3';
import FullCalendar from '@fullcalendar/react';
import timeGridPlugin from '@fullcalendar/timegrid';
import { useMemo } from 'react';
import { type CalendarItem, type GridOptions, eventDataAttributes, toGridEvents } from '../lib/calendar-events';

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
  onRangeChange: (range: { from: string; to: string }) => void;
  onSelectRange: (range: { startsAt: string; endsAt: string }) => void;
  onBookingClick: (booking: BookingDto) => void;
  onMaintenanceClick: (maintenance: MaintenanceDto) => void;
  onMaintenanceChange: (change: MaintenanceChange) => void;
}

const plugins = [timeGridPlugin, dayGridPlugin, interactionPlugin, luxonPlugin];
const hourMinute = { hour: '2-digit', minute: '2-digit', hour12: false } as const;

function itemOf(arg: { event: { extendedProps: Record<string, unknown> } }): CalendarItem {
  return arg.event.extendedProps.item as CalendarItem;
}

function EventInner(arg: EventContentArg) {
  const item = itemOf(arg);
  if (item.kind === 'changeover') return <span className="fs-changeover-label">{arg.event.title}</span>;
  if (item.kind === 'maintenance') {
    return (
      <div className="fs-event-inner">
        <span className="fs-event-kicker">Maintenance</span>
        <span className="fs-event-title">{arg.event.title}</span>
      </div>
    );
  }
  return (
    <div className="fs-event-inner">
      {arg.timeText && <span className="fs-event-time">{arg.timeText}</span>}
      <span className="fs-event-title">{arg.event.title}</span>
      {item.booking.status === 'requested' && <span className="fs-event-kicker">awaiting staff</span>}
      {item.booking.detail && arg.view.type !== 'dayGridMonth' && (
        <span className="fs-event-sub">{item.booking.detail.userName}</span>
      )}
    </div>
  );
}

function mountEvent(arg: EventMountArg) {
  const item = itemOf(arg);
  for (const [key, value] of Object.entries(eventDataAttributes(item))) arg.el.dataset[key] = value;
  if (item.kind === 'booking') {
    const b = item.booking;
    arg.el.setAttribute(
      'aria-label',
      `${arg.event.title}, ${b.status === 'requested' ? 'awaiting staff approval' : b.status}, ${arg.timeText ?? ''}`.trim(),
    );
  }
}

/** The beam-time grid: bookings by configuration colour, hatched maintenance, changeover bands. */
export function BeamTimeCalendar(props: BeamTimeCalendarProps) {
  const { calendar, configurationName, canEditMaintenance } = props;
  const events = useMemo(
    () => (calendar ? toGridEvents(calendar, { configurationName, canEditMaintenance }) : []),
    [calendar, configurationName, canEditMaintenance],
  );

  const onDatesSet = (arg: DatesSetArg) =>
    props.onRangeChange({ from: new Date(arg.startStr).toISOString(), to: new Date(arg.endStr).toISOString() });

  const onSelect = (arg: DateSelectArg) => {
    arg.view.calendar.unselect();
    props.onSelectRange({ startsAt: new Date(arg.startStr).toISOString(), endsAt: new Date(arg.endStr).toISOString() });
  };

  const onEventClick = (arg: EventClickArg) => {
    const item = itemOf(arg);
    if (item.kind === 'booking') props.onBookingClick(item.booking);
    if (item.kind === 'maintenance') props.onMaintenanceClick(item.maintenance);
  };

  const onMaintenanceMoved = (arg: EventDropArg | EventResizeDoneArg) => {
    const item = itemOf(arg);
    if (item.kind !== 'maintenance' || !arg.event.start || !arg.event.end) return arg.revert();
    props.onMaintenanceChange({
      maintenance: item.maintenance,
      startsAt: new Date(arg.event.startStr).toISOString(),
      endsAt: new Date(arg.event.endStr).toISOString(),
      revert: arg.revert,
    });
  };

  return (
    <div data-testid="calendar" data-time-zone={props.timeZone} className="fs-calendar">
      <FullCalendar
        plugins={plugins}
        timeZone={props.timeZone}
        initialView="timeGridWeek"
        headerToolbar={{ left: 'prev,next today', center: 'title', right: 'timeGridWeek,timeGridDay,dayGridMonth' }}
        buttonText={{ today: 'Today', week: 'Week', day: 'Day', month: 'Month' }}
        firstDay={1}
        allDaySlot={false}
        nowIndicator
        height={820}
        expandRows
        slotDuration="00:30:00"
        scrollTime="07:00:00"
        slotLabelFormat={hourMinute}
        eventTimeFormat={hourMinute}
        dayHeaderFormat={{ weekday: 'short', day: 'numeric', month: 'numeric', omitCommas: true }}
        selectable
        selectMirror
        unselectAuto
        editable={false}
        eventOverlap={false}
        events={events}
        datesSet={onDatesSet}
        select={onSelect}
        eventClick={onEventClick}
        eventDrop={onMaintenanceMoved}
        eventResize={onMaintenanceMoved}
        eventContent={EventInner}
        eventDidMount={mountEvent}
      />
    </div>
  );
}
