import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

@Entity('training_records')
export class TrainingRecord {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'user_id', type: 'uuid' }) userId: string;
  @Column({ type: 'text' }) course: string;
  @Column({ name: 'completed_on', type: 'date' }) completedOn: string;
  @Column({ name: 'expires_on', type: 'date' }) expiresOn: string;
}
