import type { BookingDto, CalendarDto, ChangeoverBandDto, MaintenanceDto } from '@femtoslot/shared';
import { type OutputKind, outputKindLabels } from '@femtoslot/shared/facility/output-kinds';
import { configurationColour } from '../../../lib/configuration-colour';

export type CalendarItem =
  | { kind: 'booking'; booking: BookingDto }
  | { kind: 'maintenance'; maintenance: MaintenanceDto }
  | { kind: 'changeover'; band: ChangeoverBandDto };

/** The shape FullCalendar's `events` accepts, kept free of FullCalendar types so it can be tested alone. */
export interface GridEvent {
  id: string;
  title: string;
  start: string;
  end: string;
  display?: 'background';
  classNames: string[];
  backgroundColor?: string;
  borderColor?: string;
  textColor?: string;
  editable: boolean;
  startEditable?: boolean;
  durationEditable?: boolean;
  extendedProps: { item: CalendarItem };
}

/** Statuses that hold time on the source; the others are listed beside the grid, not drawn on it. */
export const onGridStatuses: ReadonlySet<BookingDto['status']> = new Set(['requested', 'approved', 'completed']);

const nm = new Intl.NumberFormat('en', { maximumFractionDigits: 1 });

export function targetLabel(detail: NonNullable<BookingDto['detail']>): string {
  return detail.targetMinNm === detail.targetMaxNm
    ? `${nm.format(detail.targetMinNm)} nm`
    : `${nm.format(detail.targetMinNm)}–${nm.format(detail.targetMaxNm)} nm`;
}

export function bookingTitle(booking: BookingDto, configurationName: string): string {
  if (!booking.detail) return `Busy · ${configurationName}`;
  return `${configurationName} · ${targetLabel(booking.detail)}`;
}

export interface GridOptions {
  /** configuration id → its name; falls back to the output kind's label */
  configurationName: (configurationId: string, outputKind: string) => string;
  /** staff may drag and resize maintenance windows */
  canEditMaintenance: boolean;
  /** instrument id → its name, for the end stations a booking takes along */
  stationName?: (instrumentId: string) => string;
}

/** " · with Pump-probe station" for a booking that includes end stations. */
export function stationsSuffix(stationIds: string[] | undefined, stationName: ((id: string) => string) | undefined): string {
  if (!stationIds?.length || !stationName) return '';
  return ` · with ${stationIds.map(stationName).join(', ')}`;
}

export function defaultConfigurationName(outputKind: string): string {
  return outputKindLabels[outputKind as OutputKind] ?? outputKind;
}

export function toGridEvents(calendar: CalendarDto, options: GridOptions): GridEvent[] {
  const events: GridEvent[] = [];
  for (const booking of calendar.bookings) {
    if (!onGridStatuses.has(booking.status)) continue;
    const colour = configurationColour(booking.outputKind as OutputKind);
    const name = options.configurationName(booking.configurationId, booking.outputKind);
    const hex = colour?.hex ?? '#555555';
    const tentative = booking.status === 'requested';
    events.push({
      id: `booking:${booking.id}`,
      title: bookingTitle(booking, name) + stationsSuffix(booking.stationIds, options.stationName),
      start: booking.startsAt,
      end: booking.endsAt,
      classNames: [
        'fs-booking',
        `fs-output-${booking.outputKind}`,
        ...(tentative ? ['fs-tentative'] : []),
        ...(booking.detail ? [] : ['fs-busy']),
        ...(booking.stationIds?.length ? ['fs-with-station'] : []),
      ],
      // a request is drawn as a pale tint of its colour with a dashed outline (see .fs-tentative)
      backgroundColor: tentative ? `color-mix(in srgb, ${hex} 20%, var(--color-panel))` : hex,
      borderColor: hex,
      textColor: tentative ? 'var(--color-ink)' : '#ffffff',
      editable: false,
      extendedProps: { item: { kind: 'booking', booking } },
    });
  }
  for (const maintenance of calendar.maintenance) {
    if (maintenance.status !== 'scheduled') continue;
    events.push({
      id: `maintenance:${maintenance.id}`,
      title: maintenance.reason,
      start: maintenance.startsAt,
      end: maintenance.endsAt,
      classNames: ['fs-maintenance'],
      editable: options.canEditMaintenance,
      startEditable: options.canEditMaintenance,
      durationEditable: options.canEditMaintenance,
      extendedProps: { item: { kind: 'maintenance', maintenance } },
    });
  }
  for (const band of calendar.changeovers) {
    if (band.minutes <= 0) continue;
    events.push({
      id: `changeover:${band.afterId}:${band.beforeId}`,
      title: `⟳ ${band.minutes} min`,
      start: band.startsAt,
      end: band.endsAt,
      display: 'background',
      classNames: ['fs-changeover', ...(band.availableMinutes < band.minutes ? ['fs-changeover-short'] : [])],
      editable: false,
      extendedProps: { item: { kind: 'changeover', band } },
    });
  }
  return events;
}

/** Data attributes put on each event's element, for people using assistive tech and for browser tests. */
export function eventDataAttributes(item: CalendarItem): Record<string, string> {
  switch (item.kind) {
    case 'booking':
      return {
        testid: 'booking-event',
        bookingId: item.booking.id,
        status: item.booking.status,
        outputKind: item.booking.outputKind,
        visibility: item.booking.detail ? 'detail' : 'busy',
        stations: (item.booking.stationIds ?? []).join(' '),
      };
    case 'maintenance':
      return { testid: 'maintenance-event', maintenanceId: item.maintenance.id };
    case 'changeover':
      return { testid: 'changeover-band', minutes: String(item.band.minutes), afterId: item.band.afterId, beforeId: item.band.beforeId };
  }
}
