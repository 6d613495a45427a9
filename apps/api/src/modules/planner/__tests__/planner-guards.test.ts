import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hoursFromNow, makeBooker, makeInstrument, plusHours } from '../../../test-support/booking-fixture';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

// The test facility's zone (seeded facility settings): America/New_York.
const dateIn = (d: Date) => new Intl.DateTimeFormat('en-CA', { timeZone: 'America/New_York' }).format(d);

async function setUp(startsAt: Date, configuration: 'fundamental' | 'dfg' = 'fundamental') {
  const { instrument, configs } = await makeInstrument(t);
  const me = await makeBooker(t);
  const { users } = await makePeople(t, ['staff']);
  const staff = await t.signIn(users.staff!.email);
  const book = async (s: Date, key: 'fundamental' | 'dfg' = configuration) => {
    const r = await me.agent.post('/api/bookings').send({ instrumentId: instrument.id, configurationId: configs[key]!.id, accountId: me.account.id, startsAt: s.toISOString(), endsAt: plusHours(s, 2).toISOString(), targetNm: key === 'dfg' ? 4000 : 800, purpose: 'planner guard test' });
    expect(r.status).toBe(201);
    return r.body.booking as { id: string; startsAt: string; endsAt: string };
  };
  const first = await book(startsAt);
  return { instrument, staff, book, first };
}

describe('day planner guards', () => {
  it('when staff apply a plan that moves a booking into the past, then 422 and the booking stays', async () => {
    const start = hoursFromNow(24 * 3);
    const { instrument, staff, first } = await setUp(start);
    const target = plusHours(hoursFromNow(0), -3);
    const r = await staff.post('/api/planner/day/apply').send({ instrumentId: instrument.id, date: dateIn(start), order: [{ bookingId: first.id, startsAt: target.toISOString(), endsAt: plusHours(target, 2).toISOString() }] });
    expect(r.status).toBe(422);
    expect(r.body.error.details).toMatchObject({ rule: 'past', bookingId: first.id });
    const now = await staff.get(`/api/bookings/${first.id}`);
    expect(now.body.booking.startsAt).toBe(first.startsAt);
  });

  it('when staff apply a plan that moves a booking to another date than the planned one, then 422', async () => {
    const start = new Date(`${dateIn(hoursFromNow(24 * 8))}T16:00:00Z`);
    const { instrument, staff, first } = await setUp(start);
    const nextDay = plusHours(start, 24);
    const r = await staff.post('/api/planner/day/apply').send({ instrumentId: instrument.id, date: dateIn(start), order: [{ bookingId: first.id, startsAt: nextDay.toISOString(), endsAt: plusHours(nextDay, 2).toISOString() }] });
    expect(r.status).toBe(422);
    expect(r.body.error.details).toMatchObject({ rule: 'date', bookingId: first.id });
    // A move that runs past midnight in the facility zone (16:00Z is 11:00 or 12:00 in New York; 12 h later plus 2 h ends after 00:00) leaves the date too.
    const late = plusHours(start, 12);
    const r2 = await staff.post('/api/planner/day/apply').send({ instrumentId: instrument.id, date: dateIn(start), order: [{ bookingId: first.id, startsAt: late.toISOString(), endsAt: plusHours(late, 2).toISOString() }] });
    expect(r2.status).toBe(422);
    expect(r2.body.error.details).toMatchObject({ rule: 'date' });
  });

  it('when staff apply a plan that moves a booking beyond the booking horizon, then 422', async () => {
    // Demo horizon: 60 days. The booking starts 3 h inside it and the move puts it 2 h beyond.
    const start = hoursFromNow(60 * 24 - 3);
    const { instrument, staff, first } = await setUp(start);
    const beyond = plusHours(start, 5);
    const r = await staff.post('/api/planner/day/apply').send({ instrumentId: instrument.id, date: dateIn(start), order: [{ bookingId: first.id, startsAt: beyond.toISOString(), endsAt: plusHours(beyond, 2).toISOString() }] });
    expect(r.status).toBe(422);
    expect(r.body.error.details).toMatchObject({ rule: 'horizon', bookingId: first.id });
  });

  it('when the day\'s bookings already need no changeover between them, then the proposal moves none of them', async () => {
    const start = new Date(`${dateIn(hoursFromNow(24 * 12))}T15:00:00Z`);
    const { instrument, staff, book, first } = await setUp(start);
    const second = await book(plusHours(start, 4));
    const p = await staff.post('/api/planner/day/proposal').send({ instrumentId: instrument.id, date: dateIn(start), flexMinutes: 120 });
    expect(p.status).toBe(200);
    const proposed = Object.fromEntries(p.body.plan.order.map((o: { bookingId: string; startsAt: string }) => [o.bookingId, new Date(o.startsAt).toISOString()]));
    expect(proposed).toEqual({ [first.id]: new Date(first.startsAt).toISOString(), [second.id]: new Date(second.startsAt).toISOString() });
    expect(p.body.plan.savedMinutes).toBe(0);
  });

  it('when a reorder saves changeover, then only the proposal that saves is offered and no booking is proposed before now', async () => {
    const start = new Date(`${dateIn(hoursFromNow(24 * 14))}T13:00:00Z`);
    const { instrument, staff, book, first } = await setUp(start, 'dfg');
    await book(plusHours(start, 3), 'fundamental');
    await book(plusHours(start, 6), 'dfg');
    const p = await staff.post('/api/planner/day/proposal').send({ instrumentId: instrument.id, date: dateIn(start), flexMinutes: 240 });
    expect(p.status).toBe(200);
    expect(p.body.plan.savedMinutes).toBeGreaterThan(0);
    expect(p.body.plan.changeoverMinutes).toBeLessThan(p.body.plan.currentChangeoverMinutes);
    for (const o of p.body.plan.order) expect(new Date(o.startsAt).getTime()).toBeGreaterThan(Date.now());
    expect(p.body.plan.order.map((o: { bookingId: string }) => o.bookingId)).toContain(first.id);
  });
});
