export interface CancellationPolicy {
  cancellationFreeHours: number;
  cancellationHalfFeeHours: number;
}

/**
 * Facility policy (defaults): free until 72 h before the start, 50 % until 24 h, 100 % after.
 * "Until N h before" includes the instant exactly N hours before.
 */
export function cancellationFeePercent(startsAt: Date, cancelledAt: Date, policy: CancellationPolicy): 0 | 50 | 100 {
  const hoursBefore = (startsAt.getTime() - cancelledAt.getTime()) / 3_600_000;
  if (hoursBefore >= policy.cancellationFreeHours) return 0;
  if (hoursBefore >= policy.cancellationHalfFeeHours) return 50;
  return 100;
}

export function describeCancellationPolicy(policy: CancellationPolicy): string {
  return `Cancelling is free until ${policy.cancellationFreeHours} h before the start, costs 50 % of the booked time until ${policy.cancellationHalfFeeHours} h before, and 100 % after that. A booking displaced by maintenance costs nothing.`;
}

/** One cancellation window: cancelling at an instant after `from` and up to and including `until` costs `percent` % of the booked time. */
export interface CancellationWindow {
  percent: 0 | 50 | 100;
  /** null: from the moment of booking */
  from: Date | null;
  until: Date;
}

/** The facility's windows for a booking starting at `startsAt`, in the order they come (same rule as cancellationFeePercent). */
export function cancellationWindows(startsAt: Date, policy: CancellationPolicy): CancellationWindow[] {
  const before = (hours: number) => new Date(startsAt.getTime() - hours * 3_600_000);
  return [
    { percent: 0, from: null, until: before(policy.cancellationFreeHours) },
    { percent: 50, from: before(policy.cancellationFreeHours), until: before(policy.cancellationHalfFeeHours) },
    { percent: 100, from: before(policy.cancellationHalfFeeHours), until: startsAt },
  ];
}
