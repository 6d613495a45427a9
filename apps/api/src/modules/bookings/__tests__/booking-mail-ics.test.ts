import ical from 'node-ical';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hoursFromNow, makeBooker, makeInstrument, plusHours } from '../../../test-support/booking-fixture';
import { fetchAttachment, waitForMail } from '../../../test-support/maildev';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';
import { FacilitySettings } from '../../facility/facility-settings.entity';

const MAIL_FROM = 'Aurora Scheduling <beam-desk@harrow-core.test>';
let t: TestApi;
let facilityName: string;
beforeAll(async () => {
  t = await startTestApi({ MAIL_FROM });
  facilityName = (await t.api.ctx.db.getRepository(FacilitySettings).findOneByOrFail({ id: 1 })).name;
});
afterAll(async () => { await t?.close(); });

type Person = { params: Record<string, string | boolean>; val: string };
interface ParsedEvent { type: string; uid: string; description?: string; summary?: string; sequence?: string; organizer?: Person; attendee?: Person | Person[]; status?: string; start?: Date; dtstamp?: Date }

/** Every property name of each VEVENT as written, counted (after RFC 5545 §3.1 unfolding). */
function propertyCounts(text: string): Map<string, number>[] {
  const lines = text.replace(/\r\n[ \t]/g, '').split('\r\n');
  const events: Map<string, number>[] = [];
  let current: Map<string, number> | null = null;
  for (const line of lines) {
    if (line === 'BEGIN:VEVENT') { current = new Map(); continue; }
    if (line === 'END:VEVENT') { events.push(current!); current = null; continue; }
    if (!current) continue;
    const name = /^[A-Z-]+/.exec(line)![0];
    current.set(name, (current.get(name) ?? 0) + 1);
  }
  return events;
}

