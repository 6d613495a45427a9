import type { FacilityPolicies } from '@femtoslot/shared';
import { Column, Entity, PrimaryColumn, UpdateDateColumn } from 'typeorm';

export type { FacilityPolicies };

@Entity('facility_settings')
export class FacilitySettings {
  @PrimaryColumn({ type: 'smallint' }) id: number;
  @Column({ type: 'text' }) name: string;
  @Column({ name: 'time_zone', type: 'text' }) timeZone: string;
  @Column({ type: 'char', length: 3 }) currency: string;
  @Column({ type: 'jsonb' }) policies: FacilityPolicies;
  /** Actual session times may start this many minutes before the booking and end this many after it (default 60). */
  @Column({ name: 'usage_window_minutes', type: 'integer', default: 60 }) usageWindowMinutes: number;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt: Date;
}
