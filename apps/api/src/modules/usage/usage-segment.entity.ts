import { Column, Entity, Exclusion, PrimaryGeneratedColumn } from 'typeorm';
import { numericTransformer } from '../../db/column-types';

@Entity('usage_segments')
@Exclusion('usage_segments_no_overlap', `USING gist (usage_log_id WITH =, tstzrange(starts_at, ends_at, '[)') WITH &&)`)
export class UsageSegment {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'usage_log_id', type: 'uuid' }) usageLogId: string;
  @Column({ name: 'configuration_id', type: 'uuid' }) configurationId: string;
  @Column({ name: 'starts_at', type: 'timestamptz' }) startsAt: Date;
  @Column({ name: 'ends_at', type: 'timestamptz' }) endsAt: Date;
  @Column({ name: 'min_nm', type: 'numeric', transformer: numericTransformer }) minNm: number;
  @Column({ name: 'max_nm', type: 'numeric', transformer: numericTransformer }) maxNm: number;
  @Column({ name: 'average_power_mw', type: 'numeric', nullable: true, transformer: numericTransformer }) averagePowerMw: number | null;
  @Column({ name: 'pulse_fwhm_fs', type: 'numeric', nullable: true, transformer: numericTransformer }) pulseFwhmFs: number | null;
  @Column({ name: 'pulse_shape', type: 'text', nullable: true }) pulseShape: 'gaussian' | 'sech2' | null;
  @Column({ name: 'spectral_fwhm_nm', type: 'numeric', nullable: true, transformer: numericTransformer }) spectralFwhmNm: number | null;
  @Column({ name: 'trace_attachment_id', type: 'uuid', nullable: true }) traceAttachmentId: string | null;
  @Column({ type: 'text', default: '' }) notes: string;
}
