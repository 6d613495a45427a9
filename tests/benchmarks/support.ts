import { spawn, type ChildProcess } from 'node:child_process';
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';

export const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');

export function percentile(values: number[], p: number): number {
  if (values.length === 0) return NaN;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))]!;
}

export const median = (values: number[]) => percentile(values, 50);

export interface Figure {
  section: string;
  name: string;
  value: number;
  unit: string;
  /** A target, when the brief sets one: `max` for "at most", `min` for "at least". */
  target?: { max?: number; min?: number };
  note?: string;
}

export const verdict = (f: Figure): string => {
  if (!f.target || !Number.isFinite(f.value)) return f.target ? 'MISS' : '';
  const ok = (f.target.max === undefined || f.value <= f.target.max) && (f.target.min === undefined || f.value >= f.target.min);
  return ok ? 'pass' : 'MISS';
};

const fmt = (v: number) => (!Number.isFinite(v) ? 'n/a' : Math.abs(v) >= 100 ? v.toFixed(0) : Math.abs(v) >= 10 ? v.toFixed(1) : v.toFixed(2));
const targetText = (f: Figure) => !f.target ? '' : f.target.max !== undefined ? `≤ ${fmt(f.target.max)} ${f.unit}` : `≥ ${fmt(f.target.min!)} ${f.unit}`;

export function printTable(figures: Figure[]): string {
  const rows = figures.map((f) => [f.section, f.name, `${fmt(f.value)} ${f.unit}`.trim(), targetText(f), verdict(f), f.note ?? '']);
  const head = ['#', 'figure', 'value', 'target', 'result', 'note'];
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i]!.length)));
  const line = (r: string[]) => r.map((c, i) => c.padEnd(widths[i]!)).join('  ').trimEnd();
  return [line(head), widths.map((w) => '-'.repeat(w)).join('  '), ...rows.map(line)].join('\n');
}

// Foreign-key checks run inside an INSERT (no round trip of their own) but pg_stat_statements lists them.
const RI_CHECK = `'SELECT 1 FROM ONLY %FOR KEY SHARE OF x'`;

/**
 * SQL statements the database ran while `fn` ran (pg_stat_statements, preloaded by tools/bench.ts): every statement the
 * API sent, background workers (mail, pg-boss upkeep) included, BEGIN/COMMIT counted, foreign-key checks not. NaN when the extension is missing.
 */
export async function countStatements<T>(databaseUrl: string, fn: () => Promise<T>): Promise<{ out: T; statements: number }> {
  const c = new pg.Client({ connectionString: databaseUrl });
  await c.connect();
  let available = true;
  try {
    await c.query('CREATE EXTENSION IF NOT EXISTS pg_stat_statements');
    await c.query('SELECT pg_stat_statements_reset()');
  } catch { available = false; }
  try {
    const out = await fn();
    if (!available) return { out, statements: NaN };
    const { rows } = await c.query(`SELECT coalesce(sum(calls), 0)::int AS n FROM pg_stat_statements
      WHERE dbid = (SELECT oid FROM pg_database WHERE datname = current_database()) AND query NOT LIKE '%pg_stat_statements%' AND query NOT LIKE ${RI_CHECK}`);
    if (process.env.BENCH_STATEMENTS) {
      // BENCH_STATEMENTS=1 lists what ran, most frequent first (for the profiles in docs/benchmarks.md).
      const top = await c.query(`SELECT calls, left(regexp_replace(query, '\\s+', ' ', 'g'), 140) AS q FROM pg_stat_statements
        WHERE dbid = (SELECT oid FROM pg_database WHERE datname = current_database()) AND query NOT LIKE '%pg_stat_statements%' AND query NOT LIKE ${RI_CHECK} ORDER BY calls DESC LIMIT 25`);
      for (const r of top.rows) console.log(`[bench] ${String(r.calls).padStart(7)}  ${r.q}`);
    }
    return { out, statements: rows[0].n as number };
  } finally { await c.end(); }
}

export interface ApiChild {
  url: string;
  pid: number;
  child: ChildProcess;
  stop(): Promise<void>;
}

/**
 * The API as its own process (`node --import tsx src/index.ts`), so that its memory can be read from /proc.
 * BENCH_API_NODE_ARGS adds node flags, e.g. `--cpu-prof --cpu-prof-dir=/tmp/femtoslot-prof` to profile a run.
 */
