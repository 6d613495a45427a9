import type { BookingDto, CalendarDto } from '@femtoslot/shared';
import { describe, expect, test } from 'vitest';
import { eventDataAttributes, toGridEvents } from './calendar-events';

function booking(id: string, status: BookingDto['status'], detail: boolean): BookingDto {
  return {
    id, instrumentId: 'i1', configurationId: 'c-dfg', configurationKey: 'dfg', outputKind: 'dfg', status,
    startsAt: '2026-06-01T13:00:00Z', endsAt: '2026-06-01T16:00:00Z', own: detail,
    detail: detail
      ? { userId: 'u', userName: 'Ann', organisationId: 'o', organisationName: 'Org', accountId: 'a', accountName: 'CC-1', purpose: 'gas lines',
          targetMinNm: 4300, targetMaxNm: 4300, declineReason: null, cancellationFeePercent: null, alternatives: [], rebookedAs: null, changeoverBeforeMinutes: 45 }
      : null,
  };
}

const calendar: CalendarDto = {
  bookings: [booking('b1', 'approved', true), booking('b2', 'requested', false), booking('b3', 'displaced', true), booking('b4', 'cancelled', true)],
  maintenance: [
    { id: 'm1', instrumentId: 'i1', startsAt: '2026-06-02T12:00:00Z', endsAt: '2026-06-02T15:00:00Z', reason: 'Pump diode swap', status: 'scheduled' },
    { id: 'm2', instrumentId: 'i1', startsAt: '2026-06-03T12:00:00Z', endsAt: '2026-06-03T15:00:00Z', reason: 'Called off', status: 'cancelled' },
  ],
  changeovers: [{ instrumentId: 'i1', afterId: 'b1', beforeId: 'b2', startsAt: '2026-06-01T16:00:00Z', endsAt: '2026-06-01T16:45:00Z', minutes: 45, availableMinutes: 60 }],
};

describe('calendar events', () => {
  const events = toGridEvents(calendar, { configurationName: () => 'DFG mid-IR', canEditMaintenance: false });

  test('when bookings are displaced or cancelled, then they are left off the grid', () => {
    expect(events.filter((e) => e.id.startsWith('booking:')).map((e) => e.id)).toEqual(['booking:b1', 'booking:b2']);
  });
  test("when a booking belongs to another organisation, then it reads 'Busy · <configuration>'", () => {
    expect(events.find((e) => e.id === 'booking:b2')?.title).toBe('Busy · DFG mid-IR');
    expect(events.find((e) => e.id === 'booking:b1')?.title).toBe('DFG mid-IR · 4,300 nm');
  });
  test('when a booking is only requested, then it is drawn tentative', () => {
    expect(events.find((e) => e.id === 'booking:b2')?.classNames).toContain('fs-tentative');
  });
  test('when a changeover band is drawn, then it is a labelled background event', () => {
    const band = events.find((e) => e.id.startsWith('changeover:'))!;
    expect(band.display).toBe('background');
    expect(band.title).toBe('⟳ 45 min');
    expect(eventDataAttributes(band.extendedProps.item)).toMatchObject({ testid: 'changeover-band', minutes: '45' });
  });
  test('when maintenance is cancelled, then it is not drawn; scheduled maintenance is editable only for staff', () => {
    expect(events.filter((e) => e.id.startsWith('maintenance:')).map((e) => e.id)).toEqual(['maintenance:m1']);
    expect(events.find((e) => e.id === 'maintenance:m1')?.editable).toBe(false);
    const staff = toGridEvents(calendar, { configurationName: () => 'x', canEditMaintenance: true });
    expect(staff.find((e) => e.id === 'maintenance:m1')?.editable).toBe(true);
  });
});
