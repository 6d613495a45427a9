import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TimelineBlock } from '../timeline-block.entity';
import { hoursFromNow, makeBooker, makeInstrument, plusHours, plusMinutes } from '../../../test-support/booking-fixture';
import { startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

const body = (instrumentId: string, configurationId: string, accountId: string, start: Date, end: Date, targetNm: number) =>
  ({ instrumentId, configurationId, accountId, startsAt: start.toISOString(), endsAt: end.toISOString(), targetNm, purpose: 'race test' });

describe('concurrent requests on one instrument', () => {
  it('when many requests for overlapping slots race, then exactly one wins and the rest get 409', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const bookers = await Promise.all(Array.from({ length: 6 }, () => makeBooker(t)));
    const start = hoursFromNow(30);
    const results = await Promise.all(bookers.map((b, i) =>
      b.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental!.id, b.account.id, plusMinutes(start, i * 15), plusMinutes(start, i * 15 + 120), 800))));
    const statuses = results.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 201)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(5);
    for (const r of results.filter((x) => x.status === 409)) expect(['overlap', 'changeover_gap']).toContain(r.body.error.code);
    const rows = await t.api.ctx.db.getRepository(TimelineBlock).countBy({ instrumentId: instrument.id });
    expect(rows).toBe(1);
  });

  it('when two adjacent requests whose changeover does not fit race, then at most one is accepted', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const [a, b] = await Promise.all([makeBooker(t), makeBooker(t)]);
    const start = hoursFromNow(30);
    // Back to back, DFG then SHG: the changeover between them (55 min in the demo model plus pulse check) cannot fit in 0 min.
    for (let round = 0; round < 5; round++) {
      const s = plusHours(start, round * 24);
      const [ra, rb] = await Promise.all([
        a.agent.post('/api/bookings').send(body(instrument.id, configs.dfg!.id, a.account.id, s, plusHours(s, 3), 4000)),
        b.agent.post('/api/bookings').send(body(instrument.id, configs.shg!.id, b.account.id, plusHours(s, 3), plusHours(s, 5), 400)),
      ]);
      const won = [ra, rb].filter((r) => r.status === 201);
      expect(won.length).toBeLessThanOrEqual(1);
      expect([ra, rb].filter((r) => r.status === 409).map((r) => r.body.error.code)).toEqual(won.length === 1 ? ['changeover_gap'] : expect.any(Array));
    }
  });
});
