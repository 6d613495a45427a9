/// <reference path="./autocannon.d.ts" />
/**
 * Booking creation through the whole API (autocannon, 32 connections, every request a distinct free one-hour slot
 * on one of 32 sources, round-robin) against the raw SQL insert of the same rows through `pg` (pool of 10, 32 in
 * flight, the same exclusion constraint), in one run.
 */
import autocannon from 'autocannon';
import pg from 'pg';
import type { BenchWorld } from './bench-world';
import { countStatements, measureCpu, percentile, type Figure } from './support';

const HOUR = 3_600_000;
export const CONNECTIONS = 32;
export const REQUESTS = Number(process.env.BENCH_CREATE_REQUESTS ?? 3_000);
const WARMUP = 96;

interface Row { instrumentId: string; configurationId: string; startsAt: string; endsAt: string; targetNm: number }

/** Slot k on source k mod 32: one hour every two hours, so the changeover (same state: pulse check only) always fits. */
function slots(world: BenchWorld, base: number, count: number): Row[] {
  return Array.from({ length: count }, (_, k) => {
    const inst = world.instruments[k % world.instruments.length]!;
    const start = base + Math.floor(k / world.instruments.length) * 2 * HOUR;
    return { instrumentId: inst.id, configurationId: inst.configs.fundamental!, startsAt: new Date(start).toISOString(), endsAt: new Date(start + HOUR).toISOString(), targetNm: 800 };
  });
}

async function cannon(url: string, cookie: string, rows: Row[], accountId: string) {
  let next = 0;
  const latencies: number[] = [];
  const statuses = new Map<number, number>();
  const instance = autocannon({
    url, connections: CONNECTIONS, amount: rows.length, timeout: 30,
    requests: [{
      method: 'POST', path: '/api/bookings',
      headers: { 'content-type': 'application/json', cookie, origin: url },
      setupRequest: (req: Record<string, unknown>) => {
        const r = rows[next++ % rows.length]!;
        return { ...req, body: JSON.stringify({ ...r, accountId, purpose: 'Bench: carrier dynamics in a quantum-well laser' }) };
      },
    }],
  });
  instance.on('response', (_client: unknown, status: number, _bytes: number, ms: number) => {
    latencies.push(ms);
    statuses.set(status, (statuses.get(status) ?? 0) + 1);
  });
  const result = await instance;
  return { result, latencies, statuses };
}

async function rawInserts(databaseUrl: string, world: BenchWorld, rows: Row[]) {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 10 });
  const b = world.booker;
  const latencies: number[] = [];
  let next = 0;
  let failed = 0;
  const started = performance.now();
  await Promise.all(Array.from({ length: CONNECTIONS }, async () => {
    for (let i = next++; i < rows.length; i = next++) {
      const r = rows[i]!;
      const t = performance.now();
      try {
        await pool.query(`INSERT INTO timeline_blocks (instrument_id, kind, status, starts_at, ends_at, configuration_id, target_min_nm, target_max_nm, account_id, user_id, organisation_id, purpose, created_by, decided_by, decided_at)
          VALUES ($1, 'booking', 'approved', $2, $3, $4, $5, $5, $6, $7, $8, $9, $7, $7, now())`,
        [r.instrumentId, r.startsAt, r.endsAt, r.configurationId, r.targetNm, b.accountId, b.userId, b.organisationId, 'Bench: carrier dynamics in a quantum-well laser']);
      } catch { failed++; }
      latencies.push(performance.now() - t);
    }
  }));
  const seconds = (performance.now() - started) / 1000;
  await pool.end();
  return { rate: rows.length / seconds, p95: percentile(latencies, 95), failed, seconds };
}

export async function benchBookingCreation(o: { apiUrl: string; apiPid: number; pgDataDir?: string; cookie: string; databaseUrl: string; world: BenchWorld }): Promise<{ figures: Figure[]; detail: string }> {
  // From two days ahead (clear of the lead time and of the past), within the 60-day horizon.
  const base = Math.ceil((Date.now() + 2 * 24 * HOUR) / HOUR) * HOUR;
  const warm = slots(o.world, base, WARMUP);
  const measured = slots(o.world, base + Math.ceil(WARMUP / o.world.instruments.length) * 2 * HOUR, REQUESTS);
  await cannon(o.apiUrl, o.cookie, warm, o.world.booker.accountId);
  const { out: { out: api, statements }, apiSeconds, pgSeconds, loadSeconds } = await measureCpu(o.apiPid, o.pgDataDir,
    () => countStatements(o.databaseUrl, () => cannon(o.apiUrl, o.cookie, measured, o.world.booker.accountId)));
  const created = api.statuses.get(201) ?? 0;
  const apiRate = created / (api.result.duration);
  // The same rows, 70 days further on (no API booking there): same instruments, same constraint, same pool size.
  const shifted = measured.map((r) => ({ ...r, startsAt: new Date(Date.parse(r.startsAt) + 70 * 24 * HOUR).toISOString(), endsAt: new Date(Date.parse(r.endsAt) + 70 * 24 * HOUR).toISOString() }));
  const raw = await rawInserts(o.databaseUrl, o.world, shifted);
  const statusText = [...api.statuses].map(([s, n]) => `${s}×${n}`).join(' ');
  return {
    figures: [
      { section: '1', name: 'API booking creation throughput (201s per s)', value: apiRate, unit: 'req/s', note: `${REQUESTS} requests, c=${CONNECTIONS}, ${statusText}` },
      { section: '1', name: 'API booking creation p95 latency', value: percentile(api.latencies, 95), unit: 'ms', target: { max: 50 }, note: `p50 ${percentile(api.latencies, 50).toFixed(1)} ms, p99 ${percentile(api.latencies, 99).toFixed(1)} ms` },
      { section: '1', name: 'SQL statements per created booking', value: statements / Math.max(1, created), unit: '', note: 'pg_stat_statements; mail worker and pg-boss upkeep included' },
      { section: '1', name: 'CPU per created booking: API process / PostgreSQL', value: (apiSeconds * 1000) / Math.max(1, created), unit: 'ms', note: `PostgreSQL ${((pgSeconds * 1000) / Math.max(1, created)).toFixed(1)} ms; load generator ${((loadSeconds * 1000) / Math.max(1, created)).toFixed(1)} ms; API idle ${(100 - (apiSeconds / api.result.duration) * 100).toFixed(0)} % (/proc; mail worker included)` },
      { section: '1', name: 'raw SQL insert rate (pg, pool 10)', value: raw.rate, unit: 'rows/s', note: `p95 ${raw.p95.toFixed(1)} ms, ${raw.failed} failed` },
      { section: '1', name: 'API / raw insert rate', value: (apiRate / raw.rate) * 100, unit: '%', target: { min: 40 } },
    ],
    detail: `create: api ${created}/${REQUESTS} created in ${api.result.duration.toFixed(1)} s; raw ${REQUESTS - raw.failed} rows in ${raw.seconds.toFixed(1)} s`,
  };
}
