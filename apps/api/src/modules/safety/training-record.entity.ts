import { Check, Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** One completed course for one person; revoked records stay for the history and count for nothing. */
@Entity('training_records')
@Check('training_records_dates', 'expires_on > completed_on')
@Check('training_records_revocation', '(revoked_at IS NULL) = (revoked_by IS NULL) AND (revoked_at IS NULL) = (revoked_reason IS NULL)')
@Index('training_records_user', ['userId', 'courseId'])
export class TrainingRecord {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'user_id', type: 'uuid' }) userId: string;
  @Column({ name: 'course_id', type: 'uuid' }) courseId: string;
  @Column({ name: 'completed_on', type: 'date' }) completedOn: string;
  @Column({ name: 'expires_on', type: 'date' }) expiresOn: string;
  @Column({ name: 'recorded_by', type: 'uuid', nullable: true }) recordedBy: string | null;
  @Column({ type: 'text', default: '' }) note: string;
  @Column({ name: 'revoked_at', type: 'timestamptz', nullable: true }) revokedAt: Date | null;
  @Column({ name: 'revoked_by', type: 'uuid', nullable: true }) revokedBy: string | null;
  @Column({ name: 'revoked_reason', type: 'text', nullable: true }) revokedReason: string | null;
  @Column({ name: 'reminder_sent_at', type: 'timestamptz', nullable: true }) reminderSentAt: Date | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
}
