import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

export interface OutboxAttachment {
  filename: string;
  contentType: string;
  content: string;
}

@Entity('outbox_messages')
export class OutboxMessage {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'to_address', type: 'text' }) toAddress: string;
  @Column({ type: 'text' }) subject: string;
  @Column({ name: 'text_body', type: 'text' }) textBody: string;
  @Column({ name: 'html_body', type: 'text' }) htmlBody: string;
  @Column({ type: 'jsonb', default: [] }) attachments: OutboxAttachment[];
  @Column({ type: 'text' }) template: string;
  @Column({ type: 'text', default: 'pending' }) status: 'pending' | 'sent' | 'failed';
  @Column({ type: 'integer', default: 0 }) attempts: number;
  @Column({ name: 'last_error', type: 'text', nullable: true }) lastError: string | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
  @Column({ name: 'sent_at', type: 'timestamptz', nullable: true }) sentAt: Date | null;
}