export async function startApiChild(env: Record<string, string>, port: number): Promise<ApiChild> {
  const child = spawn(process.execPath, [...(process.env.BENCH_API_NODE_ARGS?.split(' ').filter(Boolean) ?? []), '--import', 'tsx', 'src/index.ts'], {
    cwd: path.join(repoRoot, 'apps', 'api'),
    env: { ...process.env, ...env, PORT: String(port), HOST: '127.0.0.1', TSX_TSCONFIG_PATH: path.join(repoRoot, 'apps', 'api', 'tsconfig.json') },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  let stderr = '';
  child.stderr?.on('data', (d) => { stderr = (stderr + d).slice(-4000); });
  let exited = false;
  child.on('exit', () => { exited = true; });
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (exited) throw new Error(`the API exited at start:\n${stderr}`);
    const ok = await fetch(`${url}/api/health`).then((r) => r.ok).catch(() => false);
    if (ok) break;
    if (Date.now() > deadline) { child.kill('SIGKILL'); throw new Error(`the API did not answer /api/health within 60 s:\n${stderr}`); }
    await new Promise((r) => setTimeout(r, 200));
  }
  return {
    url, pid: child.pid!, child,
    stop: async () => {
      if (exited) return;
      child.kill('SIGTERM');
      const until = Date.now() + 10_000;
      while (!exited && Date.now() < until) await new Promise((r) => setTimeout(r, 100));
      if (!exited) child.kill('SIGKILL');
    },
  };
}

/** Signs in through the API and returns the session cookie (`name=value`). */
export async function signIn(url: string, email: string, password: string): Promise<string> {
  const r = await fetch(`${url}/api/auth/login`, {
    method: 'POST', headers: { 'content-type': 'application/json', origin: url }, body: JSON.stringify({ email, password }),
  });
  if (r.status !== 200) throw new Error(`sign-in as ${email}: ${r.status} ${await r.text()}`);
  const cookie = r.headers.getSetCookie().map((c) => c.split(';')[0]!).find((c) => c.startsWith('femtoslot_session='));
  if (!cookie) throw new Error('sign-in gave no session cookie');
  return cookie;
}

const TICKS_PER_SECOND = 100; // USER_HZ on Linux (sysconf(_SC_CLK_TCK)); 100 on every mainstream kernel build

/** CPU seconds (user + system) a process has used, from /proc/<pid>/stat; 0 when it is gone. */
function cpuOfPid(pid: number): number {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return (Number(fields[11]) + Number(fields[12])) / TICKS_PER_SECOND; // utime, stime
  } catch { return 0; }
}

/** The bench cluster's postmaster and every backend it forked (other clusters on the machine are left out). */
function clusterPids(pgDataDir: string): number[] {
  let postmaster: number;
  try { postmaster = Number(readFileSync(path.join(pgDataDir, 'postmaster.pid'), 'utf8').split('\n')[0]); } catch { return []; }
  const pids = [postmaster];
  for (const entry of readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const stat = readFileSync(`/proc/${entry}/stat`, 'utf8');
      if (Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]) === postmaster) pids.push(Number(entry));
    } catch { /* gone */ }
  }
  return pids;
}

/**
 * CPU seconds the API process and the bench PostgreSQL cluster spent while `fn` ran. Backends that exit during the
 * run take their time with them, so the PostgreSQL figure is a lower bound (the pools keep theirs open).
 */
export async function measureCpu<T>(apiPid: number, pgDataDir: string | undefined, fn: () => Promise<T>): Promise<{ out: T; apiSeconds: number; pgSeconds: number; loadSeconds: number }> {
  const selfBefore = process.cpuUsage();
  const pgBefore = new Map((pgDataDir ? clusterPids(pgDataDir) : []).map((p) => [p, cpuOfPid(p)]));
  const apiBefore = cpuOfPid(apiPid);
  const out = await fn();
  const apiSeconds = cpuOfPid(apiPid) - apiBefore;
  let pgSeconds = 0;
  for (const p of pgDataDir ? clusterPids(pgDataDir) : []) pgSeconds += cpuOfPid(p) - (pgBefore.get(p) ?? 0);
  const self = process.cpuUsage(selfBefore);
  // This process is the load generator (autocannon) and shares the same two cores.
  return { out, apiSeconds, pgSeconds: pgDataDir ? pgSeconds : NaN, loadSeconds: (self.user + self.system) / 1e6 };
}

/** Resident memory of a process in MB from /proc/<pid>/status (VmRSS now, VmHWM the peak since start or reset). */
export function memoryOf(pid: number): { rssMb: number; hwmMb: number } {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = (key: string) => Number(new RegExp(`^${key}:\\s+(\\d+) kB`, 'm').exec(status)?.[1] ?? NaN);
  return { rssMb: kb('VmRSS') / 1024, hwmMb: kb('VmHWM') / 1024 };
}

/** Resets VmHWM to the current RSS (`echo 5 > /proc/<pid>/clear_refs`, Linux ≥ 4.0); false when not permitted. */
export function resetPeakMemory(pid: number): boolean {
  try { writeFileSync(`/proc/${pid}/clear_refs`, '5'); return true; } catch { return false; }
}
