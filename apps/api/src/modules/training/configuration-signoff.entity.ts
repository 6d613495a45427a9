import { Check, Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** A laser-safety officer's sign-off of one person for one configuration. */
@Entity('configuration_signoffs')
@Check('configuration_signoffs_dates', 'expires_on IS NULL OR expires_on > granted_on')
@Check('configuration_signoffs_revocation', '(revoked_at IS NULL) = (revoked_by IS NULL) AND (revoked_at IS NULL) = (revoked_reason IS NULL)')
export class ConfigurationSignoff {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'user_id', type: 'uuid' }) userId: string;
  @Column({ name: 'configuration_id', type: 'uuid' }) configurationId: string;
  @Column({ name: 'granted_by', type: 'uuid' }) grantedBy: string;
  @Column({ name: 'granted_on', type: 'date' }) grantedOn: string;
  @Column({ name: 'expires_on', type: 'date', nullable: true }) expiresOn: string | null;
  @Column({ type: 'text', default: '' }) note: string;
  @Column({ name: 'revoked_at', type: 'timestamptz', nullable: true }) revokedAt: Date | null;
  @Column({ name: 'revoked_by', type: 'uuid', nullable: true }) revokedBy: string | null;
  @Column({ name: 'revoked_reason', type: 'text', nullable: true }) revokedReason: string | null;
  @Column({ name: 'reminder_sent_at', type: 'timestamptz', nullable: true }) reminderSentAt: Date | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
}
