import ical from 'node-ical';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hoursFromNow, makeBooker, makeInstrument, plusHours } from '../../../test-support/booking-fixture';
import { fetchAttachment, waitForMail } from '../../../test-support/maildev';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

const body = (instrumentId: string, configurationId: string, accountId: string, start: Date, hours: number, targetNm: number) =>
  ({ instrumentId, configurationId, accountId, startsAt: start.toISOString(), endsAt: plusHours(start, hours).toISOString(), targetNm, purpose: 'Pump-probe run' });

describe('maintenance windows', () => {
  it('when staff block maintenance over two bookings, then both are displaced, both owners get an .ics cancellation with three alternatives, and one rebooks', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const a = await makeBooker(t);
    const b = await makeBooker(t, { kind: 'external_academic' });
    const start = hoursFromNow(48);
    const ra = await a.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental!.id, a.account.id, start, 2, 800));
    const rb = await b.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental!.id, b.account.id, plusHours(start, 3), 2, 805));
    expect([ra.status, rb.status]).toEqual([201, 201]);
    const { users } = await makePeople(t, ['staff']);
    const staff = await t.signIn(users.staff!.email);
    const m = await staff.post('/api/maintenance').send({ instrumentId: instrument.id, startsAt: plusHours(start, -1).toISOString(), endsAt: plusHours(start, 6).toISOString(), reason: 'Regenerative amplifier pump service' });
    expect(m.status).toBe(201);
    expect(m.body.displaced.map((d: { id: string }) => d.id).sort()).toEqual([ra.body.booking.id, rb.body.booking.id].sort());

    for (const owner of [a, b]) {
      const mail = await waitForMail(owner.user.email, { subjectIncludes: 'displaced' });
      expect(mail.text).toContain('Regenerative amplifier pump service');
      expect(mail.text.match(/^\d\. /gm)).toHaveLength(3);
      expect(mail.attachments?.[0]?.contentType).toMatch(/text\/calendar/);
      expect(await fetchAttachment(mail)).toMatch(/\r\nMETHOD:CANCEL\r\n/);
    }
    const list = await a.agent.get('/api/bookings/needs-rebooking');
    const mine = list.body.bookings.find((x: { id: string }) => x.id === ra.body.booking.id);
    expect(mine.status).toBe('displaced');
    expect(mine.detail.cancellationFeePercent).toBe(0);
    expect(mine.detail.alternatives).toHaveLength(3);
    // Alternatives are after the window and its warm-up (demo model: 30 min).
    for (const alt of mine.detail.alternatives) expect(new Date(alt.startsAt).getTime()).toBeGreaterThanOrEqual(plusHours(start, 6.5).getTime());
    expect(list.body.bookings.some((x: { id: string }) => x.id === rb.body.booking.id)).toBe(false);
    const staffList = await staff.get('/api/bookings/needs-rebooking');
    expect(staffList.body.bookings.map((x: { id: string }) => x.id)).toEqual(expect.arrayContaining([ra.body.booking.id, rb.body.booking.id]));

    const alt = mine.detail.alternatives[0];
    const rebook = await a.agent.post('/api/bookings').send({ ...body(instrument.id, configs.fundamental!.id, a.account.id, new Date(alt.startsAt), 2, 800), rebookOf: ra.body.booking.id });
    expect(rebook.status).toBe(201);
    const after = await a.agent.get('/api/bookings/needs-rebooking');
    expect(after.body.bookings.some((x: { id: string }) => x.id === ra.body.booking.id)).toBe(false);
    const twice = await a.agent.post('/api/bookings').send({ ...body(instrument.id, configs.fundamental!.id, a.account.id, new Date(mine.detail.alternatives[2].startsAt), 2, 800), rebookOf: ra.body.booking.id });
    expect(twice.status).toBe(422);
  });

  it('when a booking starts inside the warm-up after a window, then the next request there is refused with the warm-up as the changeover', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const { users } = await makePeople(t, ['staff']);
    const staff = await t.signIn(users.staff!.email);
    const start = hoursFromNow(30);
    expect((await staff.post('/api/maintenance').send({ instrumentId: instrument.id, startsAt: start.toISOString(), endsAt: plusHours(start, 2).toISOString(), reason: 'Crystal cleaning' })).status).toBe(201);
    const r = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental!.id, me.account.id, plusHours(start, 2.25), 2, 800));
    expect(r.status).toBe(409);
    expect(r.body.error.code).toBe('changeover_gap');
    // Demo model: 30 min warm-up after maintenance plus the 5 min pulse check.
    expect(r.body.error.details).toMatchObject({ neededMinutes: 35, availableMinutes: 15 });
  });

  it('when a member tries to block maintenance, then 403; overlapping maintenance windows are refused with 409', async () => {
    const { instrument } = await makeInstrument(t);
    const me = await makeBooker(t);
    const start = hoursFromNow(30);
    const w = { instrumentId: instrument.id, startsAt: start.toISOString(), endsAt: plusHours(start, 2).toISOString(), reason: 'Realignment' };
    expect((await me.agent.post('/api/maintenance').send(w)).status).toBe(403);
    const { users } = await makePeople(t, ['staff']);
    const staff = await t.signIn(users.staff!.email);
    const first = await staff.post('/api/maintenance').send(w);
    expect(first.status).toBe(201);
    const clash = await staff.post('/api/maintenance').send({ ...w, startsAt: plusHours(start, 1).toISOString(), endsAt: plusHours(start, 3).toISOString() });
    expect(clash.status).toBe(409);
    expect(clash.body.error.code).toBe('overlap');
    const moved = await staff.patch(`/api/maintenance/${first.body.maintenance.id}`).send({ startsAt: plusHours(start, 5).toISOString(), endsAt: plusHours(start, 6).toISOString() });
    expect(moved.status).toBe(200);
    expect((await staff.delete(`/api/maintenance/${first.body.maintenance.id}`)).status).toBe(204);
    expect((await staff.delete(`/api/maintenance/${first.body.maintenance.id}`)).status).toBe(409);
  });
});

describe('the displacement mail attachment', () => {
  it('when parsed by a reference iCalendar parser (node-ical), then it is a cancelled event with our UID', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const start = hoursFromNow(60);
    const r = await me.agent.post('/api/bookings').send(body(instrument.id, configs.shg!.id, me.account.id, start, 2, 400));
    const { users } = await makePeople(t, ['staff']);
    const staff = await t.signIn(users.staff!.email);
    await staff.post('/api/maintenance').send({ instrumentId: instrument.id, startsAt: start.toISOString(), endsAt: plusHours(start, 1).toISOString(), reason: 'Chiller swap' });
    const mail = await waitForMail(me.user.email, { subjectIncludes: 'displaced' });
    const raw = await fetchAttachment(mail);
    const parsed = ical.sync.parseICS(raw);
    const event = Object.values(parsed).find((v) => v.type === 'VEVENT') as { uid: string; status: string; start: Date };
    expect(event.uid).toBe(`${r.body.booking.id}@femtoslot`);
    expect(event.status).toBe('CANCELLED');
    expect(event.start.toISOString()).toBe(start.toISOString());
  });
});
