import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Instrument } from '../../instruments/instrument.entity';
import { TimelineBlock } from '../../bookings/timeline-block.entity';
import { makeBooker, makeInstrument, plusHours } from '../../../test-support/booking-fixture';
import { pastSession } from '../../../test-support/past-session';
import { makePeople, startTestApi, type TestApi } from '../../../test-support/test-api';

let t: TestApi;
beforeAll(async () => { t = await startTestApi(); });
afterAll(async () => { await t?.close(); });

async function scenario() {
  const { instrument, configs } = await makeInstrument(t);
  // A name with a comma and a quote, so that the CSV must quote the field and double the quote (RFC 4180 §2.6–2.7).
  await t.api.ctx.db.getRepository(Instrument).update({ id: instrument.id }, { name: `Test "Nova", ${instrument.name}` });
  const me = await makeBooker(t);
  const base = new Date('2026-11-09T14:00:00Z'); // a Monday, New York time
  const sessions = [
    { day: 0, key: 'fundamental' as const, hours: 3, nm: 800, logged: [800, 805] },
    { day: 1, key: 'opa_signal' as const, hours: 2, nm: 1300, logged: [1250, 1400] },
    { day: 8, key: 'dfg' as const, hours: 4, nm: 4000, logged: [3800, 4200] },
  ];
  for (const s of sessions) {
    const start = plusHours(base, s.day * 24);
    const b = await pastSession(t, { instrumentId: instrument.id, configuration: configs[s.key], accountId: me.account.id, userId: me.user.id, organisationId: me.org.id, startsAt: start, hours: s.hours, nm: s.nm });
    const r = await me.agent.post(`/api/bookings/${b.id}/usage`).send({
      actualStartsAt: start.toISOString(), actualEndsAt: plusHours(start, s.hours).toISOString(),
      segments: [{ configurationId: configs[s.key].id, startsAt: start.toISOString(), endsAt: plusHours(start, s.hours).toISOString(), minNm: s.logged[0], maxNm: s.logged[1], pulseFwhmFs: s.key === 'fundamental' ? 42 : null }],
    });
    expect(r.status).toBe(200);
  }
  await t.api.ctx.db.getRepository(TimelineBlock).insert({ instrumentId: instrument.id, kind: 'maintenance', status: 'scheduled', startsAt: plusHours(base, 48), endsAt: plusHours(base, 52), reason: 'Chiller service' });
  return { instrument, me };
}

