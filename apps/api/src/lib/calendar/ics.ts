export interface IcsPerson {
  name: string;
  email: string;
}

export interface IcsAttendee extends IcsPerson {
  /** RFC 5545 §3.2.16 */
  role: 'REQ-PARTICIPANT';
  /** RFC 5545 §3.2.12; left out when the message does not ask for a participation status (a cancellation). */
  partstat?: 'ACCEPTED' | 'NEEDS-ACTION';
  /** RFC 5545 §3.2.17: whether the organiser expects a reply. */
  rsvp: boolean;
}

export interface IcsBooking {
  id: string;
  startsAt: Date;
  endsAt: Date;
  title: string;
  description: string;
  location: string;
  status: 'CONFIRMED' | 'TENTATIVE' | 'CANCELLED';
  sequence: number;
  /** RFC 5546 scheduling messages (REQUEST, CANCEL) name the organiser and every attendee. */
  organizer?: IcsPerson;
  attendees?: IcsAttendee[];
}

const PRODUCT_ID = '-//Femtoslot//Beam time//EN';
export const icsUid = (id: string) => `${id}@femtoslot`;

/** RFC 5545 §3.1 CONTROL = %x00-08 / %x0A-1F / %x7F: everything but HTAB. */
const CONTROL = /[\u0000-\u0008\u000A-\u001F\u007F]/g;

/**
 * A TEXT value (RFC 5545 §3.3.11), the one path for every text an .ics carries: CRLF, LF and a bare CR become the
 * escaped line break "\n"; any other CONTROL character is dropped (HTAB stays); backslash, semicolon and comma are
 * escaped with a backslash.
 */
export function icsText(value: string): string {
  return value
    .replace(/\r\n|\r|\n/g, '\n')
    .replace(/[\u0000-\u0008\u000B-\u001F\u007F]/g, '')
    .replace(/[\\;,]/g, (c) => `\\${c}`)
    .replace(/\n/g, '\\n');
}

/**
 * A parameter value such as CN (RFC 5545 §3.2): always a quoted-string, whose characters may be anything but CONTROL
 * and DQUOTE; a double quote, a caret and a line break are written with RFC 6868's caret escapes (^' ^^ ^n).
 */
export function icsParamValue(value: string): string {
  const text = value.replace(/\r\n|\r|\n/g, '\n').replace(/\^/g, '^^').replace(/"/g, "^'").replace(/\n/g, '^n').replace(CONTROL, '');
  return `"${text}"`;
}

/** A mailto: URI (RFC 5545 §3.3.3 CAL-ADDRESS) for an address the app has validated; controls and spaces cannot be in it. */
const calAddress = (email: string) => `mailto:${email.replace(CONTROL, '').replace(/\s/g, '')}`;

/** RFC 5545 §3.3.5 form #2, UTC: 20260301T140000Z. */
const utc = (d: Date) => d.toISOString().replace(/[-:]/g, '').replace(/\.\d{3}/, '');

/** RFC 5545 §3.1: fold content lines longer than 75 octets (not characters), never inside a UTF-8 sequence. */
export function foldLines(text: string): string {
  return text.split('\r\n').map((line) => {
    const out: string[] = [];
    let current = '';
    let octets = 0;
    for (const ch of line) {
      const size = Buffer.byteLength(ch, 'utf8');
      const limit = out.length === 0 ? 75 : 74; // continuation lines start with one space
      if (octets + size > limit) {
        out.push(current);
        current = '';
        octets = 0;
      }
      current += ch;
      octets += size;
    }
    out.push(current);
    return out.join('\r\n ');
  }).join('\r\n');
}

function eventLines(e: IcsBooking, stamp: string): string[] {
  const lines = [
    'BEGIN:VEVENT',
    `UID:${icsText(icsUid(e.id))}`,
    `DTSTAMP:${stamp}`,
    `DTSTART:${utc(e.startsAt)}`,
    `DTEND:${utc(e.endsAt)}`,
    `SEQUENCE:${Math.max(0, Math.trunc(e.sequence))}`,
    `SUMMARY:${icsText(e.title)}`,
  ];
  if (e.description) lines.push(`DESCRIPTION:${icsText(e.description)}`);
  if (e.location) lines.push(`LOCATION:${icsText(e.location)}`);
  lines.push(`STATUS:${e.status}`);
  if (e.organizer) lines.push(`ORGANIZER;CN=${icsParamValue(e.organizer.name)}:${calAddress(e.organizer.email)}`);
  for (const a of e.attendees ?? []) {
    const params = [`CUTYPE=INDIVIDUAL`, `ROLE=${a.role}`, ...(a.partstat ? [`PARTSTAT=${a.partstat}`] : []), `RSVP=${a.rsvp ? 'TRUE' : 'FALSE'}`, `CN=${icsParamValue(a.name)}`];
    lines.push(`ATTENDEE;${params.join(';')}:${calAddress(a.email)}`);
  }
  lines.push('END:VEVENT');
  return lines;
}

/**
 * An RFC 5545 calendar: times in UTC (so no VTIMEZONE is needed), CRLF line ends, lines folded at 75 octets, every
 * text value through icsText. METHOD:CANCEL goes with a cancellation mail, REQUEST with an invitation (RFC 5546).
 * Written here rather than by the `ics` package, which let a bare CR and other control characters through and
 * backslash-escaped quotes inside parameter values, which RFC 5545 §3.2 does not allow.
 */
export function buildCalendar(events: IcsBooking[], method: 'PUBLISH' | 'REQUEST' | 'CANCEL' = 'PUBLISH', calName = 'Femtoslot beam time', now = new Date()): string {
  const stamp = utc(now);
  const lines = ['BEGIN:VCALENDAR', 'VERSION:2.0', `PRODID:${PRODUCT_ID}`, 'CALSCALE:GREGORIAN', `METHOD:${method}`, `X-WR-CALNAME:${icsText(calName)}`];
  for (const e of events) lines.push(...eventLines(e, stamp));
  lines.push('END:VCALENDAR');
  return foldLines(`${lines.join('\r\n')}\r\n`);
}
