import ical from 'node-ical';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hoursFromNow, makeBooker, makeInstrument, plusHours } from '../../../test-support/booking-fixture';
import { startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

describe('personal iCalendar feed (RFC 5545)', () => {
  it('when fetched with the secret URL, then it parses with node-ical and meets RFC 5545: PRODID, VERSION, UID, DTSTAMP, UTC times, CRLF, 75-octet lines', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const start = hoursFromNow(30);
    const long = 'A deliberately long purpose so that the DESCRIPTION line must be folded at seventy-five octets: λ-scan over the idler ✓';
    const b = await me.agent.post('/api/bookings').send({ instrumentId: instrument.id, configurationId: configs.opa_idler!.id, accountId: me.account.id, startsAt: start.toISOString(), endsAt: plusHours(start, 3).toISOString(), targetNm: 2080, purpose: long });
    expect(b.status).toBe(201);
    const { url } = (await me.agent.get('/api/calendar/feed')).body;
    const path = new URL(url).pathname;
    const res = await t.http().get(path);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/calendar/);
    const text: string = res.text;
    // RFC 5545 §3.1: lines end in CRLF and are folded to at most 75 octets.
    expect(text.split('\n').every((l) => l === '' || l.endsWith('\r'))).toBe(true);
    for (const line of text.split('\r\n')) expect(Buffer.byteLength(line, 'utf8')).toBeLessThanOrEqual(75);
    // RFC 5545 §3.6: VERSION and PRODID are required in the calendar, UID and DTSTAMP in each event.
    expect(text).toMatch(/^BEGIN:VCALENDAR\r\n/);
    expect(text).toMatch(/\r\nVERSION:2\.0\r\n/);
    expect(text).toMatch(/\r\nPRODID:[^\r\n]+\r\n/);
    expect(text).toMatch(new RegExp(`UID:${b.body.booking.id}@femtoslot`));
    expect(text).toMatch(/DTSTAMP:\d{8}T\d{6}Z/);
    expect(text).toMatch(/DTSTART:\d{8}T\d{6}Z/);
    const events = Object.values(ical.sync.parseICS(text)).filter((v) => v.type === 'VEVENT') as unknown as { uid: string; start: Date; end: Date; description: string }[];
    const ev = events.find((e) => e.uid === `${b.body.booking.id}@femtoslot`)!;
    expect(ev.start.toISOString()).toBe(start.toISOString());
    expect(ev.end.toISOString()).toBe(plusHours(start, 3).toISOString());
    expect(ev.description).toBe(long);
  });

  it('when a purpose holds a bare CR, other control characters and ; , \\, then DESCRIPTION is escaped per RFC 5545 §3.3.11, lines stay folded, and node-ical reads the text back', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const start = hoursFromNow(34);
    const purpose = `Pump scan\rX-INJECTED:1\u0001 bell\u0007 esc\u001b; a, b\\c\r\nnext\nline\ttab ${'λ'.repeat(40)}`;
    const b = await me.agent.post('/api/bookings').send({ instrumentId: instrument.id, configurationId: configs.fundamental!.id, accountId: me.account.id, startsAt: start.toISOString(), endsAt: plusHours(start, 2).toISOString(), targetNm: 800, purpose });
    expect(b.status).toBe(201);
    const text: string = (await t.http().get(new URL((await me.agent.get('/api/calendar/feed')).body.url).pathname)).text;
    // RFC 5545 §3.1: CRLF line ends, at most 75 octets a line; §3.3.11: no CONTROL character but HTAB inside a TEXT value.
    expect(text.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
    for (const line of text.split('\r\n')) {
      expect(Buffer.byteLength(line, 'utf8')).toBeLessThanOrEqual(75);
      expect(line).not.toMatch(/[\u0000-\u0008\u000a-\u001f\u007f]/);
    }
    expect(text).not.toMatch(/\r\nX-INJECTED/);
    const unfolded = text.replace(/\r\n[ \t]/g, '');
    // §3.3.11: CR, LF and CRLF become \n; other controls but HTAB go; backslash, semicolon and comma are escaped.
    const expected = `Pump scan\\nX-INJECTED:1 bell esc\\; a\\, b\\\\c\\nnext\\nline\ttab ${'λ'.repeat(40)}`;
    expect(unfolded).toContain(`\r\nDESCRIPTION:${expected}\r\n`);
    const events = Object.values(ical.sync.parseICS(text)).filter((v) => v.type === 'VEVENT') as unknown as { uid: string; description: string }[];
    expect(events.find((e) => e.uid === `${b.body.booking.id}@femtoslot`)!.description).toBe(`Pump scan\nX-INJECTED:1 bell esc; a, b\\c\nnext\nline\ttab ${'λ'.repeat(40)}`);
  });

  it('when the token is regenerated, then the old URL stops working; a made-up token is 404', async () => {
    const me = await makeBooker(t);
    const first = new URL((await me.agent.get('/api/calendar/feed')).body.url).pathname;
    expect((await t.http().get(first)).status).toBe(200);
    const second = new URL((await me.agent.post('/api/calendar/feed/regenerate')).body.url).pathname;
    expect(second).not.toBe(first);
    expect((await t.http().get(first)).status).toBe(404);
    expect((await t.http().get(second)).status).toBe(200);
    expect((await t.http().get('/api/calendar/not-a-real-token-at-all-0000.ics')).status).toBe(404);
  });
});
