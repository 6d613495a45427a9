import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hoursFromNow, makeBooker, makeInstrument, plusHours } from '../../../test-support/booking-fixture';
import { waitForMail } from '../../../test-support/maildev';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

const body = (instrumentId: string, configurationId: string, accountId: string, start: Date, hours: number, targetNm: number) =>
  ({ instrumentId, configurationId, accountId, startsAt: start.toISOString(), endsAt: plusHours(start, hours).toISOString(), targetNm, purpose: 'Confidential sensor prototype test' });

describe('who sees what', () => {
  it('when a collaborator views the calendar, then another organisation’s booking is busy with its configuration only', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const owner = await makeBooker(t, { kind: 'industry' });
    const viewer = await makeBooker(t, { kind: 'external_academic' });
    const start = hoursFromNow(30);
    const created = await owner.agent.post('/api/bookings').send(body(instrument.id, configs.dfg!.id, owner.account.id, start, 3, 4260));
    expect(created.status).toBe(201);
    const q = { from: plusHours(start, -24).toISOString(), to: plusHours(start, 24).toISOString(), instrumentId: instrument.id };
    const seen = await viewer.agent.get('/api/bookings').query(q);
    expect(seen.status).toBe(200);
    const b = seen.body.bookings.find((x: { id: string }) => x.id === created.body.booking.id);
    expect(b).toMatchObject({ configurationKey: 'dfg', own: false, detail: null });
    expect(JSON.stringify(seen.body)).not.toContain('Confidential');
    expect((await viewer.agent.get(`/api/bookings/${created.body.booking.id}`)).body.booking.detail).toBeNull();
    const mine = await owner.agent.get('/api/bookings').query(q);
    expect(mine.body.bookings.find((x: { id: string }) => x.id === created.body.booking.id).detail.purpose).toMatch(/Confidential/);
    expect((await viewer.agent.post(`/api/bookings/${created.body.booking.id}/cancel`).send({})).status).toBe(403);
  });

  it('when two bookings follow each other, then the calendar carries a changeover band with its minutes', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const start = hoursFromNow(30);
    await me.agent.post('/api/bookings').send(body(instrument.id, configs.opa_signal!.id, me.account.id, start, 2, 1300));
    await me.agent.post('/api/bookings').send(body(instrument.id, configs.dfg!.id, me.account.id, plusHours(start, 3), 2, 4000));
    const r = await me.agent.get('/api/bookings').query({ from: plusHours(start, -1).toISOString(), to: plusHours(start, 8).toISOString(), instrumentId: instrument.id });
    expect(r.body.changeovers).toHaveLength(1);
    // Demo model: OPA signal → DFG 45 min base + 5 min pulse check.
    expect(r.body.changeovers[0]).toMatchObject({ minutes: 50, availableMinutes: 60 });
  });

  it('when the calendar query is malformed or too wide, then 400', async () => {
    const me = await makeBooker(t);
    expect((await me.agent.get('/api/bookings').query({ from: 'yesterday', to: 'now' })).status).toBe(400);
    expect((await me.agent.get('/api/bookings').query({ from: '2026-01-01T00:00:00Z', to: '2026-12-31T00:00:00Z' })).status).toBe(400);
  });
});

describe('cancelling and moving', () => {
  it.each([
    [80, 0],
    [48, 50],
    [10, 100],
  ])('when the owner cancels %i h before the start, then the fee is %i percent and it is stored', async (hoursBefore, fee) => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const created = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental!.id, me.account.id, hoursFromNow(hoursBefore), 2, 800));
    expect(created.status).toBe(201);
    const r = await me.agent.post(`/api/bookings/${created.body.booking.id}/cancel`).send({ reason: 'sample not ready' });
    expect(r.status).toBe(200);
    expect(r.body.booking.status).toBe('cancelled');
    expect(r.body.booking.detail.cancellationFeePercent).toBe(fee);
    const mail = await waitForMail(me.user.email, { subjectIncludes: 'cancelled' });
    expect(mail.text).toContain(`${fee} %`);
  });

  it('when staff move a booking, then it is re-validated, the owner is told, and a clash is refused', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const start = hoursFromNow(30);
    const a = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental!.id, me.account.id, start, 2, 800));
    const b = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental!.id, me.account.id, plusHours(start, 5), 2, 800));
    const { users } = await makePeople(t, ['staff']);
    const staff = await t.signIn(users.staff!.email);
    const clash = await staff.post(`/api/bookings/${a.body.booking.id}/move`).send({ startsAt: plusHours(start, 4).toISOString(), endsAt: plusHours(start, 6).toISOString() });
    expect(clash.status).toBe(409);
    const ok = await staff.post(`/api/bookings/${a.body.booking.id}/move`).send({ startsAt: plusHours(start, 24).toISOString(), endsAt: plusHours(start, 26).toISOString() });
    expect(ok.status).toBe(200);
    expect(ok.body.booking.startsAt).toBe(plusHours(start, 24).toISOString());
    await waitForMail(me.user.email, { subjectIncludes: 'moved' });
    expect(b.status).toBe(201);
    expect((await me.agent.post(`/api/bookings/${b.body.booking.id}/move`).send({ startsAt: start.toISOString(), endsAt: plusHours(start, 2).toISOString() })).status).toBe(403);
  });
});
