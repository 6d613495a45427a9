import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

@Entity('usage_logs')
export class UsageLog {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'booking_id', type: 'uuid' }) bookingId: string;
  @Column({ type: 'text', default: 'submitted' }) status: 'submitted' | 'confirmed' | 'billed';
  @Column({ name: 'actual_starts_at', type: 'timestamptz' }) actualStartsAt: Date;
  @Column({ name: 'actual_ends_at', type: 'timestamptz' }) actualEndsAt: Date;
  @Column({ name: 'outside_grace', type: 'boolean', default: false }) outsideGrace: boolean;
  @Column({ type: 'text', default: '' }) notes: string;
  @Column({ name: 'attachment_ids', type: 'jsonb', default: [] }) attachmentIds: string[];
  @Column({ name: 'submitted_by', type: 'uuid' }) submittedBy: string;
  @Column({ name: 'submitted_at', type: 'timestamptz' }) submittedAt: Date;
  @Column({ name: 'confirmed_by', type: 'uuid', nullable: true }) confirmedBy: string | null;
  @Column({ name: 'confirmed_at', type: 'timestamptz', nullable: true }) confirmedAt: Date | null;
  @Column({ name: 'billed_by', type: 'uuid', nullable: true }) billedBy: string | null;
  @Column({ name: 'billed_at', type: 'timestamptz', nullable: true }) billedAt: Date | null;
}
