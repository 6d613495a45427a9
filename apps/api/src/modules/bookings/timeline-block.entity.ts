import { Column, CreateDateColumn, Entity, Exclusion, Index, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { numericTransformer } from '../../db/column-types';

export type BookingStatus = 'requested' | 'approved' | 'declined' | 'completed' | 'cancelled' | 'displaced';
export type MaintenanceStatus = 'scheduled' | 'cancelled';
/** Statuses that occupy the instrument; mirrored by the exclusion constraint's WHERE clause. */
export const occupyingStatuses = ['requested', 'approved', 'completed', 'scheduled'] as const;

@Entity('timeline_blocks')
@Index('timeline_blocks_station_once', ['parentId', 'instrumentId'], { unique: true, where: 'parent_id IS NOT NULL' })
@Exclusion('timeline_blocks_no_overlap', `USING gist (instrument_id WITH =, tstzrange(starts_at, ends_at, '[)') WITH &&) WHERE (status IN ('requested','approved','completed','scheduled')) DEFERRABLE INITIALLY IMMEDIATE`)
export class TimelineBlock {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ name: 'instrument_id', type: 'uuid' }) instrumentId: string;
  /** 'station': an end station a booking includes, on the bench's own timeline (see `parentId`). */
  @Column({ type: 'text' }) kind: 'booking' | 'maintenance' | 'station';
  @Column({ type: 'text' }) status: BookingStatus | MaintenanceStatus;
  @Column({ name: 'starts_at', type: 'timestamptz' }) startsAt: Date;
  @Column({ name: 'ends_at', type: 'timestamptz' }) endsAt: Date;
  @Column({ name: 'configuration_id', type: 'uuid', nullable: true }) configurationId: string | null;
  @Column({ name: 'target_min_nm', type: 'numeric', nullable: true, transformer: numericTransformer }) targetMinNm: number | null;
  @Column({ name: 'target_max_nm', type: 'numeric', nullable: true, transformer: numericTransformer }) targetMaxNm: number | null;
  @Column({ name: 'account_id', type: 'uuid', nullable: true }) accountId: string | null;
  @Column({ name: 'user_id', type: 'uuid', nullable: true }) userId: string | null;
  @Column({ name: 'organisation_id', type: 'uuid', nullable: true }) organisationId: string | null;
  @Column({ type: 'text', nullable: true }) purpose: string | null;
  @Column({ type: 'text', nullable: true }) reason: string | null;
  @Column({ name: 'decline_reason', type: 'text', nullable: true }) declineReason: string | null;
  @Column({ name: 'cancellation_fee_percent', type: 'integer', nullable: true }) cancellationFeePercent: number | null;
  @Column({ name: 'created_by', type: 'uuid', nullable: true }) createdBy: string | null;
  @Column({ type: 'jsonb', default: [] }) alternatives: { startsAt: string; endsAt: string }[];
  @Column({ name: 'rebooked_as', type: 'uuid', nullable: true }) rebookedAs: string | null;
  @Column({ name: 'displaced_by', type: 'uuid', nullable: true }) displacedBy: string | null;
  @Column({ name: 'decided_by', type: 'uuid', nullable: true }) decidedBy: string | null;
  @Column({ name: 'decided_at', type: 'timestamptz', nullable: true }) decidedAt: Date | null;
  @Column({ name: 'cancelled_by', type: 'uuid', nullable: true }) cancelledBy: string | null;
  @Column({ name: 'cancelled_at', type: 'timestamptz', nullable: true }) cancelledAt: Date | null;
  /** For a station row: the booking it belongs to (its status and interval are kept equal to the booking's by trigger). */
  @Column({ name: 'parent_id', type: 'uuid', nullable: true }) parentId: string | null;
  /** For a booking: the end stations it includes, when the read that produced it asked for them (not a column). */
  stationIds?: string[];
  /** RFC 5545 SEQUENCE: bumped on every change a calendar client must pick up. */
  @Column({ type: 'integer', default: 0 }) sequence: number;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt: Date;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt: Date;
}