function checkRawLines(text: string) {
  // RFC 5545 §3.1: CRLF line ends, lines folded to at most 75 octets; §3.3.11: no CONTROL character but HTAB in a value.
  expect(text.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
  for (const line of text.split('\r\n')) {
    expect(Buffer.byteLength(line, 'utf8')).toBeLessThanOrEqual(75);
    expect(line).not.toMatch(/[\u0000-\u0008\u000a-\u001f\u007f]/);
  }
}

const eventOf = (text: string) => Object.values(ical.sync.parseICS(text)).find((v) => v.type === 'VEVENT') as unknown as ParsedEvent;
const asList = (a: Person | Person[] | undefined) => (a === undefined ? [] : Array.isArray(a) ? a : [a]);

describe('booking e-mail calendars (RFC 5546 iTIP)', () => {
  it('when a booking is confirmed and then cancelled, then the mails carry METHOD:REQUEST and METHOD:CANCEL with every property RFC 5546 requires, ORGANIZER and ATTENDEE, and a higher SEQUENCE', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const start = hoursFromNow(100);
    const purpose = 'Gain dynamics\rX-INJECTED:1 bell\u0007; set A, set B\\raw';
    const created = await me.agent.post('/api/bookings').send({ instrumentId: instrument.id, configurationId: configs.opa_signal!.id, accountId: me.account.id, startsAt: start.toISOString(), endsAt: plusHours(start, 2).toISOString(), targetNm: 1300, purpose });
    expect(created.status).toBe(201);
    const id = created.body.booking.id as string;

    const confirmed = await waitForMail(me.user.email, { subjectIncludes: 'Beam time confirmed' });
    expect(confirmed.attachments?.[0]?.contentType).toMatch(/text\/calendar/);
    const request = await fetchAttachment(confirmed);
    checkRawLines(request);
    // RFC 5546 §3.2.2, constraints for METHOD:REQUEST of a VEVENT: METHOD is REQUEST; each VEVENT has exactly one
    // DTSTAMP, DTSTART, ORGANIZER, SUMMARY and UID, one or more ATTENDEE, and SEQUENCE (at most one; present when > 0).
    expect(request).toMatch(/\r\nMETHOD:REQUEST\r\n/);
    const [requestProps] = propertyCounts(request);
    for (const name of ['DTSTAMP', 'DTSTART', 'ORGANIZER', 'SUMMARY', 'UID']) expect(requestProps!.get(name), name).toBe(1);
    expect(requestProps!.get('ATTENDEE')).toBeGreaterThanOrEqual(1);
    expect(requestProps!.get('SEQUENCE') ?? 0).toBeLessThanOrEqual(1);
    expect(requestProps!.get('DTEND')).toBe(1);
    expect(requestProps!.get('DURATION')).toBeUndefined(); // DTEND and DURATION are exclusive (§3.2.2)
    const req = eventOf(request);
    expect(req.uid).toBe(`${id}@femtoslot`);
    expect(req.start!.toISOString()).toBe(start.toISOString());
    // §3.3.11 TEXT, read back by node-ical: the bare CR is a line break in the value, the BEL is gone.
    expect(req.description).toBe('Gain dynamics\nX-INJECTED:1 bell; set A, set B\\raw');
    expect(req.organizer).toMatchObject({ params: { CN: facilityName }, val: 'mailto:beam-desk@harrow-core.test' });
    const [attendee] = asList(req.attendee);
    expect(attendee).toMatchObject({ params: { CN: me.user.name, ROLE: 'REQ-PARTICIPANT', PARTSTAT: 'ACCEPTED', RSVP: false }, val: `mailto:${me.user.email}` });
    const requestSequence = Number(req.sequence ?? 0);

    const cancelled = await me.agent.post(`/api/bookings/${id}/cancel`).send({ reason: 'Sample not ready' });
    expect(cancelled.status).toBe(200);
    const cancelMail = await waitForMail(me.user.email, { subjectIncludes: 'Beam time cancelled' });
    expect(cancelMail.attachments?.[0]?.contentType).toMatch(/text\/calendar/);
    const cancel = await fetchAttachment(cancelMail);
    checkRawLines(cancel);
    // RFC 5546 §3.2.5, constraints for METHOD:CANCEL of a VEVENT: METHOD is CANCEL; each VEVENT has exactly one
    // DTSTAMP, ORGANIZER, SEQUENCE and UID (the UID of the original REQUEST); all Attendees when the whole event is
    // cancelled; STATUS:CANCELLED to cancel the entire event; "the SEQUENCE property value MUST be incremented".
    expect(cancel).toMatch(/\r\nMETHOD:CANCEL\r\n/);
    const [cancelProps] = propertyCounts(cancel);
    for (const name of ['DTSTAMP', 'ORGANIZER', 'SEQUENCE', 'UID']) expect(cancelProps!.get(name), name).toBe(1);
    expect(cancelProps!.get('ATTENDEE')).toBeGreaterThanOrEqual(1);
    const can = eventOf(cancel);
    expect(can.uid).toBe(req.uid);
    expect(can.status).toBe('CANCELLED');
    expect(Number(can.sequence)).toBeGreaterThan(requestSequence);
    expect(can.organizer).toMatchObject({ params: { CN: facilityName }, val: 'mailto:beam-desk@harrow-core.test' });
    expect(asList(can.attendee).map((a) => a.val)).toEqual([`mailto:${me.user.email}`]);
  });

  it('when staff approve an external request, then the REQUEST carries SEQUENCE above 0 (RFC 5546 §3.2.2: present when greater than 0) and the requester as ATTENDEE', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const ext = await makeBooker(t, { kind: 'external_academic' });
    const start = hoursFromNow(120);
    const created = await ext.agent.post('/api/bookings').send({ instrumentId: instrument.id, configurationId: configs.dfg!.id, accountId: ext.account.id, startsAt: start.toISOString(), endsAt: plusHours(start, 3).toISOString(), targetNm: 4260, purpose: 'Mid-IR absorption of CH4' });
    expect(created.status).toBe(201);
    const { users } = await makePeople(t, ['staff']);
    const staff = await t.signIn(users.staff!.email);
    expect((await staff.post(`/api/bookings/${created.body.booking.id}/approve`)).status).toBe(200);
    const text = await fetchAttachment(await waitForMail(ext.user.email, { subjectIncludes: 'Beam time confirmed' }));
    const ev = eventOf(text);
    expect(Number(ev.sequence)).toBeGreaterThan(0);
    expect(text).toMatch(/\r\nSEQUENCE:\d+\r\n/);
    expect(asList(ev.attendee)).toEqual([expect.objectContaining({ val: `mailto:${ext.user.email}` })]);
  });
});
