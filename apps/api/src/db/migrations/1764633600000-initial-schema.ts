import type { MigrationInterface, QueryRunner } from 'typeorm';

export class InitialSchema1764633600000 implements MigrationInterface {
  name = 'InitialSchema1764633600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE EXTENSION IF NOT EXISTS btree_gist`);
    await q.query(`CREATE EXTENSION IF NOT EXISTS pgcrypto`);

    await q.query(`CREATE TABLE facility_settings (
      id smallint PRIMARY KEY DEFAULT 1 CHECK (id = 1),
      name text NOT NULL,
      time_zone text NOT NULL,
      currency char(3) NOT NULL CHECK (currency ~ '^[A-Z]{3}$'),
      policies jsonb NOT NULL DEFAULT '{}'::jsonb,
      updated_at timestamptz NOT NULL DEFAULT now()
    )`);

    await q.query(`CREATE TABLE organisations (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      name text NOT NULL UNIQUE,
      kind text NOT NULL CHECK (kind IN ('internal','external_academic','industry')),
      created_at timestamptz NOT NULL DEFAULT now()
    )`);

    await q.query(`CREATE TABLE users (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organisation_id uuid NOT NULL REFERENCES organisations(id),
      email text NOT NULL,
      name text NOT NULL,
      role text NOT NULL CHECK (role IN ('collaborator','member','pi','staff','finance','admin')),
      password_hash text,
      active boolean NOT NULL DEFAULT true,
      created_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT users_email_lower CHECK (email = lower(email))
    )`);
    await q.query(`CREATE UNIQUE INDEX users_email_key ON users (email)`);

    await q.query(`CREATE TABLE auth_tokens (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      purpose text NOT NULL CHECK (purpose IN ('invitation','password_reset')),
      token_hash text NOT NULL UNIQUE,
      expires_at timestamptz NOT NULL,
      used_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now()
    )`);

    await q.query(`CREATE TABLE accounts (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organisation_id uuid NOT NULL REFERENCES organisations(id),
      kind text NOT NULL CHECK (kind IN ('cost_centre','external')),
      name text NOT NULL,
      cost_centre_code text,
      billing_contact_email text,
      po_number text,
      po_expires_on date,
      stripe_customer_id text,
      status text NOT NULL DEFAULT 'pending' CHECK (status IN ('pending','approved','inactive')),
      approved_by uuid REFERENCES users(id),
      approved_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT accounts_cost_centre_code CHECK (kind <> 'cost_centre' OR cost_centre_code IS NOT NULL),
      CONSTRAINT accounts_external_contact CHECK (kind <> 'external' OR billing_contact_email IS NOT NULL)
    )`);

    await q.query(`CREATE TABLE instruments (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      name text NOT NULL UNIQUE,
      kind text NOT NULL CHECK (kind IN ('source','bench')),
      description text NOT NULL DEFAULT '',
      pump_nm numeric(10,3),
      retune_minutes_per_nm numeric(8,4) NOT NULL DEFAULT 0 CHECK (retune_minutes_per_nm >= 0),
      warmup_after_maintenance_minutes integer NOT NULL DEFAULT 0 CHECK (warmup_after_maintenance_minutes >= 0),
      pulse_check_minutes integer NOT NULL DEFAULT 0 CHECK (pulse_check_minutes >= 0),
      default_changeover_minutes integer NOT NULL DEFAULT 0 CHECK (default_changeover_minutes >= 0),
      active boolean NOT NULL DEFAULT true,
      created_at timestamptz NOT NULL DEFAULT now()
    )`);

    await q.query(`CREATE TABLE configurations (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      instrument_id uuid NOT NULL REFERENCES instruments(id),
      key text NOT NULL,
      name text NOT NULL,
      output_kind text NOT NULL CHECK (output_kind IN ('fundamental','shg','opa_signal','opa_idler','dfg')),
      min_nm numeric(10,3) NOT NULL CHECK (min_nm > 0),
      max_nm numeric(10,3) NOT NULL,
      default_nm numeric(10,3) NOT NULL,
      rate_class text NOT NULL CHECK (rate_class IN ('standard','dfg')),
      required_od numeric(4,1) NOT NULL CHECK (required_od >= 0 AND required_od <= 12),
      retune_minutes_per_nm numeric(8,4) CHECK (retune_minutes_per_nm >= 0),
      active boolean NOT NULL DEFAULT true,
      CONSTRAINT configurations_range CHECK (min_nm < max_nm),
      CONSTRAINT configurations_default_in_range CHECK (default_nm BETWEEN min_nm AND max_nm),
      CONSTRAINT configurations_instrument_key UNIQUE (instrument_id, key)
    )`);

