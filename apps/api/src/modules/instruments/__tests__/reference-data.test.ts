import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hoursFromNow, makeBooker, makeInstrument, plusHours } from '../../../test-support/booking-fixture';
import { startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

const body = (instrumentId: string, configurationId: string, accountId: string, start: Date, end: Date, targetNm: number) =>
  ({ instrumentId, configurationId, accountId, startsAt: start.toISOString(), endsAt: end.toISOString(), targetNm, purpose: 'reference cache test' });

describe('reference data cached per process', () => {
  it('when a changeover pair is changed by plain SQL outside the API, then the very next booking check uses the new minutes', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const booker = await makeBooker(t);
    const start = hoursFromNow(30);
    const first = await booker.agent.post('/api/bookings').send(body(instrument.id, configs.dfg.id, booker.account.id, start, plusHours(start, 3), 4000));
    expect(first.status).toBe(201);
    // SHG 60 min after the DFG booking ends. The demo model's SHG ↔ DFG pair (55 min, both ways) plus the 5 min pulse
    // check fits in exactly 60 min…
    const next = body(instrument.id, configs.shg.id, booker.account.id, plusHours(start, 4), plusHours(start, 6), 400);
    const before = await booker.agent.post('/api/bookings/check').send(next);
    expect(before.status).toBe(200);
    expect(before.body.timeline.before.shortfallMinutes).toBe(0);
    expect(before.body.timeline.before.neededMinutes).toBe(55 + 5);

    // …until someone raises it to 90 min straight in the table (a script, another process, a migration).
    const changed = await t.api.ctx.db.query(
      `UPDATE changeover_pairs SET base_minutes = 90 WHERE instrument_id = $1 AND from_configuration_id = $2 AND to_configuration_id = $3`,
      [instrument.id, configs.shg.id, configs.dfg.id]);
    expect(changed[1]).toBe(1);
    const after = await booker.agent.post('/api/bookings/check').send(next);
    expect(after.body.timeline.before.neededMinutes).toBe(90 + 5);
    expect(after.body.timeline.before.shortfallMinutes).toBe(35);
    const refused = await booker.agent.post('/api/bookings').send(next);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('changeover_gap');
  });

  it('when a configuration is made inactive by SQL, then the instruments’ configuration list and the booking rules drop it at once', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const booker = await makeBooker(t);
    const listed = async () => ((await booker.agent.get(`/api/configurations?instrumentId=${instrument.id}`)).body.configurations as { id: string }[]).map((c) => c.id);
    expect(await listed()).toContain(configs.opa_idler.id);
    await t.api.ctx.db.query(`UPDATE configurations SET active = false WHERE id = $1`, [configs.opa_idler.id]);
    expect(await listed()).not.toContain(configs.opa_idler.id);
    const start = hoursFromNow(30);
    const r = await booker.agent.post('/api/bookings').send(body(instrument.id, configs.opa_idler.id, booker.account.id, start, plusHours(start, 2), 2000));
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('out_of_range');
  });
});
