import type { MigrationInterface, QueryRunner } from 'typeorm';

export class UsageLogs1764806400000 implements MigrationInterface {
  name = 'UsageLogs1764806400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE attachments (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      booking_id uuid NOT NULL REFERENCES timeline_blocks(id),
      organisation_id uuid NOT NULL REFERENCES organisations(id),
      original_name text NOT NULL CHECK (length(original_name) BETWEEN 1 AND 255),
      stored_name text NOT NULL UNIQUE CHECK (stored_name ~ '^[a-f0-9]{32}$'),
      content_type text NOT NULL CHECK (content_type IN ('text/csv','text/plain','application/pdf','image/png','image/jpeg')),
      size_bytes integer NOT NULL CHECK (size_bytes > 0),
      sha256 text NOT NULL,
      uploaded_by uuid NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE INDEX attachments_booking ON attachments (booking_id)`);
    await q.query(`CREATE TABLE usage_logs (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      booking_id uuid NOT NULL UNIQUE REFERENCES timeline_blocks(id),
      status text NOT NULL DEFAULT 'submitted' CHECK (status IN ('submitted','confirmed','billed')),
      actual_starts_at timestamptz NOT NULL,
      actual_ends_at timestamptz NOT NULL,
      outside_grace boolean NOT NULL DEFAULT false,
      notes text NOT NULL DEFAULT '',
      attachment_ids jsonb NOT NULL DEFAULT '[]'::jsonb,
      submitted_by uuid NOT NULL REFERENCES users(id),
      submitted_at timestamptz NOT NULL DEFAULT now(),
      confirmed_by uuid REFERENCES users(id),
      confirmed_at timestamptz,
      billed_by uuid REFERENCES users(id),
      billed_at timestamptz,
      CONSTRAINT usage_logs_interval CHECK (actual_ends_at > actual_starts_at),
      CONSTRAINT usage_logs_billed CHECK (status <> 'billed' OR (billed_by IS NOT NULL AND billed_at IS NOT NULL))
    )`);
    await q.query(`CREATE TABLE usage_segments (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      usage_log_id uuid NOT NULL REFERENCES usage_logs(id) ON DELETE CASCADE,
      configuration_id uuid NOT NULL REFERENCES configurations(id),
      starts_at timestamptz NOT NULL,
      ends_at timestamptz NOT NULL,
      min_nm numeric(10,3) NOT NULL CHECK (min_nm > 0),
      max_nm numeric(10,3) NOT NULL,
      average_power_mw numeric(12,3) CHECK (average_power_mw >= 0),
      pulse_fwhm_fs numeric(12,3) CHECK (pulse_fwhm_fs > 0),
      pulse_shape text CHECK (pulse_shape IN ('gaussian','sech2')),
      trace_attachment_id uuid REFERENCES attachments(id),
      notes text NOT NULL DEFAULT '',
      CONSTRAINT usage_segments_interval CHECK (ends_at > starts_at),
      CONSTRAINT usage_segments_range CHECK (min_nm <= max_nm),
      -- Segments of one log never overlap each other, even under concurrent edits.
      CONSTRAINT usage_segments_no_overlap EXCLUDE USING gist (usage_log_id WITH =, tstzrange(starts_at, ends_at, '[)') WITH &&)
    )`);
    await q.query(`CREATE INDEX usage_segments_log ON usage_segments (usage_log_id)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE IF EXISTS usage_segments`);
    await q.query(`DROP TABLE IF EXISTS usage_logs`);
    await q.query(`DROP TABLE IF EXISTS attachments`);
  }
}
