import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

export type AttachmentType = 'text/csv' | 'text/plain' | 'application/pdf' | 'image/png' | 'image/jpeg';

@Entity('attachments')
export class Attachment {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'booking_id', type: 'uuid' }) bookingId: string;
  @Column({ name: 'organisation_id', type: 'uuid' }) organisationId: string;
  @Column({ name: 'original_name', type: 'text' }) originalName: string;
  @Column({ name: 'stored_name', type: 'text' }) storedName: string;
  @Column({ name: 'content_type', type: 'text' }) contentType: AttachmentType;
  @Column({ name: 'size_bytes', type: 'integer' }) sizeBytes: number;
  @Column({ type: 'text' }) sha256: string;
  @Column({ name: 'uploaded_by', type: 'uuid' }) uploadedBy: string;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
}
