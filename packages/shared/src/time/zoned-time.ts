/**
 * Wall-clock time in an IANA zone ↔ UTC instants, with Intl (the platform's copy of the IANA tz database).
 * A wall time that does not exist (spring-forward gap) resolves as RFC 5545 §3.3.5 prescribes: it is read with the
 * offset in force before the gap, which lands it one gap-length later (02:30 → 03:30 in New York on 2026-03-08).
 * An ambiguous wall time (fall-back overlap) takes the first occurrence (the earlier instant), as RFC 5545 also says.
 */
export interface WallTime {
  year: number;
  month: number; // 1-12
  day: number;
  hour: number;
  minute: number;
  second?: number;
}

const formatters = new Map<string, Intl.DateTimeFormat>();
function formatter(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', second: '2-digit',
    });
    formatters.set(timeZone, f);
  }
  return f;
}

export function isValidTimeZone(timeZone: string): boolean {
  try {
    formatter(timeZone);
    return true;
  } catch {
    return false;
  }
}

/** The wall time shown in `timeZone` at the instant `date`. */
export function wallTimeAt(date: Date, timeZone: string): Required<WallTime> {
  const parts = Object.fromEntries(formatter(timeZone).formatToParts(date).map((p) => [p.type, p.value]));
  return { year: +parts.year, month: +parts.month, day: +parts.day, hour: +parts.hour, minute: +parts.minute, second: +parts.second };
}

/** Offset of the zone from UTC at an instant, in minutes (New York in winter: −300). */
export function offsetMinutesAt(date: Date, timeZone: string): number {
  const w = wallTimeAt(date, timeZone);
  const asUtc = Date.UTC(w.year, w.month - 1, w.day, w.hour, w.minute, w.second);
  return Math.round((asUtc - Math.floor(date.getTime() / 1000) * 1000) / 60_000);
}

export interface ResolvedWallTime {
  instant: Date;
  /** 'exact', 'shifted' (did not exist; moved forward by the gap) or 'ambiguous' (first of two occurrences taken). */
  resolution: 'exact' | 'shifted' | 'ambiguous';
}

export function resolveWallTime(w: WallTime, timeZone: string): ResolvedWallTime {
  const naive = Date.UTC(w.year, w.month - 1, w.day, w.hour, w.minute, w.second ?? 0);
  // Candidate offsets: the ones in force a day either side cover every real transition.
  const offsets = new Set([offsetMinutesAt(new Date(naive - 86_400_000), timeZone), offsetMinutesAt(new Date(naive + 86_400_000), timeZone), offsetMinutesAt(new Date(naive), timeZone)]);
  const matches = [...offsets]
    .map((o) => naive - o * 60_000)
    .filter((t) => {
      const back = wallTimeAt(new Date(t), timeZone);
      return back.year === w.year && back.month === w.month && back.day === w.day && back.hour === w.hour && back.minute === w.minute;
    })
    .sort((a, b) => a - b);
  if (matches.length === 1) return { instant: new Date(matches[0]!), resolution: 'exact' };
  if (matches.length > 1) return { instant: new Date(matches[0]!), resolution: 'ambiguous' };
  // In a gap: use the offset from before the transition (RFC 5545 §3.3.5).
  const before = offsetMinutesAt(new Date(naive - 86_400_000), timeZone);
  return { instant: new Date(naive - before * 60_000), resolution: 'shifted' };
}

export const zonedToUtc = (w: WallTime, timeZone: string): Date => resolveWallTime(w, timeZone).instant;

/** The calendar date (YYYY-MM-DD) of an instant in a zone. */
export function localDate(date: Date, timeZone: string): string {
  const w = wallTimeAt(date, timeZone);
  return `${w.year}-${String(w.month).padStart(2, '0')}-${String(w.day).padStart(2, '0')}`;
}
