// Building an Intl.DateTimeFormat costs far more than using one: one per zone and style.
const formatters = new Map<string, Intl.DateTimeFormat>();
function formatter(timeZone: string, withZone: boolean): Intl.DateTimeFormat {
  const key = `${timeZone}|${withZone}`;
  let f = formatters.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat('en-GB', {
      timeZone, weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23',
      ...(withZone ? { timeZoneName: 'short' } : {}),
    });
    formatters.set(key, f);
  }
  return f;
}

/** Date and time of an instant in a zone, for people: "Tue 3 Mar 2026, 14:00". */
export function formatZonedInstant(instant: Date | string, timeZone: string, withZone = false): string {
  return formatter(timeZone, withZone).format(new Date(instant));
}

/**
 * An instant in the facility's zone, named, and in the viewer's when that differs:
 * "Tue 8 Dec 2026, 14:00 (America/New_York) · Tue 8 Dec 2026, 20:00 your time (Europe/Berlin)".
 */
export function describeInstant(instant: Date | string, facilityZone: string, viewerZone?: string | null): string {
  const facility = `${formatZonedInstant(instant, facilityZone)} (${facilityZone})`;
  if (!viewerZone || viewerZone === facilityZone) return facility;
  return `${facility} · ${formatZonedInstant(instant, viewerZone)} your time (${viewerZone})`;
}

// ISO 8601 / RFC 3339 instants as the API writes them: date, time, optional seconds and fraction, then Z or an offset.
const isoInstantPattern = /\b\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(?::\d{2}(?:\.\d+)?)?(?:Z|[+-]\d{2}:\d{2})/g;

/** Rewrites every ISO instant in a message (e.g. an API refusal) with describeInstant. */
export function formatInstantsIn(text: string, facilityZone: string, viewerZone?: string | null): string {
  return text.replace(isoInstantPattern, (match) => {
    const at = new Date(match);
    return Number.isNaN(at.getTime()) ? match : describeInstant(at, facilityZone, viewerZone);
  });
}
