import type { MigrationInterface, QueryRunner } from 'typeorm';

export class BookingWorkflow1764720000000 implements MigrationInterface {
  name = 'BookingWorkflow1764720000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE users ADD COLUMN calendar_token text`);
    await q.query(`CREATE UNIQUE INDEX users_calendar_token_key ON users (calendar_token) WHERE calendar_token IS NOT NULL`);
    await q.query(`ALTER TABLE timeline_blocks
      ADD COLUMN alternatives jsonb NOT NULL DEFAULT '[]'::jsonb,
      ADD COLUMN rebooked_as uuid REFERENCES timeline_blocks(id),
      ADD COLUMN displaced_by uuid REFERENCES timeline_blocks(id),
      ADD COLUMN decided_by uuid REFERENCES users(id),
      ADD COLUMN decided_at timestamptz,
      ADD COLUMN cancelled_by uuid REFERENCES users(id),
      ADD COLUMN cancelled_at timestamptz,
      ADD COLUMN sequence integer NOT NULL DEFAULT 0`);
    // Deferrable so that applying a day plan can move several bookings past each other inside one transaction.
    await q.query(`ALTER TABLE timeline_blocks DROP CONSTRAINT timeline_blocks_no_overlap`);
    await q.query(`ALTER TABLE timeline_blocks ADD CONSTRAINT timeline_blocks_no_overlap EXCLUDE USING gist (
      instrument_id WITH =, tstzrange(starts_at, ends_at, '[)') WITH &&
    ) WHERE (status IN ('requested','approved','completed','scheduled')) DEFERRABLE INITIALLY IMMEDIATE`);
    await q.query(`CREATE INDEX timeline_blocks_displaced ON timeline_blocks (organisation_id) WHERE status = 'displaced' AND rebooked_as IS NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX IF EXISTS timeline_blocks_displaced`);
    await q.query(`ALTER TABLE timeline_blocks DROP CONSTRAINT timeline_blocks_no_overlap`);
    await q.query(`ALTER TABLE timeline_blocks ADD CONSTRAINT timeline_blocks_no_overlap EXCLUDE USING gist (
      instrument_id WITH =, tstzrange(starts_at, ends_at, '[)') WITH &&
    ) WHERE (status IN ('requested','approved','completed','scheduled'))`);
    await q.query(`ALTER TABLE timeline_blocks DROP COLUMN alternatives, DROP COLUMN rebooked_as, DROP COLUMN displaced_by,
      DROP COLUMN decided_by, DROP COLUMN decided_at, DROP COLUMN cancelled_by, DROP COLUMN cancelled_at, DROP COLUMN sequence`);
    await q.query(`DROP INDEX IF EXISTS users_calendar_token_key`);
    await q.query(`ALTER TABLE users DROP COLUMN calendar_token`);
  }
}
