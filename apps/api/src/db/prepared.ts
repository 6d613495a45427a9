import type { Pool, PoolClient } from 'pg';
import type { EntityManager } from 'typeorm';

/**
 * A named prepared statement: PostgreSQL parses and plans it once per connection instead of on every call. For the
 * two statements nearly every request runs (the session read, the calendar's blocks); everything else goes through
 * TypeORM. Inside a transaction it runs on the transaction's connection.
 */
export async function preparedQuery<R>(m: EntityManager, name: string, text: string, values: unknown[]): Promise<R[]> {
  const runner = m.queryRunner;
  if (runner && !runner.isReleased) {
    const client = (await runner.connect()) as PoolClient;
    return (await client.query({ name, text, values })).rows as R[];
  }
  const pool = (m.connection.driver as unknown as { master: Pool }).master;
  return (await pool.query({ name, text, values })).rows as R[];
}
