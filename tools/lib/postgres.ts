import { chownSync, existsSync, mkdirSync, readdirSync, realpathSync } from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { BootstrapError, isRoot, run, runOk, waitFor } from './step';
import { socketDir } from './paths';

const apt = 'apt-get install -y postgresql';

function newestLibBin(): string | null {
  const base = '/usr/lib/postgresql';
  if (!existsSync(base)) return null;
  const versions = readdirSync(base).filter((v) => existsSync(path.join(base, v, 'bin', 'initdb'))).sort((a, b) => Number(b) - Number(a));
  return versions[0] ? path.join(base, versions[0], 'bin') : null;
}

async function findBinDir(): Promise<string | null> {
  const fromConfig = await run('pg_config', ['--bindir'], { timeoutMs: 5000 }).catch(() => null);
  const candidate = fromConfig?.code === 0 ? fromConfig.stdout.trim() : null;
  if (candidate && existsSync(path.join(candidate, 'initdb'))) return candidate;
  const lib = newestLibBin();
  if (lib) return lib;
  const which = await run('sh', ['-c', 'command -v initdb'], { timeoutMs: 5000 }).catch(() => null);
  if (which?.code === 0 && which.stdout.trim()) return path.dirname(realpathSync(which.stdout.trim()));
  return null;
}

/** Finds Debian's PostgreSQL server binaries, installing the package when we are root and they are missing. */
export async function ensurePostgresBinaries(): Promise<string> {
  const found = await findBinDir();
  if (found) return found;
  if (!isRoot()) {
    throw new BootstrapError('PostgreSQL server binaries (initdb, pg_ctl) were not found.', `sudo apt-get update && sudo ${apt}`);
  }
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  await runOk('apt-get', ['update'], { env, timeoutMs: 5 * 60_000 });
  await runOk('apt-get', ['install', '-y', '--no-install-recommends', 'postgresql', 'postgresql-contrib'], { env, timeoutMs: 10 * 60_000 });
  const after = await findBinDir();
  if (!after) throw new BootstrapError('PostgreSQL was installed but initdb was not found.', apt);
  return after;
}

export interface Cluster {
  binDir: string;
  dataDir: string;
  port: number;
  url(db: string): string;
}

function asPostgresUser(binDir: string, tool: string, args: string[]): [string, string[]] {
  const bin = path.join(binDir, tool);
  return isRoot() ? ['runuser', ['-u', 'postgres', '--', bin, ...args]] : [bin, args];
}

/** Creates (once) and starts a project-local cluster on 127.0.0.1; a running one is reused. */
export async function startCluster(binDir: string, dataDir: string, port: number, tuning: string[] = []): Promise<Cluster> {
  mkdirSync(path.dirname(dataDir), { recursive: true, mode: 0o755 });
  mkdirSync(socketDir, { recursive: true, mode: 0o777 });
  if (isRoot()) {
    const ids = await runOk('id', ['-u', 'postgres']).catch(() => null);
    const gid = await runOk('id', ['-g', 'postgres']).catch(() => null);
    if (!ids || !gid) throw new BootstrapError('The postgres system user does not exist.', apt);
    mkdirSync(dataDir, { recursive: true, mode: 0o700 });
    chownSync(dataDir, Number(ids), Number(gid));
    chownSync(socketDir, Number(ids), Number(gid));
  }
  const opts = { cwd: '/', timeoutMs: 60_000 };
  if (!existsSync(path.join(dataDir, 'PG_VERSION'))) {
    const [cmd, args] = asPostgresUser(binDir, 'initdb', ['-D', dataDir, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8']);
    await runOk(cmd, args, opts);
  }
  const cluster: Cluster = { binDir, dataDir, port, url: (db) => `postgres://postgres@127.0.0.1:${port}/${db}` };
  const [scmd, sargs] = asPostgresUser(binDir, 'pg_ctl', ['-D', dataDir, 'status']);
  const status = await run(scmd, sargs, opts);
  if (status.code === 0) {
    // Already running (a previous run that was not stopped): restart it on the port we want.
    await stopCluster(binDir, dataDir);
  }
  const serverOptions = [`-p ${port}`, `-k ${socketDir}`, '-c listen_addresses=127.0.0.1', ...tuning].join(' ');
  const [cmd, args] = asPostgresUser(binDir, 'pg_ctl', ['-D', dataDir, '-w', '-t', '30', '-l', path.join(dataDir, 'server.log'), '-o', serverOptions, 'start']);
  await runOk(cmd, args, opts);
  await waitFor(`PostgreSQL on port ${port}`, async () => {
    const c = new pg.Client({ connectionString: cluster.url('postgres'), connectionTimeoutMillis: 1000 });
    await c.connect();
    await c.end();
    return true;
  }, 20_000);
  return cluster;
}

export async function stopCluster(binDir: string, dataDir: string): Promise<void> {
  if (!existsSync(path.join(dataDir, 'PG_VERSION'))) return;
  const [cmd, args] = asPostgresUser(binDir, 'pg_ctl', ['-D', dataDir, '-m', 'fast', '-w', '-t', '30', 'stop']);
  await run(cmd, args, { cwd: '/', timeoutMs: 40_000 });
}

export async function ensureDatabase(cluster: Cluster, name: string, { fresh = false } = {}): Promise<string> {
  if (!/^[a-z_][a-z0-9_]*$/.test(name)) throw new BootstrapError(`bad database name ${name}`);
  const c = new pg.Client({ connectionString: cluster.url('postgres'), connectionTimeoutMillis: 5000 });
  await c.connect();
  try {
    if (fresh) await c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
    const exists = await c.query('SELECT 1 FROM pg_database WHERE datname = $1', [name]);
    if (exists.rowCount === 0) await c.query(`CREATE DATABASE ${name}`);
  } finally {
    await c.end();
  }
  return cluster.url(name);
}
