/**
 * Runs every benchmark against a migrated, demo-seeded database (tools/bench.ts brings it up) and prints one table.
 * Scripts that print figures, never timed tests: a missed target is reported, not failed.
 */
import { randomBytes } from 'node:crypto';
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { createStripeFake } from '../../infra/local-fakes/stripe/create-stripe-fake';
import { benchBookingCreation } from './booking-create.bench';
import { BENCH_PASSWORD, seedBenchWorld } from './bench-world';
import { benchPeriodClose } from './period-close.bench';
import { benchPlanner } from './planner.bench';
import { printTable, repoRoot, signIn, startApiChild, verdict, type ApiChild, type Figure } from './support';
import { benchWebBundle, buildWebWithManifest } from './web-bundle.bench';
import { benchWeekQuery } from './week-query.bench';
import { benchWeekRender } from './week-render.bench';
import { benchForgotPassword } from './forgot-password.bench';

export interface BenchInputs {
  databaseUrl: string;
  smtpPort: number;
  dataDir: string;
  apiPort: number;
  stripePort: number;
  chromiumPath: string;
  /** The bench cluster's data folder, to count its CPU time. */
  pgDataDir?: string;
}

const timed = async <T>(label: string, fn: () => Promise<T>): Promise<T> => {
  const t = Date.now();
  const out = await fn();
  console.log(`[bench] ${label} … done (${((Date.now() - t) / 1000).toFixed(1)} s)`);
  return out;
};

async function machine(databaseUrl: string) {
  const c = new pg.Client({ connectionString: databaseUrl });
  await c.connect();
  const [{ server_version: pgVersion }] = (await c.query('SHOW server_version')).rows;
  const [{ n }] = (await c.query(`SELECT count(*)::int AS n FROM timeline_blocks`)).rows;
  await c.end();
  let busy = '';
  try { busy = execFileSync('pgrep', ['-fa', 'vitest'], { encoding: 'utf8' }).trim(); } catch { /* none */ }
  return {
    date: new Date().toISOString(), nproc: os.cpus().length, memoryGb: +(os.totalmem() / 2 ** 30).toFixed(1), cpu: os.cpus()[0]?.model ?? '',
    node: process.version, postgres: pgVersion, load: os.loadavg().map((l) => l.toFixed(2)).join(' '), timelineBlocks: n,
    otherSuitesRunning: busy ? busy.split('\n').length : 0,
  };
}

async function setBenchSourcesActive(databaseUrl: string, active: boolean): Promise<void> {
  const c = new pg.Client({ connectionString: databaseUrl });
  await c.connect();
  try { await c.query(`UPDATE instruments SET active = $1 WHERE name LIKE 'Bench source %'`, [active]); } finally { await c.end(); }
}

/** `BENCH_ONLY=1,3` runs only those sections (1 creation, 2 week query, 3 close, 4 planner, 5 bundle, 6 render, 7 forgot-password). */
const only = (process.env.BENCH_ONLY ?? '').split(',').map((s) => s.trim()).filter(Boolean);
const wanted = (section: string) => only.length === 0 || only.includes(section);

