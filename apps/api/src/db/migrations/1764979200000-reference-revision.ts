import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Tables whose rows every API process may keep in memory; any write to them bumps the revision. */
export const REFERENCE_TABLES = ['facility_settings', 'organisations', 'instruments', 'configurations', 'changeover_pairs', 'eyewear_items'] as const;

/**
 * One revision number for the reference data (facility, organisations, instruments, configurations, changeover model,
 * eyewear). A trigger bumps it in the writer's own transaction, so a reader that sees revision R sees at least the
 * rows of R: a process may then serve its in-memory copy for R, whichever process or script made the change.
 */
export class ReferenceRevision1764979200000 implements MigrationInterface {
  name = 'ReferenceRevision1764979200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE reference_revision (
      id integer PRIMARY KEY DEFAULT 1 CHECK (id = 1),
      revision bigint NOT NULL DEFAULT 1
    )`);
    await q.query(`INSERT INTO reference_revision (id, revision) VALUES (1, 1)`);
    await q.query(`CREATE FUNCTION bump_reference_revision() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        UPDATE reference_revision SET revision = revision + 1 WHERE id = 1;
        RETURN NULL;
      END $$`);
    for (const t of REFERENCE_TABLES) {
      await q.query(`CREATE TRIGGER ${t}_bump_reference_revision AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON ${t}
        FOR EACH STATEMENT EXECUTE FUNCTION bump_reference_revision()`);
    }
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of REFERENCE_TABLES) await q.query(`DROP TRIGGER IF EXISTS ${t}_bump_reference_revision ON ${t}`);
    await q.query(`DROP FUNCTION IF EXISTS bump_reference_revision()`);
    await q.query(`DROP TABLE IF EXISTS reference_revision`);
  }
}
