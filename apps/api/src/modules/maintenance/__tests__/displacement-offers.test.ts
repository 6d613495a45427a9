import { zonedToUtc } from '@femtoslot/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hoursFromNow, makeBooker, makeInstrument, plusHours, plusMinutes } from '../../../test-support/booking-fixture';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

const zone = 'America/New_York'; // the test facility's zone
const body = (instrumentId: string, configurationId: string, accountId: string, start: Date, hours: number, targetNm: number) =>
  ({ instrumentId, configurationId, accountId, startsAt: start.toISOString(), endsAt: plusHours(start, hours).toISOString(), targetNm, purpose: 'Gain dynamics run' });

/** hh:mm on the first weekday at least `daysAhead` days from now, in the facility zone. */
function weekdayAt(daysAhead: number, hour: number, minute = 0): Date {
  for (let d = daysAhead; ; d += 1) {
    const [y, m, day] = new Intl.DateTimeFormat('en-CA', { timeZone: zone }).format(hoursFromNow(d * 24)).split('-').map(Number) as [number, number, number];
    const weekday = new Date(Date.UTC(y, m - 1, day)).getUTCDay();
    if (weekday >= 1 && weekday <= 5) return zonedToUtc({ year: y, month: m, day, hour, minute }, zone);
  }
}

