import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { migrate, revertLast } from '../migrate';
import { uniqueTag } from '../../test-support/test-api';

const base = new URL(process.env.TEST_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:5432/x');
const name = `femtoslot_odband_${uniqueTag().replace(/-/g, '')}`;
const adminUrl = Object.assign(new URL(base), { pathname: '/postgres' }).toString();
const url = Object.assign(new URL(base), { pathname: `/${name}` }).toString();

async function sql<T extends pg.QueryResultRow>(connection: string, text: string, params: unknown[] = []): Promise<T[]> {
  const c = new pg.Client({ connectionString: connection });
  await c.connect();
  try { return (await c.query<T>(text, params)).rows; } finally { await c.end(); }
}
const ran = async () => (await sql<{ name: string }>(url, `SELECT name FROM migrations`)).map((r) => r.name);

beforeAll(async () => { await sql(adminUrl, `CREATE DATABASE ${name}`); });
afterAll(async () => { await sql(adminUrl, `DROP DATABASE IF EXISTS ${name} WITH (FORCE)`); });

describe('required OD bands migration', () => {
  it('when a configuration with one required OD is migrated, then it gets one band over its table wavelengths at that OD, and down() gives the OD back', async () => {
    await migrate(url);
    while ((await ran()).includes('RequiredOdBands1765700000000')) await revertLast(url);
    const [instrument] = await sql<{ id: string }>(url, `INSERT INTO instruments (name, kind, pump_nm, retune_minutes_per_nm, warmup_after_maintenance_minutes, pulse_check_minutes, default_changeover_minutes)
      VALUES ('Old source', 'source', 800, 0.1, 30, 10, 20) RETURNING id`);
    const [dfg] = await sql<{ id: string }>(url, `INSERT INTO configurations (instrument_id, key, name, output_kind, min_nm, max_nm, default_nm, rate_class, required_od)
      VALUES ($1, 'dfg', 'DFG', 'dfg', 2600, 11000, 4000, 'dfg', 5) RETURNING id`, [instrument!.id]);
    await migrate(url);
    const [row] = await sql<{ required_od_bands: unknown }>(url, `SELECT required_od_bands FROM configurations WHERE id = $1`, [dfg!.id]);
    // DFG 2600–11000 nm from an 800 nm pump puts the pump at 800 nm and the DFG up to 11000 nm on the table; the idler
    // (≤ 2311.1 nm) and signal (≥ 1223.5 nm) lie between (1/λDFG = 1/λs − 1/λi, 1/λp = 1/λs + 1/λi; Boyd, Nonlinear Optics).
    expect(row!.required_od_bands).toEqual([{ minNm: 800, maxNm: 11000, od: 5 }]);
    while ((await ran()).includes('RequiredOdBands1765700000000')) await revertLast(url);
    const [back] = await sql<{ required_od: string }>(url, `SELECT required_od FROM configurations WHERE id = $1`, [dfg!.id]);
    expect(Number(back!.required_od)).toBe(5);
    await migrate(url);
  });
});
