import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

@Entity('accounts')
export class Account {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'organisation_id', type: 'uuid' }) organisationId: string;
  @Column({ type: 'text' }) kind: 'cost_centre' | 'external';
  @Column({ type: 'text' }) name: string;
  @Column({ name: 'cost_centre_code', type: 'text', nullable: true }) costCentreCode: string | null;
  @Column({ name: 'billing_contact_email', type: 'text', nullable: true }) billingContactEmail: string | null;
  @Column({ name: 'po_number', type: 'text', nullable: true }) poNumber: string | null;
  @Column({ name: 'po_expires_on', type: 'date', nullable: true }) poExpiresOn: string | null;
  @Column({ name: 'stripe_customer_id', type: 'text', nullable: true }) stripeCustomerId: string | null;
  @Column({ type: 'text', default: 'pending' }) status: 'pending' | 'approved' | 'inactive';
  @Column({ name: 'approved_by', type: 'uuid', nullable: true }) approvedBy: string | null;
  @Column({ name: 'approved_at', type: 'timestamptz', nullable: true }) approvedAt: Date | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
}