const wall = (iso: string) => {
  const parts = Object.fromEntries(new Intl.DateTimeFormat('en-US', { timeZone: zone, weekday: 'short', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).formatToParts(new Date(iso)).map((p) => [p.type, p.value]));
  return { weekday: parts.weekday!, minutes: Number(parts.hour) * 60 + Number(parts.minute) };
};

async function staffAgent() {
  const { users } = await makePeople(t, ['staff']);
  return t.signIn(users.staff!.email);
}

async function alternativesOf(agent: Awaited<ReturnType<typeof makeBooker>>['agent'], bookingId: string) {
  const list = await agent.get('/api/bookings/needs-rebooking');
  return (list.body.bookings.find((b: { id: string }) => b.id === bookingId)?.detail?.alternatives ?? []) as { startsAt: string; endsAt: string }[];
}

describe('maintenance displacement offers', () => {
  it('when maintenance displaces three bookings of the same length, then no slot is offered twice and every offered slot still passes the booking check after the others rebook', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const people = [await makeBooker(t), await makeBooker(t), await makeBooker(t)];
    const start = weekdayAt(4, 9);
    const ids: string[] = [];
    for (const [i, p] of people.entries()) {
      const r = await p.agent.post('/api/bookings').send(body(instrument.id, configs.opa_signal!.id, p.account.id, plusHours(start, i * 3), 2, 1300 + i * 100));
      expect(r.status).toBe(201);
      ids.push(r.body.booking.id);
    }
    const staff = await staffAgent();
    const m = await staff.post('/api/maintenance').send({ instrumentId: instrument.id, startsAt: plusHours(start, -1).toISOString(), endsAt: plusHours(start, 9).toISOString(), reason: 'Pump diode replacement' });
    expect(m.status).toBe(201);
    const offers = await Promise.all(people.map((p, i) => alternativesOf(p.agent, ids[i]!)));
    const all = offers.flat();
    expect(all.length).toBeGreaterThanOrEqual(people.length);
    // No two offers of one displacement event overlap (so no two people are offered the same time).
    const sorted = [...all].sort((a, b) => a.startsAt.localeCompare(b.startsAt));
    for (let i = 1; i < sorted.length; i += 1) expect(new Date(sorted[i]!.startsAt).getTime()).toBeGreaterThanOrEqual(new Date(sorted[i - 1]!.endsAt).getTime());
    // Everyone takes the first offer, in turn: each rebooking succeeds.
    for (const [i, p] of people.entries()) {
      const alt = offers[i]![0]!;
      const r = await p.agent.post('/api/bookings').send({ ...body(instrument.id, configs.opa_signal!.id, p.account.id, new Date(alt.startsAt), 2, 1300 + i * 100), rebookOf: ids[i] });
      expect(r.status).toBe(201);
    }
  });

  it('when maintenance displaces a late-afternoon booking, then the alternatives lie within working hours (08:00–18:00 on weekdays, facility zone)', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const start = weekdayAt(3, 15);
    const r = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental!.id, me.account.id, start, 2, 800));
    expect(r.status).toBe(201);
    const staff = await staffAgent();
    expect((await staff.post('/api/maintenance').send({ instrumentId: instrument.id, startsAt: plusHours(start, -1).toISOString(), endsAt: plusHours(start, 3).toISOString(), reason: 'Chiller service' })).status).toBe(201);
    const alternatives = await alternativesOf(me.agent, r.body.booking.id);
    expect(alternatives).toHaveLength(3);
    for (const alt of alternatives) {
      const s = wall(alt.startsAt);
      const e = wall(alt.endsAt);
      expect(['Mon', 'Tue', 'Wed', 'Thu', 'Fri']).toContain(s.weekday);
      expect(s.minutes).toBeGreaterThanOrEqual(8 * 60);
      expect(e.minutes).toBeLessThanOrEqual(18 * 60);
      expect(e.weekday).toBe(s.weekday);
    }
  });

  it('when a booking starts inside the warm-up after a new window but does not overlap it, then it is flagged to staff and stays booked', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const start = weekdayAt(3, 11);
    const r = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental!.id, me.account.id, start, 2, 800));
    expect(r.status).toBe(201);
    const staff = await staffAgent();
    // The window ends 15 min before the booking: the demo warm-up (30 min + 5 min pulse check) is not met.
    const m = await staff.post('/api/maintenance').send({ instrumentId: instrument.id, startsAt: plusHours(start, -2).toISOString(), endsAt: plusMinutes(start, -15).toISOString(), reason: 'Crystal cleaning' });
    expect(m.status).toBe(201);
    expect(m.body.displaced).toEqual([]);
    expect(m.body.warmupConflicts).toEqual([expect.objectContaining({ bookingId: r.body.booking.id, neededMinutes: 35, availableMinutes: 15 })]);
    const now = await me.agent.get(`/api/bookings/${r.body.booking.id}`);
    expect(now.body.booking.status).toBe('approved');
  });

  it('when an approved external booking is displaced and rebooked into an offered slot, then the new booking is approved without a second review', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const ext = await makeBooker(t, { kind: 'external_academic' });
    const start = weekdayAt(4, 10);
    const r = await ext.agent.post('/api/bookings').send(body(instrument.id, configs.shg!.id, ext.account.id, start, 2, 400));
    expect(r.status).toBe(201);
    expect(r.body.booking.status).toBe('requested');
    const staff = await staffAgent();
    expect((await staff.post(`/api/bookings/${r.body.booking.id}/approve`).send({})).status).toBe(200);
    expect((await staff.post('/api/maintenance').send({ instrumentId: instrument.id, startsAt: start.toISOString(), endsAt: plusHours(start, 1).toISOString(), reason: 'Realignment' })).status).toBe(201);
    const [alt] = await alternativesOf(ext.agent, r.body.booking.id);
    const rebooked = await ext.agent.post('/api/bookings').send({ ...body(instrument.id, configs.shg!.id, ext.account.id, new Date(alt!.startsAt), 2, 400), rebookOf: r.body.booking.id });
    expect(rebooked.status).toBe(201);
    expect(rebooked.body.booking.status).toBe('approved');
  });

  it('when a request that was never approved is displaced and rebooked, then the new booking still waits for staff', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const ext = await makeBooker(t, { kind: 'external_academic' });
    const start = weekdayAt(4, 13);
    const r = await ext.agent.post('/api/bookings').send(body(instrument.id, configs.shg!.id, ext.account.id, start, 2, 400));
    const staff = await staffAgent();
    expect((await staff.post('/api/maintenance').send({ instrumentId: instrument.id, startsAt: start.toISOString(), endsAt: plusHours(start, 1).toISOString(), reason: 'Realignment' })).status).toBe(201);
    const [alt] = await alternativesOf(ext.agent, r.body.booking.id);
    const rebooked = await ext.agent.post('/api/bookings').send({ ...body(instrument.id, configs.shg!.id, ext.account.id, new Date(alt!.startsAt), 2, 400), rebookOf: r.body.booking.id });
    expect(rebooked.status).toBe(201);
    expect(rebooked.body.booking.status).toBe('requested');
  });
});
