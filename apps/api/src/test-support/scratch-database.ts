import pg from 'pg';
import { migrate } from '../db/migrate';
import { uniqueTag } from './test-api';

async function adminQuery(text: string): Promise<void> {
  const url = Object.assign(new URL(process.env.TEST_DATABASE_URL!), { pathname: '/postgres' }).toString();
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  try { await c.query(text); } finally { await c.end(); }
}

/**
 * A database of its own, for tests whose background workers must not be served by other test files' API instances
 * (pg-boss workers of every process on one database share the queues).
 */
export async function scratchDatabase({ migrated = true } = {}): Promise<{ url: string; drop(): Promise<void> }> {
  const name = `femtoslot_scratch_${uniqueTag().replace(/-/g, '')}`;
  await adminQuery(`CREATE DATABASE ${name}`);
  const url = Object.assign(new URL(process.env.TEST_DATABASE_URL!), { pathname: `/${name}` }).toString();
  if (migrated) await migrate(url);
  return { url, drop: () => adminQuery(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`) };
}
