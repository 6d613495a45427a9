import type { BookingDto, MaintenanceDto } from '@femtoslot/shared';
import type { SessionUser } from '../../lib/auth/session';
import type { TimelineBlock } from './timeline-block.entity';

/** Roles that see every organisation's bookings in detail. */
export const facilityWideRoles = new Set(['staff', 'finance', 'admin']);

export interface BookingLookups {
  configurationKey(id: string): { key: string; outputKind: string };
  userName(id: string): string;
  organisationName(id: string): string;
  accountName(id: string): string;
  /** The booking's end stations, when the booking's own read did not bring them. */
  stationIds?(bookingId: string): string[];
}

export function canSeeDetail(viewer: SessionUser, block: Pick<TimelineBlock, 'organisationId'>): boolean {
  return facilityWideRoles.has(viewer.role) || block.organisationId === viewer.organisationId;
}

/** Another organisation's booking leaves the API as busy/free with its configuration only. */
export function toBookingDto(b: TimelineBlock, viewer: SessionUser, look: BookingLookups, changeoverBeforeMinutes: number | null = null): BookingDto {
  const cfg = look.configurationKey(b.configurationId!);
  const detail = canSeeDetail(viewer, b);
  return {
    id: b.id,
    instrumentId: b.instrumentId,
    configurationId: b.configurationId!,
    configurationKey: cfg.key,
    outputKind: cfg.outputKind,
    status: b.status as BookingDto['status'],
    startsAt: b.startsAt.toISOString(),
    endsAt: b.endsAt.toISOString(),
    own: b.organisationId === viewer.organisationId,
    stationIds: b.stationIds ?? look.stationIds?.(b.id) ?? [],
    detail: detail
      ? {
          userId: b.userId!,
          userName: look.userName(b.userId!),
          organisationId: b.organisationId!,
          organisationName: look.organisationName(b.organisationId!),
          accountId: b.accountId!,
          accountName: look.accountName(b.accountId!),
          purpose: b.purpose ?? '',
          targetMinNm: b.targetMinNm!,
          targetMaxNm: b.targetMaxNm!,
          declineReason: b.declineReason,
          cancellationFeePercent: b.cancellationFeePercent,
          alternatives: b.alternatives ?? [],
          rebookedAs: b.rebookedAs,
          changeoverBeforeMinutes,
        }
      : null,
  };
}

export function toMaintenanceDto(b: TimelineBlock): MaintenanceDto {
  return { id: b.id, instrumentId: b.instrumentId, startsAt: b.startsAt.toISOString(), endsAt: b.endsAt.toISOString(), reason: b.reason ?? '', status: b.status as MaintenanceDto['status'] };
}

/** Snapshot for the audit trail: what a state change is about. */
export function auditSnapshot(b: TimelineBlock): Record<string, unknown> {
  return {
    status: b.status, startsAt: b.startsAt.toISOString(), endsAt: b.endsAt.toISOString(), configurationId: b.configurationId,
    targetMinNm: b.targetMinNm, targetMaxNm: b.targetMaxNm, accountId: b.accountId, cancellationFeePercent: b.cancellationFeePercent,
    declineReason: b.declineReason, reason: b.reason,
  };
}
