import type { RateTable } from '@femtoslot/shared';
import { Column, CreateDateColumn, Entity, Exclusion, PrimaryGeneratedColumn } from 'typeorm';

@Entity('rate_cards')
@Exclusion('rate_cards_no_overlap', `USING gist (daterange(effective_from, effective_to, '[)') WITH &&)`)
export class RateCard {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'text' }) name: string;
  @Column({ name: 'effective_from', type: 'date' }) effectiveFrom: string;
  @Column({ name: 'effective_to', type: 'date', nullable: true }) effectiveTo: string | null;
  @Column({ type: 'char', length: 3 }) currency: string;
  @Column({ name: 'billing_increment_minutes', type: 'integer', default: 15 }) billingIncrementMinutes: number;
  @Column({ name: 'changeover_share_percent', type: 'integer', default: 0 }) changeoverSharePercent: number;
  @Column({ name: 'minimum_charge_minutes', type: 'integer', default: 0 }) minimumChargeMinutes: number;
  @Column({ type: 'jsonb' }) rates: RateTable;
  @Column({ name: 'created_by', type: 'uuid', nullable: true }) createdBy: string | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
}
