import { localDate, wallTimeAt, zonedToUtc } from '../time/zoned-time';

/** A calendar month (YYYY-MM) in the facility's zone as a half-open UTC interval [startsAt, endsAt). */
export function monthBounds(month: string, timeZone: string): { startsAt: Date; endsAt: Date } {
  const [year, mon] = month.split('-').map(Number) as [number, number];
  const next = mon === 12 ? { year: year + 1, month: 1 } : { year, month: mon + 1 };
  return {
    startsAt: zonedToUtc({ year, month: mon, day: 1, hour: 0, minute: 0 }, timeZone),
    endsAt: zonedToUtc({ ...next, day: 1, hour: 0, minute: 0 }, timeZone),
  };
}

/** The month (YYYY-MM) an instant falls in, in the zone. */
export const monthOf = (at: Date, timeZone: string): string => localDate(at, timeZone).slice(0, 7);

/** The month before (YYYY-MM). */
export function previousMonthOf(month: string): string {
  const [y, m] = month.split('-').map(Number) as [number, number];
  return m === 1 ? `${y - 1}-12` : `${y}-${String(m - 1).padStart(2, '0')}`;
}

export interface BillableMonthInput {
  month: string;
  timeZone: string;
  now: Date;
  /** Year (facility zone) of the facility's first booking; none yet: the current year. */
  firstBookingYear: number | null;
}

export type BillableMonthVerdict =
  | { ok: true; startsAt: Date; endsAt: Date }
  | { ok: false; code: 'month_out_of_range' | 'month_not_ended'; message: string; details: Record<string, string> };

const wall = (d: Date, tz: string) => {
  const w = wallTimeAt(d, tz);
  return `${localDate(d, tz)} ${String(w.hour).padStart(2, '0')}:${String(w.minute).padStart(2, '0')}`;
};

/**
 * Whether a month can be billed now: from January of the facility's first booking year up to the last month whose
 * end (midnight on the 1st of the next month, facility zone) has passed. Months beyond next year are refused as out of
 * range rather than as "not ended", since they are almost certainly typing slips.
 */
export function checkBillableMonth({ month, timeZone, now, firstBookingYear }: BillableMonthInput): BillableMonthVerdict {
  const current = monthOf(now, timeZone);
  const currentYear = Number(current.slice(0, 4));
  const earliestMonth = `${String(firstBookingYear ?? currentYear).padStart(4, '0')}-01`;
  const latestMonth = previousMonthOf(current);
  const range = { month, earliestMonth, latestMonth, timeZone };
  // YYYY-MM strings compare as dates.
  if (month < earliestMonth || Number(month.slice(0, 4)) > currentYear + 1) {
    return {
      ok: false, code: 'month_out_of_range', details: range,
      message: `${month} cannot be billed: billing periods run from ${earliestMonth} (the year of the facility's first booking) to ${latestMonth}`,
    };
  }
  const bounds = monthBounds(month, timeZone);
  if (bounds.endsAt.getTime() > now.getTime()) {
    return {
      ok: false, code: 'month_not_ended',
      details: { ...range, endsAt: bounds.endsAt.toISOString(), endsAtLocal: wall(bounds.endsAt, timeZone) },
      message: `${month} has not ended yet: it ends at ${wall(bounds.endsAt, timeZone)} ${timeZone}; the latest month that can be billed is ${latestMonth}`,
    };
  }
  return { ok: true, ...bounds };
}
