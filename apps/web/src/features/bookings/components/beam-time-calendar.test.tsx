import type { BookingDto, CalendarDto } from '@femtoslot/shared';
import { formatRange } from '@fullcalendar/core';
import { act } from 'react';
import { type Root, createRoot } from 'react-dom/client';
import { afterEach, describe, expect, test, vi } from 'vitest';
import { weekShownAt } from '../lib/calendar-week';
import { BeamTimeCalendar, type BeamTimeCalendarProps, eventTimeText } from './beam-time-calendar';

(globalThis as { IS_REACT_ACT_ENVIRONMENT?: boolean }).IS_REACT_ACT_ENVIRONMENT = true;

let root: Root | null = null;

afterEach(() => {
  act(() => root?.unmount());
  root = null;
  vi.useRealTimers();
});

const noop = () => undefined;

function props(overrides: Partial<BeamTimeCalendarProps>): BeamTimeCalendarProps {
  return {
    timeZone: 'America/New_York',
    calendar: undefined,
    configurationName: () => 'OPA signal',
    canEditMaintenance: false,
    onRangeChange: noop,
    onSelectRange: noop,
    onBookingClick: noop,
    onMaintenanceClick: noop,
    onMaintenanceChange: noop,
    ...overrides,
  };
}

async function render(p: BeamTimeCalendarProps) {
  const el = document.createElement('div');
  document.body.innerHTML = '';
  document.body.append(el);
  root = createRoot(el);
  await act(async () => root!.render(<BeamTimeCalendar {...p} />));
  return el;
}

describe('beam-time grid', () => {
  // Expected instants from the IANA tz database: New York is UTC−4 until 02:00 on Sunday 1 Nov 2026 and UTC−5 after;
  // Auckland is UTC+12 (standard time) in June.
  test.each([
    ['a Wednesday in New York', '2026-06-10T15:00:00Z', 'America/New_York', '2026-06-08T04:00:00.000Z', '2026-06-15T04:00:00.000Z'],
    ['the week New York leaves daylight time', '2026-11-01T12:00:00Z', 'America/New_York', '2026-10-26T04:00:00.000Z', '2026-11-02T05:00:00.000Z'],
    ['a Sunday evening in New York, already Monday in UTC', '2026-06-15T02:30:00Z', 'America/New_York', '2026-06-08T04:00:00.000Z', '2026-06-15T04:00:00.000Z'],
    ['a Monday morning in Auckland, still Sunday in UTC', '2026-06-14T20:00:00Z', 'Pacific/Auckland', '2026-06-14T12:00:00.000Z', '2026-06-21T12:00:00.000Z'],
  ])('when the grid opens on %s, then it reports the week the page asked for before it mounted', async (_, now, zone, from, to) => {
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(new Date(now));
    const onRangeChange = vi.fn();
    await render(props({ timeZone: zone, onRangeChange }));
    expect(weekShownAt(new Date(now), zone)).toEqual({ from, to });
    expect(onRangeChange).toHaveBeenCalledWith({ from, to });
  });

  test('when the zone is switched to the viewer\'s, then the grid reports that zone\'s week', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(new Date('2026-06-10T15:00:00Z'));
    const onRangeChange = vi.fn();
    const shared = props({ onRangeChange });
    await render(shared);
    await act(async () => root!.render(<BeamTimeCalendar {...shared} timeZone="Asia/Tokyo" />));
    expect(document.querySelector('[data-testid="calendar"]')?.getAttribute('data-time-zone')).toBe('Asia/Tokyo');
    // Tokyo is UTC+9 all year (IANA tz database): Monday 8 June 00:00 there is 7 June 15:00 UTC
    expect(onRangeChange).toHaveBeenLastCalledWith({ from: '2026-06-07T15:00:00.000Z', to: '2026-06-14T15:00:00.000Z' });
  });

  test('when the page hands new handlers without new data, then a click reaches the newest one', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(new Date('2026-06-10T15:00:00Z'));
    const booking: BookingDto = {
      id: 'b1', instrumentId: 'i1', configurationId: 'c1', configurationKey: 'opa_signal', outputKind: 'opa_signal', status: 'approved',
      startsAt: '2026-06-10T14:00:00Z', endsAt: '2026-06-10T16:00:00Z', own: false, detail: null,
    };
    const calendar: CalendarDto = { bookings: [booking], maintenance: [], changeovers: [] };
    const first = vi.fn();
    const second = vi.fn();
    const shared = props({ calendar, onBookingClick: first });
    await render(shared);
    await act(async () => root!.render(<BeamTimeCalendar {...shared} onBookingClick={second} />));
    const event = document.querySelector<HTMLElement>('[data-testid="booking-event"]')!;
    expect(event.textContent).toContain('Busy · OPA signal');
    // 14:00–16:00 UTC is 10:00–12:00 in New York in June (UTC−4, IANA tz database)
    expect(event.querySelector('.fs-event-time')?.textContent).toBe('10:00 - 12:00');
    await act(async () => event.click());
    expect(first).not.toHaveBeenCalled();
    expect(second).toHaveBeenCalledWith(booking);
  });

  test.each([
    ['within a day', '2026-06-10T10:00:00Z', '2026-06-10T12:30:00Z'],
    ['across midnight', '2026-06-10T22:00:00Z', '2026-06-11T02:00:00Z'],
    ['from midnight', '2026-06-10T00:00:00Z', '2026-06-10T00:30:00Z'],
    ['of no length', '2026-06-10T09:15:00Z', '2026-06-10T09:15:00Z'],
  ])('when an event runs %s, then its time reads as FullCalendar writes the same format', (_, start, end) => {
    const options = { hour: '2-digit', minute: '2-digit', hour12: false, timeZone: 'UTC', locale: 'en' } as const;
    const arg = { start: { marker: new Date(start) }, end: { marker: new Date(end) }, localeCodes: ['en'], defaultSeparator: ' - ' };
    expect(eventTimeText(arg)).toBe(formatRange(start, end, options));
  });
});
