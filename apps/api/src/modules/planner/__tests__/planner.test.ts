import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hoursFromNow, makeBooker, makeInstrument, plusHours } from '../../../test-support/booking-fixture';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

const dateIn = (d: Date) => new Intl.DateTimeFormat('en-CA', { timeZone: 'America/New_York' }).format(d);

describe('day planner', () => {
  it('when staff plan hypothetical requests, then the plan is proven optimal for n ≤ 10 and reports the minutes saved', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const { users } = await makePeople(t, ['staff', 'member']);
    const staff = await t.signIn(users.staff!.email);
    const day = hoursFromNow(24 * 10);
    const date = dateIn(day);
    const requests = [
      { id: 'dfg-1', configurationId: configs.dfg!.id, nm: 4000, durationMinutes: 120, submittedAt: '2026-01-01T00:00:00Z' },
      { id: 'fun-1', configurationId: configs.fundamental!.id, nm: 800, durationMinutes: 120, submittedAt: '2026-01-01T00:01:00Z' },
      { id: 'dfg-2', configurationId: configs.dfg!.id, nm: 4100, durationMinutes: 120, submittedAt: '2026-01-01T00:02:00Z' },
      { id: 'fun-2', configurationId: configs.fundamental!.id, nm: 805, durationMinutes: 120, submittedAt: '2026-01-01T00:03:00Z' },
    ];
    const r = await staff.post('/api/planner/day').send({ instrumentId: instrument.id, date, requests });
    expect(r.status).toBe(200);
    expect(r.body.plan.provenOptimal).toBe(true);
    expect(r.body.plan.method).toBe('exact');
    expect(r.body.plan.order).toHaveLength(4);
    // Grouping both DFG sessions and both fundamental sessions needs one crystal swap instead of three (first-come order).
    expect(r.body.plan.savedMinutes).toBeGreaterThan(0);
    expect(r.body.plan.changeoverMinutes).toBeLessThan(r.body.plan.firstComeChangeoverMinutes);
    const member = await t.signIn(users.member!.email);
    expect((await member.post('/api/planner/day').send({ instrumentId: instrument.id, date, requests })).status).toBe(403);
    expect((await staff.post('/api/planner/day').send({ instrumentId: instrument.id, date: '2026-13-45', requests })).status).toBe(400);
  });

  it('when staff propose and apply a plan for a day of real bookings, then the bookings move and the changeover drops', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const { users } = await makePeople(t, ['staff']);
    const staff = await t.signIn(users.staff!.email);
    // Four sessions on one day alternating DFG and fundamental, 2 h apart: the proposal may shift each by up to 3 h.
    const base = hoursFromNow(24 * 12);
    const day = new Date(base);
    const startOfSlots = new Date(`${dateIn(day)}T13:00:00Z`);
    const keys = ['dfg', 'fundamental', 'dfg', 'fundamental'] as const;
    const ids: string[] = [];
    for (let i = 0; i < 4; i++) {
      const s = plusHours(startOfSlots, i * 3);
      const r = await me.agent.post('/api/bookings').send({ instrumentId: instrument.id, configurationId: configs[keys[i]!]!.id, accountId: me.account.id, startsAt: s.toISOString(), endsAt: plusHours(s, 2).toISOString(), targetNm: keys[i] === 'dfg' ? 4000 : 800, purpose: 'plan test' });
      expect(r.status).toBe(201);
      ids.push(r.body.booking.id);
    }
    const p = await staff.post('/api/planner/day/proposal').send({ instrumentId: instrument.id, date: dateIn(day), flexMinutes: 180 });
    expect(p.status).toBe(200);
    expect(p.body.plan.order).toHaveLength(4);
    expect(p.body.plan.savedMinutes).toBeGreaterThan(0);
    const applied = await staff.post('/api/planner/day/apply').send({ instrumentId: instrument.id, date: dateIn(day), order: p.body.plan.order.map((o: { bookingId: string; startsAt: string; endsAt: string }) => ({ bookingId: o.bookingId, startsAt: o.startsAt, endsAt: o.endsAt })) });
    expect(applied.status).toBe(200);
    const cal = await staff.get('/api/bookings').query({ from: plusHours(startOfSlots, -6).toISOString(), to: plusHours(startOfSlots, 18).toISOString(), instrumentId: instrument.id });
    const total = cal.body.changeovers.reduce((s: number, c: { minutes: number }) => s + c.minutes, 0);
    expect(total).toBeLessThan(3 * 55);
  });
});
