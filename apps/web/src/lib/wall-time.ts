import { formatZonedInstant } from '@femtoslot/shared/time/format-instant';
import { type ResolvedWallTime, resolveWallTime, wallTimeAt } from '@femtoslot/shared/time/zoned-time';

/** A wall-clock date and time as the form holds them: 'YYYY-MM-DD' and 'HH:MM'. */
export interface WallFields {
  date: string;
  time: string;
}

const datePattern = /^(\d{4})-(\d{2})-(\d{2})$/;
const timePattern = /^(\d{2}):(\d{2})$/;

const pad = (n: number) => String(n).padStart(2, '0');

export function isWallFields(fields: WallFields): boolean {
  return datePattern.test(fields.date) && timePattern.test(fields.time);
}

export interface ResolvedFields extends ResolvedWallTime {
  /** plain-English note when the wall time was shifted or ambiguous, else null */
  note: string | null;
}

/** Reads a form's date + time in `timeZone` as an instant, RFC 5545 §3.3.5 style (see resolveWallTime). */
export function fieldsToInstant(fields: WallFields, timeZone: string): ResolvedFields | null {
  const d = datePattern.exec(fields.date);
  const t = timePattern.exec(fields.time);
  if (!d || !t) return null;
  const wall = { year: +d[1]!, month: +d[2]!, day: +d[3]!, hour: +t[1]!, minute: +t[2]! };
  if (wall.month < 1 || wall.month > 12 || wall.day < 1 || wall.day > 31 || wall.hour > 23 || wall.minute > 59) return null;
  const resolved = resolveWallTime(wall, timeZone);
  return { ...resolved, note: resolutionNote(fields, resolved, timeZone) };
}

/** The wall-clock fields of an instant in `timeZone`. */
export function instantToFields(instant: Date | string, timeZone: string): WallFields {
  const w = wallTimeAt(typeof instant === 'string' ? new Date(instant) : instant, timeZone);
  return { date: `${w.year}-${pad(w.month)}-${pad(w.day)}`, time: `${pad(w.hour)}:${pad(w.minute)}` };
}

function offsetLabel(instant: Date, timeZone: string): string {
  const part = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'shortOffset' })
    .formatToParts(instant)
    .find((p) => p.type === 'timeZoneName');
  return part?.value.replace('GMT', 'UTC') ?? timeZone;
}

function resolutionNote(fields: WallFields, resolved: ResolvedWallTime, timeZone: string): string | null {
  if (resolved.resolution === 'exact') return null;
  if (resolved.resolution === 'shifted') {
    const read = instantToFields(resolved.instant, timeZone);
    return `${fields.time} does not exist on that day (clocks go forward); it will be read as ${read.time}.`;
  }
  const later = new Date(resolved.instant.getTime() + 3_600_000);
  return (
    `${fields.time} happens twice on that day (clocks go back); the first occurrence is used: ` +
    `${fields.time} ${offsetLabel(resolved.instant, timeZone)}, not ${fields.time} ${offsetLabel(later, timeZone)}.`
  );
}

export function minutesBetween(start: Date | string, end: Date | string): number {
  return Math.round((new Date(end).getTime() - new Date(start).getTime()) / 60_000);
}

/** "4 h", "2 h 30 min", "45 min". */
export function formatMinutes(minutes: number): string {
  const sign = minutes < 0 ? '−' : '';
  const m = Math.abs(minutes);
  const h = Math.floor(m / 60);
  const rest = m % 60;
  if (h === 0) return `${sign}${rest} min`;
  return rest === 0 ? `${sign}${h} h` : `${sign}${h} h ${rest} min`;
}

/** Date and time of an instant in a zone, for people: "Tue 3 Mar 2026, 14:00". */
export const formatInstant = formatZonedInstant;

/** The viewer's own zone, as the browser reports it (Intl resolvedOptions). */
export function viewerTimeZone(): string {
  return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
}
