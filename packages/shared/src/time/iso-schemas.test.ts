import { describe, expect, it } from 'vitest';
import { billingPeriodInputSchema, rateCardInputSchema } from '../billing/billing.schemas';
import { bookingListQuerySchema, createBookingInputSchema } from '../bookings/booking.schemas';
import { instantInputSchema } from '../timeline/timeline-schemas';
import { usageLogInputSchema, utilisationQuerySchema } from '../usage/usage.schemas';
import { calendarDateSchema, calendarMonthSchema, isoInstantSchema } from './iso-schemas';

const rates = { internal: { standard: 6000, dfg: 7500 }, external_academic: { standard: 11000, dfg: 13750 }, industry: { standard: 26000, dfg: 32500 } };
const rateCard = (effectiveFrom: string) => ({ name: 'Card', effectiveFrom, currency: 'USD', rates });
const id = '00000000-0000-4000-8000-000000000000';

describe('shared date and instant pieces', () => {
  // ISO 8601-1:2019 §4.3 (calendar dates): February has 28 days, 29 in a leap year (divisible by 4, except centuries
  // not divisible by 400); April, June, September and November have 30.
  it.each(['2031-02-30', '2030-02-29', '2100-02-29', '2026-04-31', '2026-13-01', '2026-00-10', '0000-01-01', '2026-1-01', '20260101'])(
    'when the calendar date is %s, then it is refused', (v) => {
      expect(calendarDateSchema.safeParse(v).success).toBe(false);
    });

  it.each(['2028-02-29', '2000-02-29', '2026-12-31', '0001-01-01', '9999-12-31'])('when the calendar date is %s, then it is accepted', (v) => {
    expect(calendarDateSchema.parse(v)).toBe(v);
  });

  it.each(['0000-01', '2026-13', '2026-00', '2026-1'])('when the month is %s, then it is refused', (v) => {
    expect(calendarMonthSchema.safeParse(v).success).toBe(false);
  });

  // PostgreSQL refuses a displacement of ±16:00 or more (22009); the IANA tz database's zones run from −12:00
  // (Etc/GMT+12) to +14:00 (Pacific/Kiritimati), so nothing real lies beyond.
  it.each(['2026-01-01T00:00:00+16:00', '2026-01-01T00:00:00-16:00', '2026-01-01T00:00:00+23:59', '2026-01-01T00:00:00+14:01',
    '2026-01-01T00:00:00-12:01', '0000-01-01T00:00:00Z', '0000-12-31T23:00:00-01:00', '2026-02-30T00:00:00Z', '2026-01-01T00:00:00'])(
    'when the instant is %s, then it is refused', (v) => {
      expect(isoInstantSchema().safeParse(v).success).toBe(false);
      expect(instantInputSchema.safeParse(v).success).toBe(false);
    });

  it.each(['2026-01-01T00:00:00+14:00', '2026-01-01T00:00:00-12:00', '2026-01-01T00:00:00Z', '2026-01-01T00:00:00.123456+05:45', '0001-01-01T00:00:00Z'])(
    'when the instant is %s, then it is accepted', (v) => {
      expect(isoInstantSchema().parse(v)).toBe(v);
    });
});

describe('the schemas at the edges use them', () => {
  it('when a rate card starts on 2031-02-30, then the rate-card schema refuses it', () => {
    expect(rateCardInputSchema.safeParse(rateCard('2031-02-28')).success).toBe(true);
    const r = rateCardInputSchema.safeParse(rateCard('2031-02-30'));
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.path).toEqual(['effectiveFrom']);
  });

  it('when a billing month is in year 0000, then it is refused', () => {
    expect(billingPeriodInputSchema.safeParse({ month: '0000-01' }).success).toBe(false);
  });

  it.each(['2026-01-01T00:00:00+16:00', '0000-01-01T00:00:00Z'])('when a report, list, booking or log instant is %s, then it is refused', (bad) => {
    const ok = '2026-01-02T00:00:00Z';
    expect(utilisationQuerySchema.safeParse({ from: bad, to: ok }).success).toBe(false);
    expect(bookingListQuerySchema.safeParse({ from: bad, to: ok }).success).toBe(false);
    expect(createBookingInputSchema.safeParse({ instrumentId: id, configurationId: id, accountId: id, startsAt: bad, endsAt: ok, targetNm: 800, purpose: 'probe' }).success).toBe(false);
    const segment = { configurationId: id, startsAt: bad, endsAt: ok, minNm: 800, maxNm: 800 };
    expect(usageLogInputSchema.safeParse({ actualStartsAt: bad, actualEndsAt: ok, segments: [segment] }).success).toBe(false);
  });
});
