import pg from 'pg';
import { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { migrations } from '../data-source';
import { TrainingAuthorisation1765800000000 } from '../migrations/1765800000000-training-authorisation';
import { uniqueTag } from '../../test-support/test-api';

const base = new URL(process.env.TEST_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:5432/x');
const name = `femtoslot_train_${uniqueTag().replace(/-/g, '')}`;
const adminUrl = Object.assign(new URL(base), { pathname: '/postgres' }).toString();
const url = Object.assign(new URL(base), { pathname: `/${name}` }).toString();

async function sql<T extends pg.QueryResultRow>(connection: string, text: string, values: unknown[] = []): Promise<T[]> {
  const c = new pg.Client({ connectionString: connection });
  await c.connect();
  try { return (await c.query<T>(text, values)).rows; } finally { await c.end(); }
}

beforeAll(async () => { await sql(adminUrl, `CREATE DATABASE ${name}`); });
afterAll(async () => { await sql(adminUrl, `DROP DATABASE IF EXISTS ${name} WITH (FORCE)`); });

describe('training migration', () => {
  it('when free-text training records exist, then they become courses with their records kept, and down() gives the text back', async () => {
    // Every migration older than this one, in order, then the free-text records the seed used to write.
    const older = migrations.filter((m) => Number(/\d{13}/.exec(m.name)![0]) < 1765800000000);
    const ds = new DataSource({ type: 'postgres', url, migrations: older, synchronize: false, logging: false });
    await ds.initialize();
    try {
      await ds.runMigrations({ transaction: 'each' });
      const [org] = await ds.query(`INSERT INTO organisations (name, kind) VALUES ('Migration org', 'internal') RETURNING id`);
      const [a] = await ds.query(`INSERT INTO users (organisation_id, email, name, role) VALUES ($1, 'a@example.test', 'A', 'member') RETURNING id`, [org.id]);
      const [b] = await ds.query(`INSERT INTO users (organisation_id, email, name, role) VALUES ($1, 'b@example.test', 'B', 'member') RETURNING id`, [org.id]);
      await ds.query(`INSERT INTO training_records (user_id, course, completed_on, expires_on) VALUES
        ($1, 'Class 4 laser safety', '2025-01-01', '2027-01-01'), ($2, 'class 4 laser safety', '2024-03-01', '2026-03-01'),
        ($2, 'Mid-IR handling', '2025-06-01', '2026-06-01')`, [a.id, b.id]);
      const migration = new TrainingAuthorisation1765800000000();
      const runner = ds.createQueryRunner();
      await migration.up(runner);
      const courses = await ds.query(`SELECT name, validity_months, required_for_all FROM training_courses ORDER BY name`);
      // 730/731 days over 30.4375 days a month (the Gregorian mean) round to 24 months; 365 days to 12.
      expect(courses).toEqual([
        { name: 'Class 4 laser safety', validity_months: 24, required_for_all: true },
        { name: 'Mid-IR handling', validity_months: 12, required_for_all: true },
      ]);
      const records = await ds.query(`SELECT u.email, c.name, t.completed_on::text, t.expires_on::text FROM training_records t
        JOIN users u ON u.id = t.user_id JOIN training_courses c ON c.id = t.course_id ORDER BY u.email, c.name`);
      expect(records).toEqual([
        { email: 'a@example.test', name: 'Class 4 laser safety', completed_on: '2025-01-01', expires_on: '2027-01-01' },
        { email: 'b@example.test', name: 'Class 4 laser safety', completed_on: '2024-03-01', expires_on: '2026-03-01' },
        { email: 'b@example.test', name: 'Mid-IR handling', completed_on: '2025-06-01', expires_on: '2026-06-01' },
      ]);
      await migration.down(runner);
      const back = await ds.query(`SELECT course, completed_on::text FROM training_records ORDER BY completed_on`);
      expect(back).toEqual([
        { course: 'Class 4 laser safety', completed_on: '2024-03-01' },
        { course: 'Class 4 laser safety', completed_on: '2025-01-01' },
        { course: 'Mid-IR handling', completed_on: '2025-06-01' },
      ]);
      const gone = await ds.query(`SELECT count(*)::int AS n FROM information_schema.tables WHERE table_name IN ('training_courses', 'configuration_requirements', 'configuration_signoffs')`);
      expect(gone[0].n).toBe(0);
      await runner.release();
    } finally {
      await ds.destroy();
    }
  });
});
