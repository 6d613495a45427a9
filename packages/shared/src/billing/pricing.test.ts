import { describe, expect, it } from 'vitest';
import { cancellationFeePercent } from '../bookings/booking-policy';
import { zonedToUtc } from '../time/zoned-time';
import type { RateTable } from './billing.schemas';
import { cancellationFeeLine, displacementLine, elapsedMinutes, roundUpToIncrement, totalMinor, usageLines, type PricingRules } from './pricing';

// Invented test rates (not the demo seed): DFG class carries its own rate.
const rates: RateTable = { internal: { standard: 6_000, dfg: 7_500 }, external_academic: { standard: 11_000, dfg: 13_750 }, industry: { standard: 26_000, dfg: 32_500 } };
const rules = (over: Partial<PricingRules> = {}): PricingRules => ({ currency: 'USD', billingIncrementMinutes: 15, changeoverSharePercent: 0, minimumChargeMinutes: 0, rates, ...over });
const ctx = (over: Partial<Parameters<typeof usageLines>[1]> = {}) => ({
  key: 'usage-1', bookingId: '00000000-0000-4000-8000-000000000001', label: 'Beam time', category: 'external_academic' as const, rateClass: 'dfg' as const, ...over,
});
const at = (iso: string) => new Date(iso);

describe('pricing lines', () => {
  it('when a session ran 3 h 4 min, then it is billed as 3 h 15 min (15-min increment, rounded up)', () => {
    expect(roundUpToIncrement(184, 15)).toBe(195);
    const [l] = usageLines(rules(), ctx(), { start: at('2026-10-06T13:00:00Z'), end: at('2026-10-06T16:04:00Z') });
    expect(l!.minutes).toBe(195);
    // 195 × 13 750 / 60 = 44 687.5 → 44 688 (half-up, by hand)
    expect(l!.amountMinor).toBe(44_688);
    expect(l!.explanation).toBe('3 h 15 min (rounded up from 3 h 4 min) × $137.50/h DFG class, external academic');
  });

  it('when the configuration is DFG class, then the +25 % rate applies (2 h × $75 = $150 vs 2 h × $60 = $120, by hand)', () => {
    const span = { start: at('2026-10-07T13:00:00Z'), end: at('2026-10-07T15:00:00Z') };
    expect(usageLines(rules(), ctx({ category: 'internal', rateClass: 'dfg' }), span)[0]!.amountMinor).toBe(15_000);
    expect(usageLines(rules(), ctx({ category: 'internal', rateClass: 'standard' }), span)[0]!.amountMinor).toBe(12_000);
  });

  it('when a session is shorter than the minimum charge, then the minimum is billed and said so', () => {
    const [l] = usageLines(rules({ minimumChargeMinutes: 60 }), ctx({ category: 'industry', rateClass: 'standard' }), { start: at('2026-10-08T13:00:00Z'), end: at('2026-10-08T13:40:00Z') });
    expect(l!.minutes).toBe(60);
    expect(l!.amountMinor).toBe(26_000);
    expect(l!.explanation).toMatch(/minimum charge; 40 min used/);
  });

  it('when the rate card charges a 50 % changeover share, then the incoming session carries half of 45 min', () => {
    const lines = usageLines(rules({ changeoverSharePercent: 50 }), ctx({ rateClass: 'standard' }), { start: at('2026-10-09T13:00:00Z'), end: at('2026-10-09T15:00:00Z') }, 45);
    // 45 × 11 000 × 50 / 6 000 = 4 125 (by hand: 0.75 h × $110 × 0.5 = $41.25)
    expect(lines.map((l) => l.amountMinor)).toEqual([22_000, 4_125]);
  });

  it('when bookings are cancelled 73, 71, 25 and 23 h before the start, then the fees are 0, 50, 50 and 100 % (facility policy defaults)', () => {
    const start = at('2026-10-20T13:00:00Z');
    const policy = { cancellationFreeHours: 72, cancellationHalfFeeHours: 24 };
    const percents = [73, 71, 25, 23].map((h) => cancellationFeePercent(start, new Date(start.getTime() - h * 3_600_000), policy));
    expect(percents).toEqual([0, 50, 50, 100]);
    // 3 h booked × $110/h × 50 % = $165.00; × 100 % = $330.00 (by hand)
    const booked = { start, end: at('2026-10-20T16:00:00Z') };
    expect(cancellationFeeLine(rules(), ctx({ rateClass: 'standard' }), booked, percents[1]!, 71).amountMinor).toBe(16_500);
    expect(cancellationFeeLine(rules(), ctx({ rateClass: 'standard' }), booked, percents[3]!, 23).amountMinor).toBe(33_000);
  });

  it('when a booking was displaced by maintenance, then its line is zero and names what it would have cost', () => {
    const l = displacementLine(rules(), ctx({ rateClass: 'standard' }), { start: at('2026-10-21T13:00:00Z'), end: at('2026-10-21T16:00:00Z') });
    expect(l.amountMinor).toBe(0);
    expect(l.explanation).toMatch(/displaced by maintenance: no charge \(would have been \$330\.00\)/);
    expect(totalMinor([l])).toBe(0);
  });

  it('when a session spans the 2026-11-01 fall-back in New York, then 00:30–03:30 wall time bills 4 real hours (IANA tz: EDT→EST at 02:00)', () => {
    const start = zonedToUtc({ year: 2026, month: 11, day: 1, hour: 0, minute: 30 }, 'America/New_York');
    const end = zonedToUtc({ year: 2026, month: 11, day: 1, hour: 3, minute: 30 }, 'America/New_York');
    expect(elapsedMinutes(start, end)).toBe(240);
    const [l] = usageLines(rules(), ctx({ category: 'internal', rateClass: 'standard' }), { start, end });
    expect(l!.amountMinor).toBe(24_000); // 4 h × $60 (by hand)
  });

  it('when the facility bills in JPY, then lines are whole yen and read without decimals (ISO 4217 minor unit 0)', () => {
    const yen: RateTable = { internal: { standard: 9_000, dfg: 11_250 }, external_academic: { standard: 9_002, dfg: 11_253 }, industry: { standard: 40_000, dfg: 50_000 } };
    const [l] = usageLines(rules({ currency: 'JPY', rates: yen }), ctx({ rateClass: 'standard' }), { start: at('2026-10-22T01:00:00Z'), end: at('2026-10-22T01:40:00Z') });
    // 40 min → 45 min; 45 × 9 002 / 60 = 6 751.5 → ¥6 752 (by hand)
    expect(l!.amountMinor).toBe(6_752);
    expect(l!.explanation).toBe('45 min (rounded up from 40 min) × ¥9,002/h standard class, external academic');
  });
});
