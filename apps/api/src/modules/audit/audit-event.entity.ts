import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

@Entity('audit_events')
export class AuditEvent {
  @PrimaryGeneratedColumn({ type: 'bigint' }) id: string;
  @Column({ name: 'actor_user_id', type: 'uuid', nullable: true }) actorUserId: string | null;
  @Column({ type: 'text' }) action: string;
  @Column({ name: 'entity_type', type: 'text' }) entityType: string;
  @Column({ name: 'entity_id', type: 'text' }) entityId: string;
  @Column({ type: 'jsonb', nullable: true }) before: Record<string, unknown> | null;
  @Column({ type: 'jsonb', nullable: true }) after: Record<string, unknown> | null;
  @Column({ name: 'request_id', type: 'text', nullable: true }) requestId: string | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
}
