import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { migrate, revertLast } from '../migrate';
import { migrations } from '../data-source';
import { uniqueTag } from '../../test-support/test-api';

const base = new URL(process.env.TEST_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:5432/x');
const name = `femtoslot_migr_${uniqueTag().replace(/-/g, '')}`;
const adminUrl = Object.assign(new URL(base), { pathname: '/postgres' }).toString();
const url = Object.assign(new URL(base), { pathname: `/${name}` }).toString();

async function sql<T extends pg.QueryResultRow>(connection: string, text: string): Promise<T[]> {
  const c = new pg.Client({ connectionString: connection });
  await c.connect();
  try { return (await c.query<T>(text)).rows; } finally { await c.end(); }
}

beforeAll(async () => { await sql(adminUrl, `CREATE DATABASE ${name}`); });
afterAll(async () => { await sql(adminUrl, `DROP DATABASE IF EXISTS ${name} WITH (FORCE)`); });

describe('migrations', () => {
  it('when every migration is run, reverted and run again, then the schema comes back whole', async () => {
    await migrate(url);
    const tables = async () => (await sql<{ table_name: string }>(url, `SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' AND table_name <> 'migrations'`)).map((r) => r.table_name).sort();
    const up = await tables();
    expect(up).toEqual(expect.arrayContaining(['timeline_blocks', 'users', 'organisations', 'configurations', 'outbox_messages', 'audit_events']));
    for (let i = 0; i < migrations.length; i++) await revertLast(url);
    expect(await tables()).toEqual([]);
    await migrate(url);
    expect(await tables()).toEqual(up);
    const constraint = await sql(url, `SELECT conname FROM pg_constraint WHERE conname = 'timeline_blocks_no_overlap' AND contype = 'x'`);
    expect(constraint).toHaveLength(1);
  });
});