    await q.query(`CREATE TABLE changeover_pairs (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      instrument_id uuid NOT NULL REFERENCES instruments(id),
      from_configuration_id uuid NOT NULL REFERENCES configurations(id),
      to_configuration_id uuid NOT NULL REFERENCES configurations(id),
      base_minutes integer NOT NULL CHECK (base_minutes >= 0 AND base_minutes <= 1440),
      CONSTRAINT changeover_pairs_unique UNIQUE (instrument_id, from_configuration_id, to_configuration_id)
    )`);

    // Bookings and maintenance windows share one table so that one exclusion constraint keeps the whole timeline free of overlaps.
    await q.query(`CREATE TABLE timeline_blocks (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      instrument_id uuid NOT NULL REFERENCES instruments(id),
      kind text NOT NULL CHECK (kind IN ('booking','maintenance')),
      status text NOT NULL,
      starts_at timestamptz NOT NULL,
      ends_at timestamptz NOT NULL,
      configuration_id uuid REFERENCES configurations(id),
      target_min_nm numeric(10,3),
      target_max_nm numeric(10,3),
      account_id uuid REFERENCES accounts(id),
      user_id uuid REFERENCES users(id),
      organisation_id uuid REFERENCES organisations(id),
      purpose text,
      reason text,
      decline_reason text,
      cancellation_fee_percent integer CHECK (cancellation_fee_percent BETWEEN 0 AND 100),
      created_by uuid REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT timeline_blocks_interval CHECK (ends_at > starts_at),
      CONSTRAINT timeline_blocks_status CHECK (
        (kind = 'booking' AND status IN ('requested','approved','declined','completed','cancelled','displaced'))
        OR (kind = 'maintenance' AND status IN ('scheduled','cancelled'))),
      CONSTRAINT timeline_blocks_booking_fields CHECK (kind <> 'booking' OR (configuration_id IS NOT NULL
        AND account_id IS NOT NULL AND user_id IS NOT NULL AND organisation_id IS NOT NULL
        AND target_min_nm IS NOT NULL AND target_max_nm IS NOT NULL)),
      CONSTRAINT timeline_blocks_target_range CHECK (target_min_nm IS NULL OR target_max_nm IS NULL OR target_min_nm <= target_max_nm),
      CONSTRAINT timeline_blocks_maintenance_reason CHECK (kind <> 'maintenance' OR reason IS NOT NULL),
      CONSTRAINT timeline_blocks_no_overlap EXCLUDE USING gist (
        instrument_id WITH =, tstzrange(starts_at, ends_at, '[)') WITH &&
      ) WHERE (status IN ('requested','approved','completed','scheduled'))
    )`);
    await q.query(`CREATE INDEX timeline_blocks_instrument_time ON timeline_blocks (instrument_id, starts_at)`);

    await q.query(`CREATE TABLE training_records (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      course text NOT NULL,
      completed_on date NOT NULL,
      expires_on date NOT NULL,
      CONSTRAINT training_records_dates CHECK (expires_on > completed_on)
    )`);

    await q.query(`CREATE TABLE eyewear_items (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      label text NOT NULL UNIQUE,
      description text NOT NULL DEFAULT '',
      bands jsonb NOT NULL CHECK (jsonb_typeof(bands) = 'array'),
      active boolean NOT NULL DEFAULT true
    )`);

    await q.query(`CREATE TABLE audit_events (
      id bigserial PRIMARY KEY,
      actor_user_id uuid REFERENCES users(id),
      action text NOT NULL,
      entity_type text NOT NULL,
      entity_id text NOT NULL,
      before jsonb,
      after jsonb,
      request_id text,
      created_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE INDEX audit_events_entity ON audit_events (entity_type, entity_id, created_at)`);

    await q.query(`CREATE TABLE outbox_messages (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      to_address text NOT NULL,
      subject text NOT NULL,
      text_body text NOT NULL,
      html_body text NOT NULL,
      attachments jsonb NOT NULL DEFAULT '[]'::jsonb,
      template text NOT NULL,
      status text NOT NULL DEFAULT 'pending' CHECK (status IN ('pending','sent','failed')),
      attempts integer NOT NULL DEFAULT 0,
      last_error text,
      created_at timestamptz NOT NULL DEFAULT now(),
      sent_at timestamptz
    )`);
    await q.query(`CREATE INDEX outbox_messages_pending ON outbox_messages (created_at) WHERE status = 'pending'`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of ['outbox_messages', 'audit_events', 'eyewear_items', 'training_records', 'timeline_blocks',
      'changeover_pairs', 'configurations', 'instruments', 'accounts', 'auth_tokens', 'users', 'organisations', 'facility_settings']) {
      await q.query(`DROP TABLE IF EXISTS ${table}`);
    }
  }
}
