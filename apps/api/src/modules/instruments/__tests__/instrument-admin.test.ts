import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hoursFromNow, makeBooker, makeInstrument, plusHours, plusMinutes } from '../../../test-support/booking-fixture';
import { makePeople, startTestApi, uniqueTag, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
let staff: Awaited<ReturnType<TestApi['signIn']>>;
beforeAll(async () => {
  t = await startTestApi();
  const { users } = await makePeople(t, ['staff']);
  staff = await t.signIn(users.staff!.email);
});
afterAll(async () => { await t?.close(); });

const actions = async (entityId: string) =>
  ((await t.api.ctx.db.query(`SELECT action FROM audit_events WHERE entity_id = $1 ORDER BY created_at, id`, [entityId])) as { action: string }[]).map((r) => r.action);

const book = (me: Awaited<ReturnType<typeof makeBooker>>, instrumentId: string, configurationId: string, start: Date, targetNm: number) =>
  me.agent.post('/api/bookings').send({ instrumentId, configurationId, accountId: me.account.id, startsAt: start.toISOString(), endsAt: plusHours(start, 2).toISOString(), purpose: 'Pump-probe scan', targetNm });

describe('instrument, configuration and changeover administration', () => {
  it('when staff add a source and a configuration and edit them, then the calendar reads the change at once and each change is audited', async () => {
    const tag = uniqueTag();
    const created = await staff.post('/api/instruments').send({
      name: `Borealis ${tag}`, kind: 'source', pumpNm: 1030, retuneMinutesPerNm: 0.1, warmupAfterMaintenanceMinutes: 40, pulseCheckMinutes: 5, defaultChangeoverMinutes: 25,
    });
    expect(created.status).toBe(201);
    const instrumentId = created.body.instrument.id;
    const config = await staff.post('/api/configurations').send({
      instrumentId, key: 'fundamental', name: 'Yb fundamental', outputKind: 'fundamental', minNm: 1020, maxNm: 1040, defaultNm: 1030,
      rateClass: 'standard', requiredOdBands: [{ minNm: 1000, maxNm: 1100, od: 7 }],
    });
    expect(config.status).toBe(201);
    const configurationId = config.body.instrument.configurations[0].id;
    expect((await staff.get(`/api/configurations?instrumentId=${instrumentId}`)).body.configurations.map((c: { name: string }) => c.name)).toEqual(['Yb fundamental']);
    const renamed = await staff.patch(`/api/configurations/${configurationId}`).send({ name: 'Yb fundamental 1030 nm', maxNm: 1050 });
    expect(renamed.status).toBe(200);
    expect((await staff.get(`/api/configurations?instrumentId=${instrumentId}`)).body.configurations[0]).toMatchObject({ name: 'Yb fundamental 1030 nm', maxNm: 1050 });
    expect((await staff.patch(`/api/instruments/${instrumentId}`).send({ warmupAfterMaintenanceMinutes: 60 })).status).toBe(200);
    expect((await staff.get('/api/instruments')).body.instruments.find((i: { id: string }) => i.id === instrumentId).warmupAfterMaintenanceMinutes).toBe(60);
    expect(await actions(instrumentId)).toEqual(['instrument.created', 'instrument.updated']);
    expect(await actions(configurationId)).toEqual(['configuration.created', 'configuration.updated']);
  });

  it('when a tuning range is inverted, the default lies outside it or the OD bands leave a table wavelength uncovered, then it is refused', async () => {
    const { configs } = await makeInstrument(t);
    const inverted = await staff.patch(`/api/configurations/${configs.shg.id}`).send({ minNm: 420, maxNm: 380 });
    expect(inverted.status).toBe(400);
    expect(inverted.body.error.details[0].path).toEqual(['maxNm']);
    const outside = await staff.patch(`/api/configurations/${configs.shg.id}`).send({ defaultNm: 450 });
    expect(outside.status).toBe(400);
    expect(outside.body.error.details[0].path).toEqual(['defaultNm']);
    // SHG at 390–410 nm passes the 780–820 nm fundamental (SHG halves the wavelength; Boyd, Nonlinear Optics).
    const holes = await staff.patch(`/api/configurations/${configs.shg.id}`).send({ requiredOdBands: [{ minNm: 380, maxNm: 420, od: 6 }] });
    expect(holes.status).toBe(422);
    expect(holes.body.error.code).toBe('od_bands_incomplete');
    expect(holes.body.error.details.uncoveredNm).toEqual([{ minNm: 780, maxNm: 820 }]);
  });

  it('when a changeover matrix would leave too short a gap, then the preview names the booking and saving nothing changes until PUT', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const start = hoursFromNow(30);
    expect((await book(me, instrument.id, configs.fundamental.id, start, 800)).status).toBe(201);
    // Fundamental → SHG: 15 min base + 5 min pulse check (demo model); 30 min are free.
    const second = await book(me, instrument.id, configs.shg.id, plusMinutes(plusHours(start, 2), 30), 400);
    expect(second.status).toBe(201);
    const manage = await staff.get('/api/instruments/manage');
    const pairs = manage.body.instruments.find((i: { id: string }) => i.id === instrument.id).changeoverPairs as { fromConfigurationId: string; toConfigurationId: string; baseMinutes: number }[];
    const slower = pairs.map((p) => (p.fromConfigurationId === configs.fundamental.id && p.toConfigurationId === configs.shg.id ? { ...p, baseMinutes: 40 } : p));
    const preview = await staff.post(`/api/instruments/${instrument.id}/changeover-pairs/preview`).send({ pairs: slower });
    expect(preview.status).toBe(200);
    expect(preview.body.affected).toHaveLength(1);
    expect(preview.body.affected[0]).toMatchObject({ bookingId: second.body.booking.id, newlyAffected: true });
    expect(preview.body.affected[0].problems[0]).toMatchObject({ code: 'changeover_gap' });
    expect(preview.body.affected[0].problems[0].message).toContain('45 min');
    const check = await me.agent.post('/api/bookings/check').send({ instrumentId: instrument.id, configurationId: configs.shg.id, accountId: me.account.id, startsAt: plusMinutes(plusHours(start, 2), 30).toISOString(), endsAt: plusMinutes(plusHours(start, 4), 30).toISOString(), purpose: 'x again', targetNm: 400 });
    expect(check.body.timeline.before.neededMinutes).toBe(20);
    expect((await staff.put(`/api/instruments/${instrument.id}/changeover-pairs`).send({ pairs: slower })).status).toBe(200);
    const week = await me.agent.get(`/api/bookings?from=${plusHours(start, -1).toISOString()}&to=${plusHours(start, 6).toISOString()}&instrumentId=${instrument.id}`);
    expect(week.body.changeovers.find((c: { beforeId: string }) => c.beforeId === second.body.booking.id)).toMatchObject({ minutes: 45, availableMinutes: 30 });
    expect(await actions(instrument.id)).toContain('changeover_model.updated');
  });

  it('when a narrower tuning range would leave a booked target outside, then the preview lists it; a pair with itself is refused', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const booked = await book(me, instrument.id, configs.opa_signal.id, hoursFromNow(40), 1500);
    expect(booked.status).toBe(201);
    const preview = await staff.post(`/api/configurations/${configs.opa_signal.id}/preview`).send({ maxNm: 1400 });
    expect(preview.status).toBe(200);
    expect(preview.body.affected.map((a: { bookingId: string }) => a.bookingId)).toEqual([booked.body.booking.id]);
    expect(preview.body.affected[0].problems.map((p: { code: string }) => p.code)).toEqual(['out_of_range']);
    const self = await staff.put(`/api/instruments/${instrument.id}/changeover-pairs`).send({ pairs: [{ fromConfigurationId: configs.shg.id, toConfigurationId: configs.shg.id, baseMinutes: 5 }] });
    expect(self.status).toBe(400);
  });

  it('when a member or finance tries to edit a configuration, then 403', async () => {
    const { configs } = await makeInstrument(t);
    const { users } = await makePeople(t, ['member', 'finance']);
    for (const role of ['member', 'finance'] as const) {
      const agent = await t.signIn(users[role]!.email);
      expect((await agent.patch(`/api/configurations/${configs.shg.id}`).send({ name: 'Hijacked' })).status).toBe(403);
    }
  });
});
