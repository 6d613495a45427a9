import { describe, expect, test } from 'vitest';
import { buildRequest, requestFormSchema } from './request-form-values';

const base = {
  instrumentId: '11111111-1111-4111-8111-111111111111',
  configurationId: '22222222-2222-4222-8222-222222222222',
  targetMode: 'single' as const,
  targetValue: '4.3',
  targetToValue: '',
  unit: 'um' as const,
  startDate: '2026-11-01',
  startTime: '00:30',
  endDate: '2026-11-01',
  endTime: '03:30',
  accountId: '33333333-3333-4333-8333-333333333333',
  purpose: 'CO2 line survey',
};

describe('request body from the form', () => {
  // IANA tz database: 2026-11-01 in New York has 25 hours (EDT → EST at 02:00).
  test('when the night of the fall-back is booked 00:30–03:30, then the body spans 4 h in UTC and the target is in nm', () => {
    const built = buildRequest(base, 'America/New_York')!;
    expect(built.body).toMatchObject({ startsAt: '2026-11-01T04:30:00.000Z', endsAt: '2026-11-01T08:30:00.000Z', targetNm: 4300 });
    expect(built.minutes).toBe(240);
  });
  // IANA tz database: 2026-03-08 in New York has 23 hours (EST → EDT at 02:00).
  test('when the night of the spring-forward is booked 00:30–03:30, then it spans 2 h', () => {
    expect(buildRequest({ ...base, startDate: '2026-03-08', endDate: '2026-03-08' }, 'America/New_York')!.minutes).toBe(120);
  });
  test('when a range is asked for, then minNm and maxNm are sent and no targetNm', () => {
    const built = buildRequest({ ...base, targetMode: 'range', targetValue: '1200', targetToValue: '1100', unit: 'nm' }, 'UTC')!;
    expect(built.body.minNm).toBe(1100);
    expect(built.body.maxNm).toBe(1200);
    expect(built.body.targetNm).toBeUndefined();
  });
  test('when rebooking, then rebookOf rides along', () => {
    expect(buildRequest(base, 'UTC', '44444444-4444-4444-8444-444444444444')!.body.rebookOf).toBe('44444444-4444-4444-8444-444444444444');
  });
  test('when the start time is missing, then there is no body yet', () => {
    expect(buildRequest({ ...base, startTime: '' }, 'UTC')).toBeNull();
  });
  test('when a range lacks its second end, then the form says so', () => {
    const parsed = requestFormSchema.safeParse({ ...base, targetMode: 'range' });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues.map((i) => i.path.join('.'))).toContain('targetToValue');
  });
});