export async function runBenchmarks(o: BenchInputs): Promise<Figure[]> {
  const figures: Figure[] = [];
  const details: string[] = [];
  const add = (r: { figures: Figure[]; detail: string }) => { figures.push(...r.figures); details.push(r.detail); };
  const before = await machine(o.databaseUrl);

  const world = await timed('seed: 32 sources, 200 accounts, 20,000 bookings, 5,000 confirmed logs, 300-event week', () => seedBenchWorld(o.databaseUrl));
  const webDir = mkdtempSync(path.join(os.tmpdir(), 'femtoslot-bench-web-'));
  if (wanted('5') || wanted('6')) await timed('web build with manifest', async () => buildWebWithManifest(webDir));
  if (wanted('5')) add(benchWebBundle(webDir));

  const webhookSecret = 'whsec_femtoslot_bench';
  const fake = createStripeFake({ webhookUrl: `http://127.0.0.1:${o.apiPort}/api/webhooks/stripe`, webhookSecret, knobs: { latencyMs: 0 } });
  const fakeServer = await fake.listen(o.stripePort, '127.0.0.1');
  const apiEnv = {
    NODE_ENV: 'production', DATABASE_URL: o.databaseUrl, DATA_DIR: o.dataDir, JWT_SECRET: randomBytes(48).toString('base64url'),
    APP_URL: `http://127.0.0.1:${o.apiPort}`, SMTP_HOST: '127.0.0.1', SMTP_PORT: String(o.smtpPort), LOG_LEVEL: 'info', LOGIN_RATE_LIMIT: '1000', MAIL_RATE_LIMIT: '100000',
    WEB_DIST: webDir, STRIPE_HOST: '127.0.0.1', STRIPE_PORT: String(fakeServer.port), STRIPE_PROTOCOL: 'http', STRIPE_WEBHOOK_SECRET: webhookSecret, STRIPE_SECRET_KEY: 'sk_test_femtoslot_bench',
  };
  let api: ApiChild | null = null;
  try {
    api = await timed('API child process', () => startApiChild(apiEnv, o.apiPort));
    const apiUrl = api.url;
    const cookie = await signIn(api.url, world.booker.email, BENCH_PASSWORD);
    if (wanted('1')) add(await timed('1 booking creation (API vs raw SQL)', () => benchBookingCreation({ apiUrl, apiPid: api!.pid, pgDataDir: o.pgDataDir, cookie, databaseUrl: o.databaseUrl, world })));
    if (wanted('2')) add(await timed('2 week query (API vs raw SQL)', () => benchWeekQuery({ apiUrl, apiPid: api!.pid, pgDataDir: o.pgDataDir, cookie, databaseUrl: o.databaseUrl, world })));
    if (wanted('7')) add(await timed('7 forgot-password: existing vs unknown e-mail', () => benchForgotPassword({ apiUrl, world })));
    // A fresh API process for the close, so that its peak memory is the close's and not the load runs' heap.
    await api.stop();
    const fresh = api = await timed('fresh API child process for the close', () => startApiChild(apiEnv, o.apiPort));
    if (wanted('3')) add(await timed('3 period close', () => benchPeriodClose({ apiUrl: fresh.url, apiPid: fresh.pid, world })));
    // A facility has a handful of instruments: the 32 bench sources step aside, so the page loads as it would there.
    await setBenchSourcesActive(o.databaseUrl, false);
    if (wanted('6')) add(await timed('6 week render in Chromium', () => benchWeekRender({ apiUrl: fresh.url, world, chromiumPath: o.chromiumPath })));
  } finally {
    await api?.stop();
    await fakeServer.close().catch(() => undefined);
    rmSync(webDir, { recursive: true, force: true });
  }
  if (wanted('4')) add(await timed('4 planner', () => benchPlanner()));

  const order = ['1', '2', '3', '4', '5', '6', '7'];
  figures.sort((a, b) => order.indexOf(a.section) - order.indexOf(b.section));
  const after = await machine(o.databaseUrl);
  const table = printTable(figures);
  console.log(`\nmachine: ${before.nproc} cores (${before.cpu}), ${before.memoryGb} GB, Node ${before.node}, PostgreSQL ${before.postgres}, ${before.date}`);
  console.log(`load average before ${before.load}, after ${after.load}; vitest processes seen: ${before.otherSuitesRunning} before, ${after.otherSuitesRunning} after; timeline blocks ${after.timelineBlocks}\n`);
  console.log(table);
  console.log(`\n${details.join('\n')}`);
  const missed = figures.filter((f) => verdict(f) === 'MISS');
  console.log(`\nbench: ${figures.filter((f) => verdict(f) === 'pass').length} targets met, ${missed.length} missed${missed.length ? ` (${missed.map((f) => `${f.section} ${f.name}`).join('; ')})` : ''}`);
  const out = path.join(repoRoot, 'artifacts');
  mkdirSync(out, { recursive: true });
  writeFileSync(path.join(out, 'bench-results.json'), JSON.stringify({ machine: { before, after }, world: { closeMonth: world.closeMonth, seededBookings: world.seededBookings, queryWeek: world.queryWeek, renderWeek: world.renderWeek }, figures, details }, null, 2));
  return figures;
}
