/// <reference path="./autocannon.d.ts" />
/**
 * The calendar's week query: GET /api/bookings?from&to&instrumentId through the API (autocannon) against the raw SQL
 * select of the same blocks (pg, pool of 10), both with 10 requests in flight for a fixed time.
 */
import autocannon from 'autocannon';
import pg from 'pg';
import type { BenchWorld } from './bench-world';
import { countStatements, measureCpu, percentile, type Figure } from './support';

const SECONDS = Number(process.env.BENCH_QUERY_SECONDS ?? 8);
const IN_FLIGHT = 10;

const RAW = `SELECT * FROM timeline_blocks WHERE instrument_id = $1 AND starts_at < $3 AND ends_at > $2
  AND status IN ('requested','approved','completed','scheduled') ORDER BY starts_at`;

async function raw(databaseUrl: string, week: BenchWorld['queryWeek']) {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 10 });
  const args = [week.instrumentId, week.from, week.to];
  await Promise.all(Array.from({ length: IN_FLIGHT }, () => pool.query(RAW, args)));
  const latencies: number[] = [];
  let rows = 0;
  const until = performance.now() + SECONDS * 1000;
  const started = performance.now();
  await Promise.all(Array.from({ length: IN_FLIGHT }, async () => {
    while (performance.now() < until) {
      const t = performance.now();
      rows = (await pool.query(RAW, args)).rowCount ?? 0;
      latencies.push(performance.now() - t);
    }
  }));
  const rate = latencies.length / ((performance.now() - started) / 1000);
  await pool.end();
  return { count: latencies.length, rate, p95: percentile(latencies, 95), rows };
}

async function api(url: string, cookie: string, week: BenchWorld['queryWeek'], seconds: number) {
  const latencies: number[] = [];
  let non2xx = 0;
  const instance = autocannon({
    url: `${url}/api/bookings?from=${encodeURIComponent(week.from)}&to=${encodeURIComponent(week.to)}&instrumentId=${week.instrumentId}`,
    connections: IN_FLIGHT, duration: seconds, headers: { cookie },
  });
  instance.on('response', (_c: unknown, status: number, _b: number, ms: number) => { latencies.push(ms); if (status !== 200) non2xx++; });
  const result = await instance;
  return { count: latencies.length, seconds: result.duration, rate: latencies.length / result.duration, p95: percentile(latencies, 95), p50: percentile(latencies, 50), non2xx };
}

export async function benchWeekQuery(o: { apiUrl: string; apiPid: number; pgDataDir?: string; cookie: string; databaseUrl: string; world: BenchWorld }): Promise<{ figures: Figure[]; detail: string }> {
  const week = o.world.queryWeek;
  const probe = await fetch(`${o.apiUrl}/api/bookings?from=${encodeURIComponent(week.from)}&to=${encodeURIComponent(week.to)}&instrumentId=${week.instrumentId}`, { headers: { cookie: o.cookie } });
  const body = (await probe.json()) as { bookings?: unknown[]; changeovers?: unknown[] };
  if (probe.status !== 200) throw new Error(`week query: ${probe.status} ${JSON.stringify(body).slice(0, 300)}`);
  await api(o.apiUrl, o.cookie, week, 2);
  const { out: { out: a, statements }, apiSeconds, pgSeconds, loadSeconds } = await measureCpu(o.apiPid, o.pgDataDir, () => countStatements(o.databaseUrl, () => api(o.apiUrl, o.cookie, week, SECONDS)));
  const r = await raw(o.databaseUrl, week);
  return {
    figures: [
      { section: '2', name: 'week query p95 through the API', value: a.p95, unit: 'ms', target: { max: 20 }, note: `${a.rate.toFixed(0)} req/s, p50 ${a.p50.toFixed(1)} ms, ${body.bookings?.length ?? 0} bookings + ${body.changeovers?.length ?? 0} bands, ${a.non2xx} non-200` },
      { section: '2', name: 'SQL statements per week query', value: statements / Math.max(1, a.count), unit: '', note: 'pg_stat_statements; background workers included' },
      { section: '2', name: 'CPU per week query: API process / PostgreSQL', value: (apiSeconds * 1000) / Math.max(1, a.count), unit: 'ms', note: `PostgreSQL ${((pgSeconds * 1000) / Math.max(1, a.count)).toFixed(2)} ms; load generator ${((loadSeconds * 1000) / Math.max(1, a.count)).toFixed(2)} ms; API process idle ${(100 - (apiSeconds / a.seconds) * 100).toFixed(0)} % of the run (/proc)` },
      { section: '2', name: 'week query p95 raw SQL', value: r.p95, unit: 'ms', note: `${r.rate.toFixed(0)} queries/s, ${r.rows} rows` },
      { section: '2', name: 'week query API rate / raw rate', value: a.rate / r.rate, unit: '×', target: { min: 0.5 } },
    ],
    detail: `week ${week.from} – ${week.to}, ${IN_FLIGHT} in flight, ${SECONDS} s each`,
  };
}
