import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Configuration } from '../../instruments/configuration.entity';
import { hoursFromNow, makeBooker, makeInstrument, plusHours, plusMinutes } from '../../../test-support/booking-fixture';
import { waitForMail } from '../../../test-support/maildev';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

function body(instrumentId: string, configurationId: string, accountId: string, start: Date, hours: number, target: object = { targetNm: 800 }) {
  return { instrumentId, configurationId, accountId, startsAt: start.toISOString(), endsAt: plusHours(start, hours).toISOString(), purpose: 'Carrier lifetime scan', ...target };
}

describe('booking beam time', () => {
  it('when a trained member books a free slot, then 201 approved at once, with derived wavelengths and a confirmation mail with an .ics', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const r = await me.agent.post('/api/bookings').send(body(instrument.id, configs.opa_signal!.id, me.account.id, hoursFromNow(30), 3, { targetNm: 1300 }));
    expect(r.status).toBe(201);
    expect(r.body.booking).toMatchObject({ status: 'approved', own: true, configurationKey: 'opa_signal' });
    // Energy conservation 1/λp = 1/λs + 1/λi (Boyd, Nonlinear Optics): 800 nm pump, 1300 nm signal → 2080 nm idler.
    expect(r.body.derived.idler.minNm).toBeCloseTo(2080, 1);
    expect(r.body.onTable.map((b: { role: string }) => b.role)).toEqual(expect.arrayContaining(['signal', 'idler']));
    expect(r.body.changeover).toEqual({ beforeMinutes: 0, afterMinutes: 0 });
    const mail = await waitForMail(me.user.email, { subjectIncludes: 'confirmed' });
    expect(mail.attachments?.[0]?.contentType).toMatch(/text\/calendar/);
  });

  it('when an external collaborator requests, then it starts as requested, holds the slot, and only staff may approve it', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const ext = await makeBooker(t, { kind: 'external_academic' });
    const start = hoursFromNow(40);
    const r = await ext.agent.post('/api/bookings').send(body(instrument.id, configs.dfg!.id, ext.account.id, start, 3, { targetNm: 4260 }));
    expect(r.status).toBe(201);
    expect(r.body.booking.status).toBe('requested');
    const member = await makeBooker(t);
    const clash = await member.agent.post('/api/bookings').send(body(instrument.id, configs.dfg!.id, member.account.id, plusHours(start, 1), 2, { targetNm: 4260 }));
    expect(clash.status).toBe(409);
    expect((await member.agent.post(`/api/bookings/${r.body.booking.id}/approve`)).status).toBe(403);
    const { users } = await makePeople(t, ['staff']);
    const staff = await t.signIn(users.staff!.email);
    const ok = await staff.post(`/api/bookings/${r.body.booking.id}/approve`);
    expect(ok.status).toBe(200);
    expect(ok.body.booking.status).toBe('approved');
    const again = await staff.post(`/api/bookings/${r.body.booking.id}/approve`);
    expect(again.status).toBe(409);
    const audit = (await staff.get(`/api/bookings/${r.body.booking.id}`)).body.audit;
    expect(audit.map((a: { action: string }) => a.action)).toEqual(['booking.requested', 'booking.approved']);
    expect(audit[1].before.status).toBe('requested');
    expect(audit[1].after.status).toBe('approved');
  });

  it('when staff decline a request with a reason, then the owner is told the reason', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const ext = await makeBooker(t, { kind: 'industry' });
    const r = await ext.agent.post('/api/bookings').send(body(instrument.id, configs.dfg!.id, ext.account.id, hoursFromNow(50), 2, { targetNm: 3400 }));
    const { users } = await makePeople(t, ['staff']);
    const staff = await t.signIn(users.staff!.email);
    expect((await staff.post(`/api/bookings/${r.body.booking.id}/decline`).send({})).status).toBe(400);
    const d = await staff.post(`/api/bookings/${r.body.booking.id}/decline`).send({ reason: 'DFG crystal out for repolishing that week' });
    expect(d.body.booking.status).toBe('declined');
    const mail = await waitForMail(ext.user.email, { subjectIncludes: 'declined' });
    expect(mail.text).toContain('DFG crystal out for repolishing');
  });

  it.each([
    ['shorter than 1 h', 0.5, 30],
    ['longer than 12 h', 13, 30],
    ['beyond the 60-day horizon', 2, 61 * 24],
    ['in the past', 2, -5],
  ])('when the booking is %s, then 422 rule_violation with a plain message', async (_label, hours, startIn) => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const r = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental!.id, me.account.id, hoursFromNow(startIn), hours));
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('rule_violation');
    expect(r.body.error.message.length).toBeGreaterThan(10);
  });

  it('when an external request starts within the 12 h lead time, then 422 rule_violation naming the notice needed', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const ext = await makeBooker(t, { kind: 'external_academic' });
    const r = await ext.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental!.id, ext.account.id, hoursFromNow(6), 2));
    expect(r.status).toBe(422);
    expect(r.body.error.message).toMatch(/12 hours/);
  });

  it('when the target is outside the configuration tuning range, then 422 out_of_range with the range', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const r = await me.agent.post('/api/bookings').send(body(instrument.id, configs.opa_signal!.id, me.account.id, hoursFromNow(30), 2, { targetNm: 1700 }));
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('out_of_range');
    expect(r.body.error.message).toMatch(/1150.*1600/);
    expect(r.body.error.details).toMatchObject({ minNm: 1150, maxNm: 1600 });
  });

  it('when the booker’s training has expired, then 422 training_required naming the course and its expiry', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t, { trained: false });
    const r = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental!.id, me.account.id, hoursFromNow(30), 2));
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('training_required');
    expect(r.body.error.details.gaps).toEqual([expect.objectContaining({ kind: 'course', name: 'Class 4 laser safety', reason: 'expired', expiredOn: '2025-01-01' })]);
  });

  it('when no eyewear covers the table at the required OD, then 422 no_eyewear and the check says so too', async () => {
    const { instrument, configs } = await makeInstrument(t);
    await t.api.ctx.db.getRepository(Configuration).update({ id: configs.dfg!.id }, { requiredOdBands: [{ minNm: 700, maxNm: 12000, od: 11.5 }] });
    const me = await makeBooker(t);
    const b = body(instrument.id, configs.dfg!.id, me.account.id, hoursFromNow(30), 2, { targetNm: 5000 });
    const check = await me.agent.post('/api/bookings/check').send(b);
    expect(check.status).toBe(200);
    expect(check.body.ok).toBe(false);
    expect(check.body.eyewear).toEqual([]);
    expect(check.body.problems.map((p: { code: string }) => p.code)).toContain('no_eyewear');
    const r = await me.agent.post('/api/bookings').send(b);
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('no_eyewear');
    expect(r.body.error.message).toMatch(/needs OD ≥ 11.5/);
  });

  it('when the account belongs to another organisation, then 422 account_unusable', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const other = await makeBooker(t);
    const r = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental!.id, other.account.id, hoursFromNow(30), 2));
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('account_unusable');
  });

  it('when finance tries to book, then 403; a bad body gives 400 with field details', async () => {
    const { users } = await makePeople(t, ['finance', 'member']);
    const finance = await t.signIn(users.finance!.email);
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    expect((await finance.post('/api/bookings').send(body(instrument.id, configs.fundamental!.id, me.account.id, hoursFromNow(30), 2))).status).toBe(403);
    const bad = await me.agent.post('/api/bookings').send({ instrumentId: 'x', startsAt: 'tomorrow', purpose: '' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details.map((d: { path: string[] }) => d.path[0])).toEqual(expect.arrayContaining(['instrumentId', 'configurationId', 'startsAt', 'endsAt', 'accountId', 'purpose']));
  });

  it('when the gap before the next booking is shorter than the changeover, then 409 changeover_gap with needed, available and the earliest start', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const first = hoursFromNow(30);
    expect((await me.agent.post('/api/bookings').send(body(instrument.id, configs.dfg!.id, me.account.id, first, 3, { targetNm: 4000 }))).status).toBe(201);
    // Demo changeover model: DFG → fundamental is 50 min base plus the 5 min pulse check (common practice figures, invented for the demo).
    const tooSoon = plusMinutes(plusHours(first, 3), 10);
    const r = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental!.id, me.account.id, tooSoon, 2));
    expect(r.status).toBe(409);
    expect(r.body.error.code).toBe('changeover_gap');
    expect(r.body.error.details).toMatchObject({ neededMinutes: 55, availableMinutes: 10 });
    expect(new Date(r.body.error.details.earliestStart).getTime()).toBe(plusMinutes(plusHours(first, 3), 55).getTime());
    const fixed = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental!.id, me.account.id, new Date(r.body.error.details.earliestStart), 2));
    expect(fixed.status).toBe(201);
  });
});
