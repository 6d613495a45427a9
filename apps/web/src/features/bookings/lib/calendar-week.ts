import { localDate, zonedToUtc } from '@femtoslot/shared/time/zoned-time';

/** The grid's weeks start on Monday (FullCalendar's `firstDay`). */
export const firstDayOfWeek = 1;

export interface WeekRange {
  from: string;
  to: string;
}

/**
 * The week the grid opens on, as FullCalendar will report it: local midnight on the Monday of `now`'s week in
 * the zone, to the next Monday's. Known before the grid mounts, so the week's bookings can be asked for early.
 */
export function weekShownAt(now: Date, timeZone: string): WeekRange {
  const [year, month, day] = localDate(now, timeZone).split('-').map(Number) as [number, number, number];
  const back = (new Date(Date.UTC(year, month - 1, day)).getUTCDay() - firstDayOfWeek + 7) % 7;
  const midnight = (offsetDays: number) => {
    const civil = new Date(Date.UTC(year, month - 1, day - back + offsetDays));
    const wall = { year: civil.getUTCFullYear(), month: civil.getUTCMonth() + 1, day: civil.getUTCDate(), hour: 0, minute: 0 };
    return zonedToUtc(wall, timeZone).toISOString();
  };
  return { from: midnight(0), to: midnight(7) };
}
