import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { OutputKind, RateClass, RequiredOdBand } from '@femtoslot/shared';
import { numericTransformer } from '../../db/column-types';

@Entity('configurations')
export class Configuration {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'instrument_id', type: 'uuid' }) instrumentId: string;
  @Column({ type: 'text' }) key: string;
  @Column({ type: 'text' }) name: string;
  @Column({ name: 'output_kind', type: 'text' }) outputKind: OutputKind;
  @Column({ name: 'min_nm', type: 'numeric', transformer: numericTransformer }) minNm: number;
  @Column({ name: 'max_nm', type: 'numeric', transformer: numericTransformer }) maxNm: number;
  @Column({ name: 'default_nm', type: 'numeric', transformer: numericTransformer }) defaultNm: number;
  @Column({ name: 'rate_class', type: 'text' }) rateClass: RateClass;
  /** Required OD per wavelength band, set by the laser-safety officer; at a wavelength the highest covering band applies. */
  @Column({ name: 'required_od_bands', type: 'jsonb' }) requiredOdBands: RequiredOdBand[];
  /** Overrides the instrument's minutes per nm of retune within this output; null uses the instrument's figure. */
  @Column({ name: 'retune_minutes_per_nm', type: 'numeric', nullable: true, transformer: numericTransformer }) retuneMinutesPerNm: number | null;
  @Column({ type: 'boolean', default: true }) active: boolean;
}
