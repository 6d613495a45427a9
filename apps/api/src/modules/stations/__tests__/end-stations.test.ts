import ical from 'node-ical';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Instrument } from '../../instruments/instrument.entity';
import { hoursFromNow, makeBooker, makeInstrument, plusHours } from '../../../test-support/booking-fixture';
import { makePeople, startTestApi, uniqueTag, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

/** A private bench that the given configurations can feed. */
async function makeStation(configurationIds: string[]) {
  const db = t.api.ctx.db;
  const station = await db.getRepository(Instrument).save({
    name: `Test bench ${uniqueTag()}`, kind: 'bench', pumpNm: null, retuneMinutesPerNm: 0, warmupAfterMaintenanceMinutes: 0, pulseCheckMinutes: 0, defaultChangeoverMinutes: 0,
  });
  await db.query(`INSERT INTO station_configurations (station_id, configuration_id) SELECT $1, unnest($2::uuid[])`, [station.id, configurationIds]);
  return station;
}

const body = (instrumentId: string, configurationId: string, accountId: string, start: Date, hours: number, targetNm: number, stationIds?: string[]) => ({
  instrumentId, configurationId, accountId, startsAt: start.toISOString(), endsAt: plusHours(start, hours).toISOString(), targetNm, purpose: 'Carrier dynamics, pump-probe', ...(stationIds ? { stationIds } : {}),
});

async function stationRows(bookingId: string) {
  return t.api.ctx.db.query(`SELECT instrument_id, status, starts_at, ends_at FROM timeline_blocks WHERE parent_id = $1 ORDER BY instrument_id`, [bookingId]) as Promise<{ instrument_id: string; status: string; starts_at: Date; ends_at: Date }[]>;
}

async function staffAgent() {
  const { users } = await makePeople(t, ['staff']);
  return t.signIn(users.staff!.email);
}

describe('end stations booked with the source', () => {
  it('when a booking includes a compatible station, then both timelines hold it and the week query lists it from the source and from the bench', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const station = await makeStation([configs.fundamental.id]);
    const me = await makeBooker(t);
    const start = hoursFromNow(30);
    const res = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental.id, me.account.id, start, 2, 800, [station.id]));
    expect(res.status).toBe(201);
    expect(res.body.booking.stationIds).toEqual([station.id]);
    const rows = await stationRows(res.body.booking.id);
    expect(rows).toEqual([{ instrument_id: station.id, status: 'approved', starts_at: start, ends_at: plusHours(start, 2) }]);

    const range = { from: plusHours(start, -24).toISOString(), to: plusHours(start, 24).toISOString() };
    const onSource = await me.agent.get('/api/bookings').query({ ...range, instrumentId: instrument.id });
    expect(onSource.body.bookings.map((b: { id: string; stationIds: string[] }) => [b.id, b.stationIds])).toEqual([[res.body.booking.id, [station.id]]]);
    const onBench = await me.agent.get('/api/bookings').query({ ...range, instrumentId: station.id });
    expect(onBench.body.bookings.map((b: { id: string; instrumentId: string }) => [b.id, b.instrumentId])).toEqual([[res.body.booking.id, instrument.id]]);
    expect(onBench.body.changeovers).toEqual([]);
    const detail = await me.agent.get(`/api/bookings/${res.body.booking.id}`);
    expect(detail.body.booking.stationIds).toEqual([station.id]);
    // The owner's calendar feed (RFC 5545 LOCATION, read back with node-ical) names the station beside the source.
    const feed = new URL((await me.agent.get('/api/calendar/feed')).body.url).pathname;
    const events = Object.values(ical.sync.parseICS((await t.http().get(feed)).text)).filter((v) => v.type === 'VEVENT') as unknown as { location: string }[];
    expect(events.map((e) => e.location)).toEqual([expect.stringContaining(`${instrument.name}, ${station.name}`)]);
    const listed = await me.agent.get('/api/stations');
    expect(listed.body.stations.find((s: { id: string }) => s.id === station.id)).toMatchObject({ configurationIds: [configs.fundamental.id] });
  });

  it('when the configuration cannot feed the station, then the request is refused with 422 and nothing is written', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const station = await makeStation([configs.fundamental.id]);
    const me = await makeBooker(t);
    const res = await me.agent.post('/api/bookings').send(body(instrument.id, configs.dfg.id, me.account.id, hoursFromNow(30), 2, 4200, [station.id]));
    expect(res.status).toBe(422);
    expect(res.body.error).toMatchObject({ code: 'station_incompatible', details: { stationId: station.id, reason: 'configuration' } });
    const source = await me.agent.post('/api/bookings').send(body(instrument.id, configs.dfg.id, me.account.id, hoursFromNow(30), 2, 4200, [instrument.id]));
    expect(source.status).toBe(422);
    expect(source.body.error.details).toMatchObject({ reason: 'not_a_station' });
    const [{ n }] = await t.api.ctx.db.query(`SELECT count(*)::int AS n FROM timeline_blocks WHERE instrument_id = ANY($1::uuid[])`, [[instrument.id, station.id]]);
    expect(n).toBe(0);
    const dupes = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental.id, me.account.id, hoursFromNow(30), 2, 800, [station.id, station.id]));
    expect(dupes.status).toBe(400);
  });

  it('when another source asks for the same station at an overlapping time, then it is refused with 409 and the station stays with the first', async () => {
    const a = await makeInstrument(t);
    const b = await makeInstrument(t);
    const station = await makeStation([a.configs.fundamental.id, b.configs.opa_signal.id]);
    const me = await makeBooker(t);
    const start = hoursFromNow(40);
    const first = await me.agent.post('/api/bookings').send(body(a.instrument.id, a.configs.fundamental.id, me.account.id, start, 3, 800, [station.id]));
    expect(first.status).toBe(201);
    const second = await me.agent.post('/api/bookings').send(body(b.instrument.id, b.configs.opa_signal.id, me.account.id, plusHours(start, 2), 2, 1310, [station.id]));
    expect(second.status).toBe(409);
    expect(second.body.error).toMatchObject({ code: 'station_busy', details: { stationId: station.id, overlaps: expect.any(Array) } });
    const check = await me.agent.post('/api/bookings/check').send(body(b.instrument.id, b.configs.opa_signal.id, me.account.id, plusHours(start, 2), 2, 1310, [station.id]));
    expect(check.body.problems.map((p: { code: string }) => p.code)).toContain('station_busy');
    // The earliest start offered leaves the station free too: right after the first booking (the second source is idle).
    expect(second.body.error.details.earliestStart).toBe(plusHours(start, 3).toISOString());
    expect(check.body.timeline.earliestStart).toBe(plusHours(start, 3).toISOString());
    const without = await me.agent.post('/api/bookings').send(body(b.instrument.id, b.configs.opa_signal.id, me.account.id, plusHours(start, 2), 2, 1310));
    expect(without.status).toBe(201);
  });

  it('when two sources race for one station at overlapping times, then the database refuses one (409) and one station row is active', async () => {
    const a = await makeInstrument(t);
    const b = await makeInstrument(t);
    const station = await makeStation([a.configs.fundamental.id, b.configs.fundamental.id]);
    const x = await makeBooker(t);
    const y = await makeBooker(t);
    const start = hoursFromNow(50);
    // Different sources are not serialised by the source lock and the bench is not locked: only the constraint decides.
    const results = await Promise.all([
      x.agent.post('/api/bookings').send(body(a.instrument.id, a.configs.fundamental.id, x.account.id, start, 2, 800, [station.id])),
      y.agent.post('/api/bookings').send(body(b.instrument.id, b.configs.fundamental.id, y.account.id, plusHours(start, 1), 2, 800, [station.id])),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([201, 409]);
    const lost = results.find((r) => r.status === 409)!;
    expect(['overlap', 'station_busy']).toContain(lost.body.error.code);
    const [{ n }] = await t.api.ctx.db.query(`SELECT count(*)::int AS n FROM timeline_blocks WHERE instrument_id = $1 AND status IN ('requested','approved')`, [station.id]);
    expect(n).toBe(1);
    // The losing booking's source row was rolled back with it.
    const [{ m }] = await t.api.ctx.db.query(`SELECT count(*)::int AS m FROM timeline_blocks WHERE instrument_id = ANY($1::uuid[]) AND kind = 'booking'`, [[a.instrument.id, b.instrument.id]]);
    expect(m).toBe(1);
  });

  it('when a station row is inserted by plain SQL over a booked station, then PostgreSQL refuses it (23P01) whatever the app would say', async () => {
    const a = await makeInstrument(t);
    const b = await makeInstrument(t);
    const station = await makeStation([a.configs.fundamental.id]);
    const me = await makeBooker(t);
    const start = hoursFromNow(60);
    const first = await me.agent.post('/api/bookings').send(body(a.instrument.id, a.configs.fundamental.id, me.account.id, start, 2, 800, [station.id]));
    const other = await me.agent.post('/api/bookings').send(body(b.instrument.id, b.configs.fundamental.id, me.account.id, plusHours(start, 1), 2, 800));
    expect([first.status, other.status]).toEqual([201, 201]);
    const db = t.api.ctx.db;
    await expect(db.query(`INSERT INTO timeline_blocks (instrument_id, kind, status, starts_at, ends_at, parent_id) VALUES ($1, 'station', 'approved', $2, $3, $4)`,
      [station.id, plusHours(start, 1), plusHours(start, 3), other.body.booking.id])).rejects.toMatchObject({ driverError: { code: '23P01' } });
    // A maintenance window written straight into the table over the station is refused the same way.
    await expect(db.query(`INSERT INTO timeline_blocks (instrument_id, kind, status, starts_at, ends_at, reason) VALUES ($1, 'maintenance', 'scheduled', $2, $3, 'x')`,
      [station.id, start, plusHours(start, 1)])).rejects.toMatchObject({ driverError: { code: '23P01' } });
    // A station row cannot claim times or a status of its own: the trigger copies its booking's.
    await db.query(`UPDATE timeline_blocks SET status = 'cancelled', starts_at = $2 WHERE parent_id = $1`, [first.body.booking.id, plusHours(start, -5)]);
    expect(await stationRows(first.body.booking.id)).toEqual([{ instrument_id: station.id, status: 'approved', starts_at: start, ends_at: plusHours(start, 2) }]);
    // Only a bench can be a station.
    await expect(db.query(`INSERT INTO timeline_blocks (instrument_id, kind, status, starts_at, ends_at, parent_id) VALUES ($1, 'station', 'approved', $2, $3, $4)`,
      [b.instrument.id, start, plusHours(start, 2), first.body.booking.id])).rejects.toMatchObject({ driverError: { code: '23514' } });
  });

  it('when a booking with a station is cancelled, then the station is free again in the same transaction', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const station = await makeStation([configs.fundamental.id, configs.shg.id]);
    const other = await makeInstrument(t);
    await t.api.ctx.db.query(`INSERT INTO station_configurations (station_id, configuration_id) VALUES ($1, $2)`, [station.id, other.configs.fundamental.id]);
    const me = await makeBooker(t);
    const start = hoursFromNow(70);
    const res = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental.id, me.account.id, start, 2, 800, [station.id]));
    const cancel = await me.agent.post(`/api/bookings/${res.body.booking.id}/cancel`).send({});
    expect(cancel.status).toBe(200);
    expect(cancel.body.booking.stationIds).toEqual([station.id]);
    expect((await stationRows(res.body.booking.id))[0]!.status).toBe('cancelled');
    const again = await me.agent.post('/api/bookings').send(body(other.instrument.id, other.configs.fundamental.id, me.account.id, start, 2, 800, [station.id]));
    expect(again.status).toBe(201);
  });

  it('when staff approve, decline or move a booking, or any code updates it, then its station rows follow', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const station = await makeStation([configs.opa_signal.id]);
    const ext = await makeBooker(t, { kind: 'external_academic' });
    const staff = await staffAgent();
    const start = hoursFromNow(80);
    const a = await ext.agent.post('/api/bookings').send(body(instrument.id, configs.opa_signal.id, ext.account.id, start, 2, 1310, [station.id]));
    const b = await ext.agent.post('/api/bookings').send(body(instrument.id, configs.opa_signal.id, ext.account.id, plusHours(start, 5), 2, 1310, [station.id]));
    expect([a.body.booking.status, b.body.booking.status]).toEqual(['requested', 'requested']);
    expect((await stationRows(a.body.booking.id))[0]!.status).toBe('requested');
    await staff.post(`/api/bookings/${a.body.booking.id}/approve`).send({});
    await staff.post(`/api/bookings/${b.body.booking.id}/decline`).send({ reason: 'Bench is reserved for a calibration' });
    expect((await stationRows(a.body.booking.id))[0]!.status).toBe('approved');
    expect((await stationRows(b.body.booking.id))[0]!.status).toBe('declined');
    const moved = await staff.post(`/api/bookings/${a.body.booking.id}/move`).send({ startsAt: plusHours(start, 1).toISOString(), endsAt: plusHours(start, 3).toISOString() });
    expect(moved.status).toBe(200);
    expect(await stationRows(a.body.booking.id)).toMatchObject([{ status: 'approved', starts_at: plusHours(start, 1), ends_at: plusHours(start, 3) }]);
    // A plain UPDATE of the booking (as a day plan or a script makes) carries the station along too.
    await t.api.ctx.db.query(`UPDATE timeline_blocks SET starts_at = $2, ends_at = $3 WHERE id = $1`, [a.body.booking.id, plusHours(start, 2), plusHours(start, 4)]);
    expect(await stationRows(a.body.booking.id)).toMatchObject([{ starts_at: plusHours(start, 2), ends_at: plusHours(start, 4) }]);
  });

  it('when a day plan swaps two bookings that share a station, then the station rows swap with them inside the deferred constraint', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const station = await makeStation([configs.fundamental.id]);
    const me = await makeBooker(t);
    const staff = await staffAgent();
    const start = hoursFromNow(24 * 12);
    const first = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental.id, me.account.id, start, 2, 800, [station.id]));
    const second = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental.id, me.account.id, plusHours(start, 2), 2, 800, [station.id]));
    expect([first.status, second.status]).toEqual([201, 201]);
    const date = new Intl.DateTimeFormat('en-CA', { timeZone: 'America/New_York' }).format(start);
    const applied = await staff.post('/api/planner/day/apply').send({ instrumentId: instrument.id, date, order: [
      { bookingId: second.body.booking.id, startsAt: start.toISOString(), endsAt: plusHours(start, 2).toISOString() },
      { bookingId: first.body.booking.id, startsAt: plusHours(start, 2).toISOString(), endsAt: plusHours(start, 4).toISOString() },
    ] });
    expect(applied.status).toBe(200);
    expect((await stationRows(second.body.booking.id))[0]!.starts_at).toEqual(start);
    expect((await stationRows(first.body.booking.id))[0]!.starts_at).toEqual(plusHours(start, 2));
  });

  it('when a move would put the station over its maintenance, then the move is refused with 409', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const station = await makeStation([configs.fundamental.id]);
    const me = await makeBooker(t);
    const staff = await staffAgent();
    const start = hoursFromNow(90);
    const res = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental.id, me.account.id, start, 2, 800, [station.id]));
    await t.api.ctx.db.query(`INSERT INTO timeline_blocks (instrument_id, kind, status, starts_at, ends_at, reason) VALUES ($1, 'maintenance', 'scheduled', $2, $3, 'Delay stage')`,
      [station.id, plusHours(start, 4), plusHours(start, 6)]);
    const moved = await staff.post(`/api/bookings/${res.body.booking.id}/move`).send({ startsAt: plusHours(start, 3).toISOString(), endsAt: plusHours(start, 5).toISOString() });
    expect(moved.status).toBe(409);
    expect(moved.body.error.code).toBe('station_busy');
  });

  it('when staff block maintenance on a station, then the bookings that include it are displaced, the station is free, and the alternatives keep it free', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const station = await makeStation([configs.fundamental.id]);
    const me = await makeBooker(t);
    const staff = await staffAgent();
    const start = hoursFromNow(100);
    const withStation = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental.id, me.account.id, start, 2, 800, [station.id]));
    const withoutStation = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental.id, me.account.id, plusHours(start, 3), 2, 800));
    expect([withStation.status, withoutStation.status]).toEqual([201, 201]);
    const window = await staff.post('/api/maintenance').send({ instrumentId: station.id, startsAt: plusHours(start, -1).toISOString(), endsAt: plusHours(start, 8).toISOString(), reason: 'Pump-probe delay stage realignment' });
    expect(window.status).toBe(201);
    expect(window.body.displaced.map((d: { id: string }) => d.id)).toEqual([withStation.body.booking.id]);
    expect((await stationRows(withStation.body.booking.id))[0]!.status).toBe('displaced');
    const list = await me.agent.get('/api/bookings/needs-rebooking');
    const mine = list.body.bookings.find((x: { id: string }) => x.id === withStation.body.booking.id);
    expect(mine.stationIds).toEqual([station.id]);
    expect(mine.detail.alternatives.length).toBeGreaterThan(0);
    for (const alt of mine.detail.alternatives) expect(new Date(alt.startsAt).getTime()).toBeGreaterThanOrEqual(plusHours(start, 8).getTime());
    const untouched = await me.agent.get(`/api/bookings/${withoutStation.body.booking.id}`);
    expect(untouched.body.booking.status).toBe('approved');
  });

  it('when staff replace the configurations that feed a station, then the next request follows the new list; others may not edit it', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const station = await makeStation([configs.fundamental.id]);
    const me = await makeBooker(t);
    const staff = await staffAgent();
    expect((await me.agent.put(`/api/stations/${station.id}/configurations`).send({ configurationIds: [] })).status).toBe(403);
    const put = await staff.put(`/api/stations/${station.id}/configurations`).send({ configurationIds: [configs.opa_idler.id] });
    expect(put.status).toBe(200);
    expect(put.body.station.configurationIds).toEqual([configs.opa_idler.id]);
    const refused = await me.agent.post('/api/bookings').send(body(instrument.id, configs.fundamental.id, me.account.id, hoursFromNow(110), 2, 800, [station.id]));
    expect(refused.status).toBe(422);
    const ok = await me.agent.post('/api/bookings').send(body(instrument.id, configs.opa_idler.id, me.account.id, hoursFromNow(110), 2, 2050, [station.id]));
    expect(ok.status).toBe(201);
    expect((await staff.put(`/api/stations/${instrument.id}/configurations`).send({ configurationIds: [] })).status).toBe(404);
  });
});
