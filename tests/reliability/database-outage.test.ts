import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makePeople } from '@femtoslot/api/src/test-support/test-api';
import { tcpRelay } from '@femtoslot/api/src/test-support/tcp-relay';
import { signIn, startApiProcess, until, type ApiProcess, type Session } from './support/api-process';
import { scratchWorld, type ScratchWorld } from './support/world';

// The API reaches PostgreSQL through a relay the test can cut: restarting the shared test cluster would break the
// other suites of this vitest run.
let w: ScratchWorld;
let api: ApiProcess;
const relay = tcpRelay(Number(new URL(process.env.TEST_DATABASE_URL!).port));
let member: Session;
beforeAll(async () => {
  w = await scratchWorld({ seed: false });
  await relay.open();
  const viaRelay = Object.assign(new URL(w.url), { port: String(relay.port) }).toString();
  api = await startApiProcess({ DATABASE_URL: viaRelay });
  const { users } = await makePeople(w.fixtureApi(api.url), ['member']);
  member = await signIn(api.url, users.member!.email);
}, 90_000);
afterAll(async () => { await api?.kill(); await relay.cut(); await w?.close(); });

async function anonymous(path: string) {
  const r = await fetch(`${api.url}${path}`);
  const text = await r.text();
  let body: unknown = text;
  try { body = JSON.parse(text); } catch { /* kept as text */ }
  return { status: r.status, body };
}

interface Sample { at: number; path: string; status: number; body: any; ms: number }

describe('PostgreSQL unreachable under load', () => {
  it('when the database connection is cut for 5 s under a steady load, then health answers 503 and other routes 5xx in the error shape meanwhile, the process stays up, and it answers 200 again after the database returns without a restart', async () => {
    const samples: Sample[] = [];
    let stop = false;
    const CONCURRENCY = 6;
    const MAX_REQUESTS = 6000; // bound on the loop whatever happens
    const loop = async (i: number) => {
      for (let n = 0; !stop && samples.length < MAX_REQUESTS; n++) {
        const path = (i + n) % 2 ? '/api/health' : '/api/auth/me';
        const t0 = Date.now();
        // Health is probed as a load balancer does, without a session; /auth/me with one.
        const r = await (path === '/api/health' ? anonymous(path) : member.request(api.url, 'GET', path)).catch((err: Error) => ({ status: 0, body: String(err.message) }));
        samples.push({ at: t0, path, status: r.status, body: r.body, ms: Date.now() - t0 });
        await new Promise((res) => setTimeout(res, 20));
      }
    };
    const load = Promise.all(Array.from({ length: CONCURRENCY }, (_, i) => loop(i)));

    await new Promise((r) => setTimeout(r, 2000));
    const cutAt = Date.now();
    await relay.cut();
    await new Promise((r) => setTimeout(r, 5000));
    await relay.open(relay.port);
    const restoredAt = Date.now();
    // Recovered: both routes answer 200 again, from the same process.
    await until(async () => {
      const recent = samples.filter((s) => s.at > Date.now() - 1000);
      return recent.length > 4 && recent.every((s) => s.status === 200);
    }, 30_000, 'every request answering 200 again');
    const firstOk = samples.filter((s) => s.at >= restoredAt && s.status === 200).map((s) => s.at + s.ms).sort((x, y) => x - y)[0]!;
    await new Promise((r) => setTimeout(r, 1000));
    stop = true;
    await load;

    const before = samples.filter((s) => s.at + s.ms < cutAt);
    // Requests that began while the relay was closed (a small margin after the cut for sockets being torn down).
    const during = samples.filter((s) => s.at >= cutAt + 300 && s.at + s.ms <= restoredAt);
    const after = samples.filter((s) => s.at >= firstOk);
    const tally = (xs: Sample[]) => xs.reduce<Record<string, number>>((acc, s) => ({ ...acc, [`${s.path} ${s.status}`]: (acc[`${s.path} ${s.status}`] ?? 0) + 1 }), {});
    console.log(`[reliability] database cut 5 s under ${CONCURRENCY} concurrent loops: before ${JSON.stringify(tally(before))}; during ${JSON.stringify(tally(during))} (slowest ${Math.max(...during.map((s) => s.ms))} ms); first 200 ${firstOk - restoredAt} ms after the relay returned; after ${JSON.stringify(tally(after))}; ${samples.length} requests in all`);

    expect(before.length).toBeGreaterThan(10);
    expect(before.every((s) => s.status === 200)).toBe(true);
    expect(during.length).toBeGreaterThan(10);
    for (const s of during) {
      if (s.path === '/api/health') {
        expect(s.status).toBe(503);
        expect(s.body).toEqual({ status: 'degraded', db: 'down' });
      } else {
        // 503 database_unavailable tells clients and load balancers to retry rather than report a bug.
        expect(s.status, JSON.stringify(s.body)).toBe(503);
        expect(s.body).toEqual({ error: { code: 'database_unavailable', message: expect.any(String) } });
      }
    }
    // Nothing hangs: every answer during the outage came within the health check's own 2 s bound plus the pool's 5 s connect timeout.
    expect(Math.max(...during.map((s) => s.ms))).toBeLessThan(7_500);
    expect(after.length).toBeGreaterThan(10);
    expect(after.every((s) => s.status === 200)).toBe(true);
    expect(samples.some((s) => s.status === 0)).toBe(false);
    expect(api.alive()).toBe(true);
    const me = await member.request(api.url, 'GET', '/api/auth/me');
    expect(me.status).toBe(200);
  });
});
