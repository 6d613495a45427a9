import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Bounds on a session log: the facility's window (minutes before the booked start and after the booked end) inside
 * which actual times may lie, and the spectral FWHM a segment's pulse was measured with (for the transform-limit check).
 */
export class SessionLogBounds1765400000000 implements MigrationInterface {
  name = 'SessionLogBounds1765400000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE facility_settings ADD COLUMN usage_window_minutes integer NOT NULL DEFAULT 60
      CONSTRAINT facility_settings_usage_window CHECK (usage_window_minutes BETWEEN 0 AND 1440)`);
    await q.query(`ALTER TABLE usage_segments ADD COLUMN spectral_fwhm_nm numeric(10,3)
      CONSTRAINT usage_segments_spectral_fwhm CHECK (spectral_fwhm_nm > 0)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE usage_segments DROP COLUMN IF EXISTS spectral_fwhm_nm`);
    await q.query(`ALTER TABLE facility_settings DROP COLUMN IF EXISTS usage_window_minutes`);
  }
}
