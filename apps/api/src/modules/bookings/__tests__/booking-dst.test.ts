import { zonedToUtc } from '@femtoslot/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluateBooking } from '../booking-evaluation';
import { makeBooker, makeInstrument } from '../../../test-support/booking-fixture';
import { startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

const NY = 'America/New_York';

describe('booking length across DST (IANA tz database: New York falls back 2026-11-01, springs forward 2026-03-08)', () => {
  it('when a booking runs 00:30–12:30 wall time on the fall-back day, then it is 13 real hours and over the 12 h limit; the same wall span a week later is 12 h and allowed', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const owner = { id: me.user.id, role: me.user.role, organisationId: me.org.id, email: me.user.email, name: me.user.name };
    const run = (day: number) => evaluateBooking(t.api.ctx.db.manager, t.api.ctx.reference, {
      instrumentId: instrument.id, configurationId: configs.fundamental!.id, accountId: me.account.id, owner, target: { targetNm: 800 },
      startsAt: zonedToUtc({ year: 2026, month: 11, day, hour: 0, minute: 30 }, NY), endsAt: zonedToUtc({ year: 2026, month: 11, day, hour: 12, minute: 30 }, NY),
    }, { lock: false, now: new Date('2026-10-20T12:00:00Z') });
    const fallBack = await run(1);
    expect(fallBack.problems.find((p) => p.code === 'rule_violation')?.message).toMatch(/13 h/);
    const ordinary = await run(8);
    expect(ordinary.problems.filter((p) => p.code === 'rule_violation')).toEqual([]);
  });

  it('when 00:30–03:30 wall time on 2026-03-08 is booked, then it is two real hours long (the 02:00–03:00 hour does not exist)', () => {
    const s = zonedToUtc({ year: 2026, month: 3, day: 8, hour: 0, minute: 30 }, NY);
    const e = zonedToUtc({ year: 2026, month: 3, day: 8, hour: 3, minute: 30 }, NY);
    expect((e.getTime() - s.getTime()) / 3_600_000).toBe(2);
  });
});
