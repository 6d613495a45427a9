export interface CancellationPolicy {
  cancellationFreeHours: number;
  cancellationHalfFeeHours: number;
}

/**
 * Facility policy (PRODUCT.md §4 defaults): free until 72 h before the start, 50 % until 24 h, 100 % after.
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
