import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import { numericTransformer } from '../../db/column-types';

@Entity('instruments')
export class Instrument {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'text' }) name: string;
  @Column({ type: 'text' }) kind: 'source' | 'bench';
  @Column({ type: 'text', default: '' }) description: string;
  @Column({ name: 'pump_nm', type: 'numeric', nullable: true, transformer: numericTransformer }) pumpNm: number | null;
  @Column({ name: 'retune_minutes_per_nm', type: 'numeric', transformer: numericTransformer }) retuneMinutesPerNm: number;
  @Column({ name: 'warmup_after_maintenance_minutes', type: 'integer' }) warmupAfterMaintenanceMinutes: number;
  @Column({ name: 'pulse_check_minutes', type: 'integer' }) pulseCheckMinutes: number;
  @Column({ name: 'default_changeover_minutes', type: 'integer' }) defaultChangeoverMinutes: number;
  @Column({ type: 'boolean', default: true }) active: boolean;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
}
