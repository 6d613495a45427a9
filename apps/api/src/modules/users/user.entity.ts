import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Role } from '@femtoslot/shared';
import { Organisation } from '../organisations/organisation.entity';

@Entity('users')
export class User {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'organisation_id', type: 'uuid' }) organisationId: string;
  @ManyToOne(() => Organisation, { eager: true })
  @JoinColumn({ name: 'organisation_id' })
  organisation: Organisation;
  @Column({ type: 'text' }) email: string;
  @Column({ type: 'text' }) name: string;
  @Column({ type: 'text' }) role: Role;
  @Column({ name: 'password_hash', type: 'text', nullable: true }) passwordHash: string | null;
  @Column({ type: 'boolean', default: true }) active: boolean;
  @Column({ name: 'calendar_token', type: 'text', nullable: true }) calendarToken: string | null;
  /** Carried in the session token; a password reset raises it, which ends every older session. */
  @Column({ name: 'session_epoch', type: 'integer', default: 0 }) sessionEpoch: number;
  /** May record and revoke training and sign-offs; only staff or admin hold it (users_lso_is_staff). */
  @Column({ name: 'is_laser_safety_officer', type: 'boolean', default: false }) isLaserSafetyOfficer: boolean;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
}
