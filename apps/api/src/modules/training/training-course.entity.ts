import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

@Entity('training_courses')
export class TrainingCourse {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'text' }) name: string;
  @Column({ type: 'text', default: '' }) description: string;
  @Column({ name: 'validity_months', type: 'integer' }) validityMonths: number;
  /** Required for every configuration (the facility's laser-safety induction), on top of each configuration's own list. */
  @Column({ name: 'required_for_all', type: 'boolean', default: false }) requiredForAll: boolean;
  @Column({ type: 'boolean', default: true }) active: boolean;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
}
