import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hoursFromNow, makeBooker, makeInstrument, plusHours } from '../../../test-support/booking-fixture';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

const isoInstant = /\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/;

describe('refusal wording', () => {
  it('when a request overlaps a maintenance window, then the check says so and the refusal names the earliest start in the facility zone, not as ISO text', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const { users } = await makePeople(t, ['staff']);
    const staff = await t.signIn(users.staff!.email);
    const start = hoursFromNow(24 * 5);
    expect((await staff.post('/api/maintenance').send({ instrumentId: instrument.id, startsAt: start.toISOString(), endsAt: plusHours(start, 2).toISOString(), reason: 'Pump service' })).status).toBe(201);
    const request = { instrumentId: instrument.id, configurationId: configs.fundamental!.id, accountId: me.account.id, startsAt: plusHours(start, 1).toISOString(), endsAt: plusHours(start, 3).toISOString(), targetNm: 800, purpose: 'Overlap wording' };
    const check = await me.agent.post('/api/bookings/check').send(request);
    expect(check.status).toBe(200);
    expect(check.body.timeline.overlapsMaintenance).toBe(true);
    const refused = await me.agent.post('/api/bookings').send(request);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('overlap');
    expect(refused.body.error.message).not.toMatch(isoInstant);
    expect(refused.body.error.message).toContain('(America/New_York)');
    // The machine-readable instant stays in the details.
    expect(refused.body.error.details.earliestStart).toMatch(isoInstant);
  });
});
