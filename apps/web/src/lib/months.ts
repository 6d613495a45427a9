import { wallTimeAt } from '@femtoslot/shared/time/zoned-time';

const pad = (n: number) => String(n).padStart(2, '0');

/** The calendar month before the one `now` falls in, in the facility zone: the month usually closed next. */
export function previousMonth(now: Date, timeZone: string): string {
  const w = wallTimeAt(now, timeZone);
  return w.month === 1 ? `${w.year - 1}-12` : `${w.year}-${pad(w.month - 1)}`;
}

/** "2026-03" → "March 2026" (a label only: the month itself is the facility-zone month the API bounds). */
export function monthLabel(month: string): string {
  const [year, mon] = month.split('-').map(Number) as [number, number];
  return new Intl.DateTimeFormat('en-GB', { month: 'long', year: 'numeric', timeZone: 'UTC' }).format(new Date(Date.UTC(year, mon - 1, 1)));
}
