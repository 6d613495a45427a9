import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Sessions ended by signing out, named by their token id (jti) until the token would have expired anyway. Signing out
 * ends that one session; the user's other devices keep theirs (the session epoch still ends all of them on a reset).
 */
export class RevokedSessions1765300000000 implements MigrationInterface {
  name = 'RevokedSessions1765300000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE revoked_sessions (
      jti uuid PRIMARY KEY,
      user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      expires_at timestamptz NOT NULL,
      revoked_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE INDEX revoked_sessions_expires_at ON revoked_sessions (expires_at)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE IF EXISTS revoked_sessions`);
  }
}
