import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Training courses, per-configuration requirements and sign-offs, and the laser-safety officer flag.
 * The free-text `training_records.course` becomes a course row; every course found (or, with none, a
 * "Class 4 laser safety" course) is required for every configuration, which keeps the old rule — some laser-safety
 * training valid on the session date — for facilities that had one course.
 */
export class TrainingAuthorisation1765800000000 implements MigrationInterface {
  name = 'TrainingAuthorisation1765800000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE training_courses (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      name text NOT NULL CHECK (length(btrim(name)) BETWEEN 2 AND 120),
      description text NOT NULL DEFAULT '',
      validity_months integer NOT NULL CHECK (validity_months BETWEEN 1 AND 120),
      required_for_all boolean NOT NULL DEFAULT false,
      active boolean NOT NULL DEFAULT true,
      created_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE UNIQUE INDEX training_courses_name ON training_courses (lower(name))`);
    // Validity from the records themselves: the mean interval in whole months (30.4375 days, the Gregorian mean month).
    await q.query(`INSERT INTO training_courses (name, validity_months, required_for_all)
      SELECT min(course), GREATEST(1, LEAST(120, round(avg(expires_on - completed_on) / 30.4375)::int)), true
        FROM training_records GROUP BY lower(course)`);
    await q.query(`INSERT INTO training_courses (name, description, validity_months, required_for_all)
      SELECT 'Class 4 laser safety', 'Facility laser-safety induction for Class 4 sources', 24, true
       WHERE NOT EXISTS (SELECT 1 FROM training_courses)`);
    await q.query(`ALTER TABLE training_records
      ADD COLUMN course_id uuid REFERENCES training_courses(id),
      ADD COLUMN recorded_by uuid REFERENCES users(id),
      ADD COLUMN note text NOT NULL DEFAULT '',
      ADD COLUMN revoked_at timestamptz,
      ADD COLUMN revoked_by uuid REFERENCES users(id),
      ADD COLUMN revoked_reason text,
      ADD COLUMN reminder_sent_at timestamptz,
      ADD COLUMN created_at timestamptz NOT NULL DEFAULT now()`);
    await q.query(`UPDATE training_records t SET course_id = c.id FROM training_courses c WHERE lower(c.name) = lower(t.course)`);
    await q.query(`ALTER TABLE training_records ALTER COLUMN course_id SET NOT NULL, DROP COLUMN course`);
    await q.query(`ALTER TABLE training_records ADD CONSTRAINT training_records_revocation
      CHECK ((revoked_at IS NULL) = (revoked_by IS NULL) AND (revoked_at IS NULL) = (revoked_reason IS NULL))`);
    await q.query(`CREATE INDEX training_records_user ON training_records (user_id, course_id)`);
    await q.query(`CREATE INDEX training_records_expiry ON training_records (expires_on) WHERE revoked_at IS NULL AND reminder_sent_at IS NULL`);

    await q.query(`CREATE TABLE configuration_requirements (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      configuration_id uuid NOT NULL REFERENCES configurations(id) ON DELETE CASCADE,
      course_id uuid REFERENCES training_courses(id) ON DELETE CASCADE,
      signoff_label text CHECK (signoff_label IS NULL OR length(btrim(signoff_label)) BETWEEN 3 AND 200),
      CONSTRAINT configuration_requirements_one_kind CHECK ((course_id IS NULL) <> (signoff_label IS NULL))
    )`);
    await q.query(`CREATE UNIQUE INDEX configuration_requirements_course ON configuration_requirements (configuration_id, course_id) WHERE course_id IS NOT NULL`);
    await q.query(`CREATE UNIQUE INDEX configuration_requirements_signoff ON configuration_requirements (configuration_id) WHERE signoff_label IS NOT NULL`);

    await q.query(`CREATE TABLE configuration_signoffs (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id uuid NOT NULL REFERENCES users(id),
      configuration_id uuid NOT NULL REFERENCES configurations(id) ON DELETE CASCADE,
      granted_by uuid NOT NULL REFERENCES users(id),
      granted_on date NOT NULL,
      expires_on date,
      note text NOT NULL DEFAULT '',
      revoked_at timestamptz,
      revoked_by uuid REFERENCES users(id),
      revoked_reason text,
      reminder_sent_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT configuration_signoffs_dates CHECK (expires_on IS NULL OR expires_on > granted_on),
      CONSTRAINT configuration_signoffs_revocation CHECK ((revoked_at IS NULL) = (revoked_by IS NULL) AND (revoked_at IS NULL) = (revoked_reason IS NULL))
    )`);
    // One live sign-off per person and configuration, even when two officers grant at the same moment.
    await q.query(`CREATE UNIQUE INDEX configuration_signoffs_live ON configuration_signoffs (user_id, configuration_id) WHERE revoked_at IS NULL`);

    await q.query(`ALTER TABLE users ADD COLUMN is_laser_safety_officer boolean NOT NULL DEFAULT false`);
    await q.query(`ALTER TABLE users ADD CONSTRAINT users_lso_is_staff CHECK (NOT is_laser_safety_officer OR role IN ('staff', 'admin'))`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE users DROP CONSTRAINT users_lso_is_staff, DROP COLUMN is_laser_safety_officer`);
    await q.query(`DROP TABLE configuration_signoffs`);
    await q.query(`DROP TABLE configuration_requirements`);
    await q.query(`ALTER TABLE training_records ADD COLUMN course text`);
    await q.query(`UPDATE training_records t SET course = c.name FROM training_courses c WHERE c.id = t.course_id`);
    // Revoked records did not exist before: they go, so the old rule (any unexpired record counts) does not revive them.
    await q.query(`DELETE FROM training_records WHERE revoked_at IS NOT NULL`);
    await q.query(`DROP INDEX training_records_expiry`);
    await q.query(`DROP INDEX training_records_user`);
    await q.query(`ALTER TABLE training_records ALTER COLUMN course SET NOT NULL, DROP CONSTRAINT training_records_revocation,
      DROP COLUMN course_id, DROP COLUMN recorded_by, DROP COLUMN note, DROP COLUMN revoked_at, DROP COLUMN revoked_by,
      DROP COLUMN revoked_reason, DROP COLUMN reminder_sent_at, DROP COLUMN created_at`);
    await q.query(`DROP TABLE training_courses`);
  }
}
