import { spawn, type SpawnOptions } from 'node:child_process';

export class BootstrapError extends Error {
  constructor(message: string, readonly fix?: string) {
    super(message);
  }
}

export async function step<T>(label: string, fn: () => Promise<T>): Promise<T> {
  const started = Date.now();
  try {
    const result = await fn();
    console.log(`[femtoslot] ${label} … ok (${((Date.now() - started) / 1000).toFixed(1)} s)`);
    return result;
  } catch (err) {
    console.error(`[femtoslot] ${label} … FAILED (${((Date.now() - started) / 1000).toFixed(1)} s)`);
    throw err;
  }
}

export interface RunResult {
  code: number | null;
  stdout: string;
  stderr: string;
}

/** Runs a command with a hard timeout, so no step can hang silently. */
export function run(cmd: string, args: string[], opts: SpawnOptions & { timeoutMs?: number; quiet?: boolean } = {}): Promise<RunResult> {
  const timeoutMs = opts.timeoutMs ?? 60_000;
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { ...opts, stdio: ['ignore', 'pipe', 'pipe'] });
    let stdout = '';
    let stderr = '';
    child.stdout?.on('data', (d) => { stdout += d; if (!opts.quiet && process.env.FEMTOSLOT_VERBOSE) process.stdout.write(d); });
    child.stderr?.on('data', (d) => { stderr += d; });
    const timer = setTimeout(() => {
      child.kill('SIGKILL');
      reject(new BootstrapError(`${cmd} ${args.join(' ')} took longer than ${timeoutMs / 1000} s and was stopped`));
    }, timeoutMs);
    child.on('error', (err) => { clearTimeout(timer); reject(new BootstrapError(`could not run ${cmd}: ${err.message}`)); });
    child.on('close', (code) => { clearTimeout(timer); resolve({ code, stdout, stderr }); });
  });
}

export async function runOk(cmd: string, args: string[], opts: SpawnOptions & { timeoutMs?: number } = {}): Promise<string> {
  const r = await run(cmd, args, opts);
  if (r.code !== 0) {
    throw new BootstrapError(`${cmd} ${args.join(' ')} exited with ${r.code}:\n${(r.stderr || r.stdout).trim().slice(-2000)}`);
  }
  return r.stdout;
}

export async function waitFor(what: string, probe: () => Promise<boolean>, timeoutMs = 20_000, everyMs = 150): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (await probe().catch(() => false)) return;
    await new Promise((r) => setTimeout(r, everyMs));
  }
  throw new BootstrapError(`${what} did not become ready within ${timeoutMs / 1000} s`);
}

export const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;
