import { describe, expect, test } from 'vitest';
import { cancellationFee } from './cancellation-fee';

// Windows as the facility defaults set them (facility policy: free ≥ 72 h, 50 % ≥ 24 h, else 100 %).
const windows = { cancellationFreeHours: 72, cancellationHalfFeeHours: 24 };
const start = new Date('2026-06-10T14:00:00Z');
const hoursBefore = (h: number) => new Date(start.getTime() - h * 3_600_000);

describe('cancellation fee window', () => {
  test('when cancelling 100 h before, then it is free until 72 h before', () => {
    const fee = cancellationFee(start, hoursBefore(100), windows);
    expect(fee.percent).toBe(0);
    expect(fee.changesAt?.toISOString()).toBe('2026-06-07T14:00:00.000Z');
  });
  test('when cancelling exactly 72 h before, then it is still free', () => {
    expect(cancellationFee(start, hoursBefore(72), windows).percent).toBe(0);
  });
  test('when cancelling 71 h before, then half the price is due until 24 h before', () => {
    const fee = cancellationFee(start, hoursBefore(71), windows);
    expect(fee.percent).toBe(50);
    expect(fee.changesAt?.toISOString()).toBe('2026-06-09T14:00:00.000Z');
  });
  test('when cancelling 23 h before or after the start, then the full price is due', () => {
    expect(cancellationFee(start, hoursBefore(23), windows).percent).toBe(100);
    expect(cancellationFee(start, hoursBefore(-2), windows).changesAt).toBeNull();
  });
  test('when the facility sets other windows, then they are used', () => {
    expect(cancellationFee(start, hoursBefore(30), { cancellationFreeHours: 48, cancellationHalfFeeHours: 12 }).percent).toBe(50);
  });
});
