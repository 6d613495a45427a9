import { describe, expect, it } from 'vitest';
import { cancellationFeePercent } from './booking-policy';

const policy = { cancellationFreeHours: 72, cancellationHalfFeeHours: 24 };
const start = new Date('2026-12-10T14:00:00Z');
const hoursBefore = (h: number) => new Date(start.getTime() - h * 3_600_000);

describe('cancellation fee windows (facility policy, PRODUCT.md §4: free ≥ 72 h, 50 % ≥ 24 h, else 100 %)', () => {
  it('when cancelled 73 h before, then free; 71 h → 50 %; 25 h → 50 %; 23 h → 100 %', () => {
    expect([73, 71, 25, 23].map((h) => cancellationFeePercent(start, hoursBefore(h), policy))).toEqual([0, 50, 50, 100]);
  });
  it('when cancelled exactly at a boundary, then the cheaper window applies', () => {
    expect(cancellationFeePercent(start, hoursBefore(72), policy)).toBe(0);
    expect(cancellationFeePercent(start, hoursBefore(24), policy)).toBe(50);
  });
  it('when cancelled after the start, then 100 %', () => {
    expect(cancellationFeePercent(start, hoursBefore(-1), policy)).toBe(100);
  });
});
