import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { freeLoopbackPort } from '@femtoslot/api/src/test-support/test-api';

export const repoRoot = path.resolve(import.meta.dirname, '../../..');

export interface ApiProcess {
  url: string;
  port: number;
  child: ChildProcess;
  /** Everything the process wrote (LOG_LEVEL=warn), for failure messages. */
  output(): string;
  alive(): boolean;
  /** kill -9 of the whole process group (tsx runs the API in a child of its own). */
  kill(): Promise<void>;
}

function required(name: string): string {
  const v = process.env[name];
  if (!v) throw new Error(`${name} is not set: run the suites through \`npm test\``);
  return v;
}

/** A real API process, as `npm start` runs it, on a free loopback port; resolves once /api/health answers 200. */
export async function startApiProcess(env: Record<string, string>, { timeoutMs = 45_000 } = {}): Promise<ApiProcess> {
  const port = env.PORT ? Number(env.PORT) : await freeLoopbackPort();
  const child = spawn(path.join(repoRoot, 'node_modules', '.bin', 'tsx'), ['--tsconfig', 'apps/api/tsconfig.json', 'apps/api/src/index.ts'], {
    cwd: repoRoot,
    detached: true,
    stdio: ['ignore', 'pipe', 'pipe'],
    env: {
      PATH: process.env.PATH ?? '', HOME: process.env.HOME ?? '/tmp',
      NODE_ENV: 'test', HOST: '127.0.0.1', LOG_LEVEL: 'warn',
      DATA_DIR: required('TEST_DATA_DIR'), SMTP_HOST: '127.0.0.1', SMTP_PORT: required('TEST_SMTP_PORT'),
      OUTBOX_RETRY_DELAY_SECONDS: '1', LOGIN_RATE_LIMIT: '1000',
      ...env,
      PORT: String(port),
    },
  });
  let out = '';
  child.stdout!.on('data', (c: Buffer) => { out = (out + c.toString()).slice(-20_000); });
  child.stderr!.on('data', (c: Buffer) => { out = (out + c.toString()).slice(-20_000); });
  let exited = false;
  const exit = new Promise<void>((resolve) => child.once('exit', () => { exited = true; resolve(); }));
  const url = `http://127.0.0.1:${port}`;
  const proc: ApiProcess = {
    url, port, child,
    output: () => out,
    alive: () => !exited,
    kill: async () => {
      if (exited) return;
      try { process.kill(-child.pid!, 'SIGKILL'); } catch { /* already gone */ }
      await Promise.race([exit, new Promise((r) => setTimeout(r, 5000))]);
    },
  };
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    if (exited) throw new Error(`API process exited during start-up:\n${out}`);
    const ok = await fetch(`${url}/api/health`).then((r) => r.status === 200, () => false);
    if (ok) return proc;
    if (Date.now() > deadline) { await proc.kill(); throw new Error(`API process not healthy within ${timeoutMs} ms:\n${out}`); }
    await new Promise((r) => setTimeout(r, 200));
  }
}

export interface Session {
  cookie: string;
  /** A JSON request with the session cookie to any of the processes. */
  request(base: string, method: string, path: string, body?: unknown): Promise<{ status: number; body: any }>;
}

/** Signs in over HTTP; the cookie is a signed JWT, valid on every process that shares JWT_SECRET (same DATA_DIR). */
export async function signIn(base: string, email: string, password = 'correct horse battery'): Promise<Session> {
  const r = await fetch(`${base}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) });
  if (r.status !== 200) throw new Error(`sign-in as ${email} failed: ${r.status} ${await r.text()}`);
  const cookie = r.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  return {
    cookie,
    request: async (b, method, p, body) => {
      const res = await fetch(`${b}${p}`, {
        method, headers: { cookie, ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      const text = await res.text();
      let parsed: unknown = text;
      try { parsed = JSON.parse(text); } catch { /* not JSON: kept as text, and the shape checks will say so */ }
      return { status: res.status, body: parsed };
    },
  };
}

export async function until<T>(probe: () => Promise<T | null | undefined | false>, timeoutMs = 20_000, what = 'condition'): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() > deadline) throw new Error(`${what} not met within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 150));
  }
}
