import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { EyewearBand } from '@femtoslot/shared';

@Entity('eyewear_items')
export class EyewearItem {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'text' }) label: string;
  @Column({ type: 'text', default: '' }) description: string;
  @Column({ type: 'jsonb' }) bands: EyewearBand[];
  @Column({ type: 'boolean', default: true }) active: boolean;
}
