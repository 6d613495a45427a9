import { createPlugin } from '@fullcalendar/core';
import { NamedTimeZoneImpl } from '@fullcalendar/core/internal';

const hourMs = 3_600_000;

const formatters = new Map<string, Intl.DateTimeFormat>();
function formatter(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone, hourCycle: 'h23', era: 'short', year: 'numeric', month: 'numeric', day: 'numeric', hour: 'numeric', minute: 'numeric', second: 'numeric',
    });
    formatters.set(timeZone, f);
  }
  return f;
}

/** Milliseconds since the epoch of a wall time read as UTC; setUTCFullYear keeps years 0–99 as they are. */
function utcOf(year: number, month0: number, day: number, hour: number, minute: number, second: number, ms: number): number {
  const d = new Date(0);
  d.setUTCFullYear(year, month0, day);
  d.setUTCHours(hour, minute, second, ms);
  return d.getTime();
}

/** The zone's offset from UTC in minutes at an instant, from the platform's copy of the IANA tz database. */
function exactOffset(timeZone: string, ms: number): number {
  const parts: Record<string, string> = {};
  for (const p of formatter(timeZone).formatToParts(new Date(ms))) parts[p.type] = p.value;
  const year = parts.era === 'BC' ? 1 - Number(parts.year) : Number(parts.year);
  const wall = utcOf(year, Number(parts.month) - 1, Number(parts.day), Number(parts.hour) % 24, Number(parts.minute), Number(parts.second), 0);
  const wholeSeconds = ms - (((ms % 1000) + 1000) % 1000);
  return (wall - wholeSeconds) / 60_000;
}

/**
 * FullCalendar's named-zone arithmetic without luxon (about a fifth of the calendar's script). Offsets are read
 * with Intl once per hour of UTC and reused inside it: a week of events needs about 170 look-ups instead of
 * several per event. An hour whose two ends disagree holds a transition and is read exactly at each instant.
 * Wall times that fall in a gap or an overlap resolve as luxon resolves them, so the grid behaves as before.
 */
export class IntlNamedTimeZone extends NamedTimeZoneImpl {
  private readonly hours = new Map<number, number | null>();

  offsetAt(ms: number): number {
    const hour = Math.floor(ms / hourMs);
    let known = this.hours.get(hour);
    if (known === undefined) {
      const start = exactOffset(this.timeZoneName, hour * hourMs);
      known = start === exactOffset(this.timeZoneName, (hour + 1) * hourMs) ? start : null;
      this.hours.set(hour, known);
    }
    return known ?? exactOffset(this.timeZoneName, ms);
  }

  timestampToArray(ms: number): number[] {
    const d = new Date(ms + this.offsetAt(ms) * 60_000);
    return [d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate(), d.getUTCHours(), d.getUTCMinutes(), d.getUTCSeconds(), d.getUTCMilliseconds()];
  }

  // luxon's fixOffset, starting from the offset in force now as luxon does
  offsetForArray(a: number[]): number {
    const [year = 1970, month0 = 0, day = 1, hour = 0, minute = 0, sec = 0, ms = 0] = a;
    const local = utcOf(year, month0, day, hour, minute, sec, ms);
    const guess = this.offsetAt(Date.now());
    let utc = local - guess * 60_000;
    const second = this.offsetAt(utc);
    if (second === guess) return guess;
    utc -= (second - guess) * 60_000;
    const third = this.offsetAt(utc);
    if (second === third) return second;
    return Math.max(second, third);
  }
}

export const intlTimeZonePlugin = createPlugin({ name: 'femtoslot-intl-time-zone', namedTimeZonedImpl: IntlNamedTimeZone });
