import type { MigrationInterface, QueryRunner } from 'typeorm';

export class Billing1764892800000 implements MigrationInterface {
  name = 'Billing1764892800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE rate_cards (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      name text NOT NULL CHECK (length(name) BETWEEN 1 AND 120),
      effective_from date NOT NULL,
      effective_to date,
      currency char(3) NOT NULL CHECK (currency ~ '^[A-Z]{3}$'),
      billing_increment_minutes integer NOT NULL DEFAULT 15 CHECK (billing_increment_minutes BETWEEN 1 AND 240),
      changeover_share_percent integer NOT NULL DEFAULT 0 CHECK (changeover_share_percent BETWEEN 0 AND 100),
      minimum_charge_minutes integer NOT NULL DEFAULT 0 CHECK (minimum_charge_minutes BETWEEN 0 AND 720),
      rates jsonb NOT NULL CHECK (jsonb_typeof(rates) = 'object'),
      created_by uuid REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT rate_cards_dates CHECK (effective_to IS NULL OR effective_to > effective_from),
      -- One rate card in force on any day, even under concurrent edits.
      CONSTRAINT rate_cards_no_overlap EXCLUDE USING gist (daterange(effective_from, effective_to, '[)') WITH &&)
    )`);
    await q.query(`CREATE TABLE billing_periods (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      month text NOT NULL UNIQUE CHECK (month ~ '^[0-9]{4}-(0[1-9]|1[0-2])$'),
      starts_at timestamptz NOT NULL,
      ends_at timestamptz NOT NULL,
      time_zone text NOT NULL,
      status text NOT NULL DEFAULT 'open' CHECK (status IN ('open','closing','closed')),
      created_by uuid REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      close_requested_by uuid REFERENCES users(id),
      closed_at timestamptz,
      CONSTRAINT billing_periods_interval CHECK (ends_at > starts_at)
    )`);
    // The statement frozen when a close starts, and the job's progress per account (done ⇒ never redone).
    await q.query(`CREATE TABLE billing_period_accounts (
      period_id uuid NOT NULL REFERENCES billing_periods(id),
      account_id uuid NOT NULL REFERENCES accounts(id),
      currency char(3) NOT NULL,
      lines jsonb NOT NULL CHECK (jsonb_typeof(lines) = 'array'),
      total_minor bigint NOT NULL,
      status text NOT NULL DEFAULT 'pending' CHECK (status IN ('pending','done')),
      stripe_invoice_id text,
      invoice_id uuid,
      last_error text,
      updated_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (period_id, account_id)
    )`);
    await q.query(`CREATE TABLE billing_jobs (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      period_id uuid NOT NULL REFERENCES billing_periods(id),
      status text NOT NULL DEFAULT 'queued' CHECK (status IN ('queued','running','completed','failed')),
      done integer NOT NULL DEFAULT 0 CHECK (done >= 0),
      total integer NOT NULL DEFAULT 0 CHECK (total >= 0),
      errors jsonb NOT NULL DEFAULT '[]'::jsonb,
      requested_by uuid REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      started_at timestamptz,
      finished_at timestamptz
    )`);
    await q.query(`CREATE INDEX billing_jobs_period ON billing_jobs (period_id, created_at)`);
    await q.query(`CREATE SEQUENCE invoice_number_seq`);
    await q.query(`CREATE TABLE invoices (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      period_id uuid NOT NULL REFERENCES billing_periods(id),
      account_id uuid NOT NULL REFERENCES accounts(id),
      organisation_id uuid NOT NULL REFERENCES organisations(id),
      number text NOT NULL UNIQUE,
      kind text NOT NULL CHECK (kind IN ('external','internal')),
      status text NOT NULL CHECK (status IN ('draft','open','paid','void','journal')),
      currency char(3) NOT NULL,
      total_minor bigint NOT NULL,
      amount_paid_minor bigint NOT NULL DEFAULT 0 CHECK (amount_paid_minor >= 0),
      paid_at timestamptz,
      lines jsonb NOT NULL CHECK (jsonb_typeof(lines) = 'array'),
      stripe_invoice_id text UNIQUE,
      stripe_invoice_number text,
      hosted_invoice_url text,
      due_date date,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT invoices_period_account UNIQUE (period_id, account_id),
      CONSTRAINT invoices_kind_status CHECK ((kind = 'internal') = (status = 'journal'))
    )`);
    await q.query(`ALTER TABLE billing_period_accounts ADD CONSTRAINT billing_period_accounts_invoice FOREIGN KEY (invoice_id) REFERENCES invoices(id)`);
    await q.query(`CREATE TABLE journal_lines (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      period_id uuid NOT NULL REFERENCES billing_periods(id),
      account_id uuid NOT NULL REFERENCES accounts(id),
      invoice_id uuid NOT NULL REFERENCES invoices(id),
      cost_centre_code text NOT NULL,
      line_key text NOT NULL,
      amount_minor bigint NOT NULL,
      currency char(3) NOT NULL,
      description text NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT journal_lines_once UNIQUE (period_id, account_id, line_key)
    )`);
    await q.query(`CREATE TABLE stripe_events (
      id text PRIMARY KEY,
      type text NOT NULL,
      stripe_invoice_id text,
      outcome text NOT NULL,
      received_at timestamptz NOT NULL DEFAULT now()
    )`);
    await q.query(`CREATE TABLE account_billing_details (
      account_id uuid PRIMARY KEY REFERENCES accounts(id) ON DELETE CASCADE,
      tax_id text,
      po_file_original_name text,
      po_file_stored_name text UNIQUE CHECK (po_file_stored_name ~ '^[a-f0-9]{32}$'),
      po_file_sha256 text,
      po_file_size_bytes integer CHECK (po_file_size_bytes > 0),
      created_by uuid NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now()
    )`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of ['account_billing_details', 'stripe_events', 'journal_lines']) await q.query(`DROP TABLE IF EXISTS ${table}`);
    await q.query(`ALTER TABLE billing_period_accounts DROP CONSTRAINT IF EXISTS billing_period_accounts_invoice`);
    for (const table of ['invoices', 'billing_jobs', 'billing_period_accounts', 'billing_periods', 'rate_cards']) await q.query(`DROP TABLE IF EXISTS ${table}`);
    await q.query(`DROP SEQUENCE IF EXISTS invoice_number_seq`);
  }
}
