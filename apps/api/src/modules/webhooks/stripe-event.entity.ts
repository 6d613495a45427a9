import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm';

/** One row per Stripe event id: the primary key makes every event count once, however often it is delivered. */
@Entity('stripe_events')
export class StripeEvent {
  @PrimaryColumn({ type: 'text' }) id: string;
  @Column({ type: 'text' }) type: string;
  @Column({ name: 'stripe_invoice_id', type: 'text', nullable: true }) stripeInvoiceId: string | null;
  @Column({ type: 'text' }) outcome: string;
  @CreateDateColumn({ name: 'received_at', type: 'timestamptz' }) receivedAt: Date;
}
