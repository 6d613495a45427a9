import ICAL from 'ical.js';
import { describe, expect, it } from 'vitest';
import { buildCalendar, foldLines, icsParamValue, icsText } from '../ics';

describe('iCalendar writer (RFC 5545)', () => {
  it('when text holds CRLF, LF, a bare CR, controls, HTAB, backslash, semicolon and comma, then it is written as RFC 5545 §3.3.11 TEXT', () => {
    // §3.3.11: ESCAPED-CHAR = "\\" / "\;" / "\," / "\N" / "\n"; TSAFE-CHAR excludes CONTROL (all but HTAB, §3.1).
    expect(icsText('a\r\nb\nc\rd')).toBe('a\\nb\\nc\\nd');
    expect(icsText('x\u0000\u0001\u0007\u000b\u000c\u001b\u007fy')).toBe('xy');
    expect(icsText('tab\there')).toBe('tab\there');
    expect(icsText('C:\\path; one, two')).toBe('C:\\\\path\\; one\\, two');
  });

  it('when a parameter value holds a double quote, a caret or a line break, then it is a quoted-string with RFC 6868 caret escapes', () => {
    // RFC 5545 §3.2: QSAFE-CHAR is any character but CONTROL and DQUOTE; RFC 6868 §3: ^' for DQUOTE, ^^ for ^, ^n for a line break.
    expect(icsParamValue('Dr. "Al" O^Neil\nLab')).toBe(`"Dr. ^'Al^' O^^Neil^nLab"`);
    expect(icsParamValue('Ada\u0007, Lovelace; PhD:x')).toBe('"Ada, Lovelace; PhD:x"');
  });

  it('when a line is longer than 75 octets with multi-byte characters, then it is folded at 75 octets without splitting a character', () => {
    const line = `DESCRIPTION:${'λ✓'.repeat(60)}`;
    const folded = foldLines(line);
    for (const l of folded.split('\r\n')) expect(Buffer.byteLength(l, 'utf8')).toBeLessThanOrEqual(75);
    expect(folded.replace(/\r\n /g, '')).toBe(line); // §3.1 unfolding gives the line back
    expect(folded).not.toContain('\uFFFD');
  });

  it('when an organiser and attendee with awkward names are written, then ical.js reads the event, the names and both addresses back', () => {
    const text = buildCalendar([{
      id: 'b-1', startsAt: new Date('2026-03-08T06:30:00Z'), endsAt: new Date('2026-03-08T08:30:00Z'), title: 'Beam time; DFG, 4260 nm', description: 'x', location: 'Core — Aurora line',
      status: 'CONFIRMED', sequence: 2, organizer: { name: 'Harrow "Core", Desk', email: 'desk@core.test' },
      attendees: [{ name: 'Ann; O\'Neil, PhD', email: 'ann@lab.test', role: 'REQ-PARTICIPANT', partstat: 'ACCEPTED', rsvp: false }],
    }], 'REQUEST', 'Cal', new Date('2026-03-01T12:00:00Z'));
    expect(text).toContain('\r\nDTSTAMP:20260301T120000Z\r\n');
    expect(text).toContain('\r\nDTSTART:20260308T063000Z\r\n');
    // ical.js 2 (an independent parser that implements quoted-string parameters and RFC 6868) reads it back.
    const ev = new ICAL.Component(ICAL.parse(text)).getFirstSubcomponent('vevent')!;
    expect(ev.getFirstPropertyValue('summary')).toBe('Beam time; DFG, 4260 nm');
    expect(ev.getFirstPropertyValue('sequence')).toBe(2);
    const organizer = ev.getFirstProperty('organizer')!;
    expect(organizer.getParameter('cn')).toBe('Harrow "Core", Desk');
    expect(organizer.getFirstValue()).toBe('mailto:desk@core.test');
    const attendee = ev.getFirstProperty('attendee')!;
    expect(attendee.getParameter('cn')).toBe('Ann; O\'Neil, PhD');
    expect(attendee.getParameter('partstat')).toBe('ACCEPTED');
    expect(attendee.getFirstValue()).toBe('mailto:ann@lab.test');
  });
});
