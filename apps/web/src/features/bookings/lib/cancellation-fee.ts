import { cancellationFeePercent, cancellationWindows } from '@femtoslot/shared/bookings/booking-policy';

export interface CancellationWindows {
  cancellationFreeHours: number;
  cancellationHalfFeeHours: number;
}

/** The facility defaults (free ≥ 72 h, 50 % ≥ 24 h before the start), used until the facility's own policies have loaded. */
export const defaultCancellationWindows: CancellationWindows = { cancellationFreeHours: 72, cancellationHalfFeeHours: 24 };

export interface CancellationFee {
  percent: 0 | 50 | 100;
  /** when the next, dearer window begins; null once the full fee applies */
  changesAt: Date | null;
  summary: string;
}

/**
 * Fee for cancelling now a booking that starts at `startsAt`: free until `cancellationFreeHours` before the start,
 * half until `cancellationHalfFeeHours` before, the full fee after. A window's boundary instant belongs to the cheaper side.
 */
export function cancellationFee(startsAt: Date | string, now: Date, windows: CancellationWindows): CancellationFee {
  const start = new Date(startsAt);
  const [free, half] = cancellationWindows(start, windows);
  const percent = cancellationFeePercent(start, now, windows);
  if (percent === 0) {
    return { percent: 0, changesAt: free!.until, summary: `Free: more than ${windows.cancellationFreeHours} h before the start.` };
  }
  if (percent === 50) {
    return {
      percent: 50,
      changesAt: half!.until,
      summary: `50 % of the booking's price: between ${windows.cancellationFreeHours} h and ${windows.cancellationHalfFeeHours} h before the start.`,
    };
  }
  return { percent: 100, changesAt: null, summary: `The full price: less than ${windows.cancellationHalfFeeHours} h before the start.` };
}

export function cancellationPolicyText(windows: CancellationWindows): string {
  return (
    `Cancelling is free until ${windows.cancellationFreeHours} h before the start, costs 50 % until ` +
    `${windows.cancellationHalfFeeHours} h before, and the full price after that. Time displaced by maintenance is never charged.`
  );
}
