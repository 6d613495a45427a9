import type { PriceLine } from '@femtoslot/shared';
import { Column, CreateDateColumn, Entity, PrimaryColumn, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { minorUnitsColumn } from '../../lib/money/minor-column';

@Entity('billing_periods')
export class BillingPeriod {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'text' }) month: string;
  @Column({ name: 'starts_at', type: 'timestamptz' }) startsAt: Date;
  @Column({ name: 'ends_at', type: 'timestamptz' }) endsAt: Date;
  @Column({ name: 'time_zone', type: 'text' }) timeZone: string;
  @Column({ type: 'text', default: 'open' }) status: 'open' | 'closing' | 'closed';
  @Column({ name: 'created_by', type: 'uuid', nullable: true }) createdBy: string | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
  @Column({ name: 'close_requested_by', type: 'uuid', nullable: true }) closeRequestedBy: string | null;
  @Column({ name: 'closed_at', type: 'timestamptz', nullable: true }) closedAt: Date | null;
}

@Entity('billing_period_accounts')
export class BillingPeriodAccount {
  @PrimaryColumn({ name: 'period_id', type: 'uuid' }) periodId: string;
  @PrimaryColumn({ name: 'account_id', type: 'uuid' }) accountId: string;
  @Column({ type: 'char', length: 3 }) currency: string;
  @Column({ type: 'jsonb' }) lines: PriceLine[];
  @Column({ name: 'total_minor', type: 'bigint', transformer: minorUnitsColumn }) totalMinor: number;
  @Column({ type: 'text', default: 'pending' }) status: 'pending' | 'done';
  @Column({ name: 'stripe_invoice_id', type: 'text', nullable: true }) stripeInvoiceId: string | null;
  @Column({ name: 'invoice_id', type: 'uuid', nullable: true }) invoiceId: string | null;
  @Column({ name: 'last_error', type: 'text', nullable: true }) lastError: string | null;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt: Date;
}

export interface BillingJobError { accountId: string; message: string; at: string }

@Entity('billing_jobs')
export class BillingJob {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'period_id', type: 'uuid' }) periodId: string;
  @Column({ type: 'text', default: 'queued' }) status: 'queued' | 'running' | 'completed' | 'failed';
  @Column({ type: 'integer', default: 0 }) done: number;
  @Column({ type: 'integer', default: 0 }) total: number;
  @Column({ type: 'jsonb', default: [] }) errors: BillingJobError[];
  @Column({ name: 'requested_by', type: 'uuid', nullable: true }) requestedBy: string | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
  @Column({ name: 'started_at', type: 'timestamptz', nullable: true }) startedAt: Date | null;
  @Column({ name: 'finished_at', type: 'timestamptz', nullable: true }) finishedAt: Date | null;
}

@Entity('journal_lines')
export class JournalLine {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'period_id', type: 'uuid' }) periodId: string;
  @Column({ name: 'account_id', type: 'uuid' }) accountId: string;
  @Column({ name: 'invoice_id', type: 'uuid' }) invoiceId: string;
  @Column({ name: 'cost_centre_code', type: 'text' }) costCentreCode: string;
  @Column({ name: 'line_key', type: 'text' }) lineKey: string;
  @Column({ name: 'amount_minor', type: 'bigint', transformer: minorUnitsColumn }) amountMinor: number;
  @Column({ type: 'char', length: 3 }) currency: string;
  @Column({ type: 'text' }) description: string;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
}

@Entity('account_billing_details')
export class AccountBillingDetails {
  @PrimaryColumn({ name: 'account_id', type: 'uuid' }) accountId: string;
  @Column({ name: 'tax_id', type: 'text', nullable: true }) taxId: string | null;
  @Column({ name: 'po_file_original_name', type: 'text', nullable: true }) poFileOriginalName: string | null;
  @Column({ name: 'po_file_stored_name', type: 'text', nullable: true }) poFileStoredName: string | null;
  @Column({ name: 'po_file_sha256', type: 'text', nullable: true }) poFileSha256: string | null;
  @Column({ name: 'po_file_size_bytes', type: 'integer', nullable: true }) poFileSizeBytes: number | null;
  @Column({ name: 'created_by', type: 'uuid' }) createdBy: string;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
}
