import { createEvents, type EventAttributes } from 'ics';

export interface IcsBooking {
  id: string;
  startsAt: Date;
  endsAt: Date;
  title: string;
  description: string;
  location: string;
  status: 'CONFIRMED' | 'TENTATIVE' | 'CANCELLED';
  sequence: number;
}

const PRODUCT_ID = '-//Femtoslot//Beam time//EN';
export const icsUid = (id: string) => `${id}@femtoslot`;

/**
 * An RFC 5545 calendar built by the `ics` package: times in UTC (so no VTIMEZONE is needed), CRLF line ends and
 * lines folded at 75 octets by the package. METHOD:CANCEL goes with a cancellation mail, REQUEST with an invitation.
 */
/** RFC 5545 §3.1: fold content lines longer than 75 octets (not characters), never inside a UTF-8 sequence. */
export function foldLines(text: string): string {
  const unfolded = text.replace(/\r\n[ \t]/g, '');
  return unfolded.split('\r\n').map((line) => {
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

export function buildCalendar(events: IcsBooking[], method: 'PUBLISH' | 'REQUEST' | 'CANCEL' = 'PUBLISH', calName = 'Femtoslot beam time'): string {
  const attributes: EventAttributes[] = events.map((e) => ({
    uid: icsUid(e.id),
    start: e.startsAt.getTime(),
    startInputType: 'utc',
    startOutputType: 'utc',
    end: e.endsAt.getTime(),
    endInputType: 'utc',
    endOutputType: 'utc',
    title: e.title,
    description: e.description,
    location: e.location,
    status: e.status,
    sequence: e.sequence,
    productId: PRODUCT_ID,
  }));
  if (attributes.length === 0) {
    return ['BEGIN:VCALENDAR', 'VERSION:2.0', `PRODID:${PRODUCT_ID}`, `METHOD:${method}`, `X-WR-CALNAME:${calName}`, 'END:VCALENDAR', ''].join('\r\n');
  }
  const { error, value } = createEvents(attributes, { productId: PRODUCT_ID, method, calName });
  if (error || !value) throw error ?? new Error('could not build the calendar');
  return foldLines(value.replace(/\r?\n/g, '\r\n'));
}
