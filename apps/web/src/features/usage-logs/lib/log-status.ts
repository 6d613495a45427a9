import type { UsageLogDto } from '@femtoslot/shared';

export type LogStatus = 'needs_log' | UsageLogDto['status'];

export const logStatusOf = (log: UsageLogDto | null): LogStatus => log?.status ?? 'needs_log';

export const logStatusLabels: Record<LogStatus, string> = {
  needs_log: 'Needs a log',
  submitted: 'Submitted',
  confirmed: 'Confirmed',
  billed: 'Billed',
};

export interface LockedDetails {
  billedBy: string | null;
  billedAt: string | null;
}

/** 409 log_locked carries who billed the log and when. */
export function lockedDetails(details: unknown): LockedDetails {
  const d = typeof details === 'object' && details !== null ? (details as Record<string, unknown>) : {};
  return {
    billedBy: typeof d.billedBy === 'string' ? d.billedBy : null,
    billedAt: typeof d.billedAt === 'string' ? d.billedAt : null,
  };
}

/**
 * True when the logged times leave the booked interval by more than the grace (start earlier or end later).
 * Only a hint while typing: the API sets log.outsideGrace, and that is what staff see.
 */
export function leavesBooking(booking: { startsAt: string; endsAt: string }, actualStartsAt: string, actualEndsAt: string, graceMinutes: number): boolean {
  const grace = graceMinutes * 60_000;
  return Date.parse(actualStartsAt) < Date.parse(booking.startsAt) - grace || Date.parse(actualEndsAt) > Date.parse(booking.endsAt) + grace;
}