describe('reports', () => {
  it('when utilisation is asked per week, then booked and logged hours per instrument and per configuration equal a direct SQL aggregate of the same rows', async () => {
    const { instrument } = await scenario();
    const { users } = await makePeople(t, ['staff']);
    const staff = await t.signIn(users.staff!.email);
    const q = { from: '2026-11-01T00:00:00Z', to: '2026-11-30T00:00:00Z', groupBy: 'week', instrumentId: instrument.id };
    const r = await staff.get('/api/reports/utilisation').query(q);
    expect(r.status).toBe(200);
    const [sql] = await t.api.ctx.db.query(`
      SELECT (SELECT SUM(EXTRACT(EPOCH FROM ends_at - starts_at)) / 3600 FROM timeline_blocks WHERE instrument_id = $1 AND kind = 'booking' AND status IN ('approved','completed') AND starts_at >= $2 AND starts_at < $3) AS booked,
             (SELECT SUM(EXTRACT(EPOCH FROM u.actual_ends_at - u.actual_starts_at)) / 3600 FROM usage_logs u JOIN timeline_blocks b ON b.id = u.booking_id WHERE b.instrument_id = $1 AND b.starts_at >= $2 AND b.starts_at < $3) AS logged,
             (SELECT SUM(EXTRACT(EPOCH FROM ends_at - starts_at)) / 3600 FROM timeline_blocks WHERE instrument_id = $1 AND kind = 'maintenance' AND starts_at >= $2 AND starts_at < $3) AS maintenance`,
      [instrument.id, q.from, q.to]);
    const sum = (k: 'bookedHours' | 'loggedHours' | 'maintenanceHours') => r.body.rows.reduce((s: number, x: Record<string, number>) => s + x[k]!, 0);
    expect(sum('bookedHours')).toBeCloseTo(Number(sql.booked), 6);
    expect(sum('loggedHours')).toBeCloseTo(Number(sql.logged), 6);
    expect(sum('maintenanceHours')).toBeCloseTo(Number(sql.maintenance), 6);
    expect(r.body.rows.map((x: { period: string }) => x.period)).toEqual(['2026-11-09', '2026-11-16']); // ISO weeks from Monday
    const perConfig: { key: string; h: string }[] = await t.api.ctx.db.query(`
      SELECT c.key, SUM(EXTRACT(EPOCH FROM s.ends_at - s.starts_at)) / 3600 AS h FROM usage_segments s JOIN configurations c ON c.id = s.configuration_id
      WHERE c.instrument_id = $1 GROUP BY c.key`, [instrument.id]);
    for (const row of perConfig) expect(r.body.byConfiguration.find((x: { key: string }) => x.key === row.key).loggedHours).toBeCloseTo(Number(row.h), 6);
    expect(r.body.rows[0].changeoverHours).toBeGreaterThan(0);
  });

  it('when the CSV is downloaded, then it is RFC 4180 (CRLF, quoted comma and doubled quote) and a reference parser (csv-parse) reads it back', async () => {
    const { instrument } = await scenario();
    const { users } = await makePeople(t, ['finance']);
    const finance = await t.signIn(users.finance!.email);
    const res = await finance.get('/api/reports/utilisation.csv').query({ from: '2026-11-01T00:00:00Z', to: '2026-11-30T00:00:00Z', groupBy: 'month', instrumentId: instrument.id });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    const text: string = res.text;
    expect(text.split('\r\n').length).toBeGreaterThan(1);
    expect(text.replace(/\r\n/g, '')).not.toMatch(/\n/);
    expect(text).toContain(`"Test ""Nova"", ${instrument.name.replace(/^Test "Nova", /, '')}"`);
    const rows = parse(text, { columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(1);
    expect(rows[0]!.instrument).toMatch(/^Test "Nova", /);
    expect(Number(rows[0]!.booked_hours)).toBeCloseTo(9, 6);
  });

  it('when the tuning coverage is asked, then every logged range and the pump pulse trend come back; a member may not read reports', async () => {
    const { instrument, me } = await scenario();
    const { users } = await makePeople(t, ['staff']);
    const staff = await t.signIn(users.staff!.email);
    const r = await staff.get('/api/reports/tuning-coverage').query({ from: '2026-11-01T00:00:00Z', to: '2026-11-30T00:00:00Z', instrumentId: instrument.id });
    expect(r.status).toBe(200);
    expect(r.body.segments.map((s: { configurationKey: string; minNm: number; maxNm: number }) => [s.configurationKey, s.minNm, s.maxNm])).toEqual([['fundamental', 800, 805], ['opa_signal', 1250, 1400], ['dfg', 3800, 4200]]);
    expect(r.body.pulseTrend).toEqual([expect.objectContaining({ pulseFwhmFs: 42 })]);
    expect((await me.agent.get('/api/reports/tuning-coverage').query({ from: '2026-11-01T00:00:00Z', to: '2026-11-30T00:00:00Z' })).status).toBe(403);
  });

  it('when Gaussian and sech² pulses are logged on the pump, then the trend names each assumed shape and its autocorrelation width, so like is compared with like', async () => {
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const base = new Date('2026-10-05T14:00:00Z');
    const logged = [{ day: 0, shape: 'gaussian', pulse: 50 }, { day: 1, shape: 'sech2', pulse: 50 }, { day: 2, shape: null, pulse: 60 }] as const;
    for (const l of logged) {
      const start = plusHours(base, l.day * 24);
      const b = await pastSession(t, { instrumentId: instrument.id, configuration: configs.fundamental, accountId: me.account.id, userId: me.user.id, organisationId: me.org.id, startsAt: start, hours: 2, nm: 800 });
      const r = await me.agent.post(`/api/bookings/${b.id}/usage`).send({
        actualStartsAt: start.toISOString(), actualEndsAt: plusHours(start, 2).toISOString(),
        segments: [{ configurationId: configs.fundamental.id, startsAt: start.toISOString(), endsAt: plusHours(start, 2).toISOString(), minNm: 800, maxNm: 800, pulseFwhmFs: l.pulse, pulseShape: l.shape }],
      });
      expect(r.status).toBe(200);
    }
    const { users } = await makePeople(t, ['staff']);
    const staff = await t.signIn(users.staff!.email);
    const r = await staff.get('/api/reports/tuning-coverage').query({ from: '2026-10-01T00:00:00Z', to: '2026-10-31T00:00:00Z', instrumentId: instrument.id });
    expect(r.body.pulseTrend.map((p: { pulseShape: string | null }) => p.pulseShape)).toEqual(['gaussian', 'sech2', null]);
    // Source: intensity AC FWHM = pulse FWHM × 1.414 (Gaussian) or × 1.543 (sech²), Diels & Rudolph, Ultrashort Laser Pulse Phenomena
    expect(r.body.pulseTrend[0].autocorrelationFwhmFs).toBeCloseTo(50 * 1.41421, 3);
    expect(r.body.pulseTrend[1].autocorrelationFwhmFs).toBeCloseTo(50 * 1.5427, 3);
    expect(r.body.pulseTrend[2].autocorrelationFwhmFs).toBeNull();
  });
});
