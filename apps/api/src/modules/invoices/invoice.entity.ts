import type { PriceLine } from '@femtoslot/shared';
import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { minorUnitsColumn } from '../../lib/money/minor-column';

export type InvoiceStatus = 'draft' | 'open' | 'paid' | 'void' | 'journal';

@Entity('invoices')
export class Invoice {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'period_id', type: 'uuid' }) periodId: string;
  @Column({ name: 'account_id', type: 'uuid' }) accountId: string;
  @Column({ name: 'organisation_id', type: 'uuid' }) organisationId: string;
  @Column({ type: 'text' }) number: string;
  @Column({ type: 'text' }) kind: 'external' | 'internal';
  @Column({ type: 'text' }) status: InvoiceStatus;
  @Column({ type: 'char', length: 3 }) currency: string;
  @Column({ name: 'total_minor', type: 'bigint', transformer: minorUnitsColumn }) totalMinor: number;
  @Column({ name: 'amount_paid_minor', type: 'bigint', default: 0, transformer: minorUnitsColumn }) amountPaidMinor: number;
  @Column({ name: 'paid_at', type: 'timestamptz', nullable: true }) paidAt: Date | null;
  @Column({ type: 'jsonb' }) lines: PriceLine[];
  @Column({ name: 'stripe_invoice_id', type: 'text', nullable: true }) stripeInvoiceId: string | null;
  @Column({ name: 'stripe_invoice_number', type: 'text', nullable: true }) stripeInvoiceNumber: string | null;
  @Column({ name: 'hosted_invoice_url', type: 'text', nullable: true }) hostedInvoiceUrl: string | null;
  @Column({ name: 'due_date', type: 'date', nullable: true }) dueDate: string | null;
  @Column({ name: 'po_number', type: 'text', nullable: true }) poNumber: string | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt: Date;
}
