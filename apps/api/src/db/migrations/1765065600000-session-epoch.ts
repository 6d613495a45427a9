import type { MigrationInterface, QueryRunner } from 'typeorm';

/** A number carried in every session token; raising it (on a password reset) ends every session issued before. */
export class SessionEpoch1765065600000 implements MigrationInterface {
  name = 'SessionEpoch1765065600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE users ADD COLUMN session_epoch integer NOT NULL DEFAULT 0 CHECK (session_epoch >= 0)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE users DROP COLUMN IF EXISTS session_epoch`);
  }
}
