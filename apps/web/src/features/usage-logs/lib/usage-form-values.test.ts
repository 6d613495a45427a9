import type { BookingDto, UsageLogDto } from '@femtoslot/shared';
import { describe, expect, it } from 'vitest';
import { buildUsageBody, formFieldForPath, initialUsageValues, segmentIndexOf } from './usage-form-values';

const zone = 'America/New_York';
const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const booking: BookingDto = {
  id: id(1), instrumentId: id(2), configurationId: id(3), configurationKey: 'opa_signal', outputKind: 'opa_signal', status: 'approved',
  startsAt: '2026-03-03T14:00:00.000Z', endsAt: '2026-03-03T18:00:00.000Z', own: true,
  detail: { userId: id(4), userName: 'Ida', organisationId: id(5), organisationName: 'Kestrel', accountId: id(6), accountName: 'CC', purpose: 'x',
    targetMinNm: 1300, targetMaxNm: 1350, declineReason: null, cancellationFeePercent: null, alternatives: [], rebookedAs: null, changeoverBeforeMinutes: null },
};

describe('usage log form values', () => {
  it('when there is no log yet, then the form starts from the booking in facility time with one whole-session segment', () => {
    const values = initialUsageValues(booking, null, zone);
    // Source: IANA tz database — New York is UTC−5 on 3 Mar 2026 (DST starts 8 Mar)
    expect(values).toMatchObject({ actualStartDate: '2026-03-03', actualStartTime: '09:00', actualEndDate: '2026-03-03', actualEndTime: '13:00' });
    expect(values.segments).toHaveLength(1);
    expect(values.segments[0]).toMatchObject({ configurationId: id(3), minValue: '1300', maxValue: '1350', unit: 'nm', wholeSession: true });
  });

  it('when a whole-session segment is typed in µm with a trace, then the body carries nm, the session times and the trace', () => {
    const values = initialUsageValues(booking, null, zone);
    values.actualStartTime = '09:10';
    values.segments[0] = { ...values.segments[0]!, unit: 'um', minValue: '1.31', maxValue: '1.29', averagePowerMw: '250', pulseFwhmFs: '98.5', pulseShape: 'sech2', traceAttachmentId: id(9) };
    const built = buildUsageBody(values, zone, [id(10)])!;
    expect(built.body).toEqual({
      actualStartsAt: '2026-03-03T14:10:00.000Z',
      actualEndsAt: '2026-03-03T18:00:00.000Z',
      segments: [{ configurationId: id(3), startsAt: '2026-03-03T14:10:00.000Z', endsAt: '2026-03-03T18:00:00.000Z', minNm: 1290, maxNm: 1310,
        averagePowerMw: 250, pulseFwhmFs: 98.5, pulseShape: 'sech2', spectralFwhmNm: null, traceAttachmentId: id(9) }],
      attachmentIds: [id(10)],
    });
  });

  it('when the pulse duration is typed and the segment has its own span, then its assumed shape and bandwidth go out without a trace and the span is read in the zone', () => {
    const values = initialUsageValues(booking, null, zone);
    values.segments[0] = { ...values.segments[0]!, wholeSession: false, startTime: '10:00', endTime: '11:30', pulseFwhmFs: '120', spectralFwhmNm: '12.5' };
    const segment = buildUsageBody(values, zone, [])!.body.segments[0]!;
    expect(segment).toMatchObject({ startsAt: '2026-03-03T15:00:00.000Z', endsAt: '2026-03-03T16:30:00.000Z', pulseFwhmFs: 120, pulseShape: 'gaussian', spectralFwhmNm: 12.5, traceAttachmentId: null, averagePowerMw: null });
  });

  it('when no pulse duration is given, then neither shape nor bandwidth goes out', () => {
    const values = initialUsageValues(booking, null, zone);
    values.segments[0] = { ...values.segments[0]!, spectralFwhmNm: '12.5' };
    expect(buildUsageBody(values, zone, [])!.body.segments[0]).toMatchObject({ pulseFwhmFs: null, pulseShape: null, spectralFwhmNm: null });
  });

  it('when a range end is missing, then there is no body yet', () => {
    const values = initialUsageValues(booking, null, zone);
    values.segments[0]!.maxValue = '';
    expect(buildUsageBody(values, zone, [])).toBeNull();
  });

  it('when a log exists, then its segments come back with their own span only where they differ from the session', () => {
    const log = {
      id: id(20), bookingId: booking.id, status: 'submitted', actualStartsAt: booking.startsAt, actualEndsAt: booking.endsAt, outsideGrace: false, notes: 'ok',
      segments: [
        { id: id(21), configurationId: id(3), configurationKey: 'opa_signal', startsAt: booking.startsAt, endsAt: booking.endsAt, minNm: 1200, maxNm: 1400, averagePowerMw: 300, pulseFwhmFs: null, pulseShape: null, spectralFwhmNm: null, traceAttachmentId: null, notes: '' },
        { id: id(22), configurationId: id(7), configurationKey: 'dfg', startsAt: '2026-03-03T16:00:00.000Z', endsAt: booking.endsAt, minNm: 4000, maxNm: 4500, averagePowerMw: null, pulseFwhmFs: 140, pulseShape: 'gaussian', spectralFwhmNm: null, traceAttachmentId: id(23), notes: '' },
      ],
      attachments: [], submittedBy: 'Ida', submittedAt: booking.endsAt, confirmedBy: null, confirmedAt: null, billedBy: null, billedAt: null,
    } satisfies UsageLogDto;
    const values = initialUsageValues(booking, log, zone);
    expect(values.segments.map((s) => s.wholeSession)).toEqual([true, false]);
    expect(values.segments[1]).toMatchObject({ startTime: '11:00', minValue: '4000', pulseFwhmFs: '140', traceAttachmentId: id(23) });
    expect(values.notes).toBe('ok');
  });

  it('when the API names a field or a segment, then the message lands on the matching form field', () => {
    expect(formFieldForPath(['segments', 1, 'maxNm'])).toBe('segments.1.maxValue');
    expect(formFieldForPath(['actualEndsAt'])).toBe('actualEndTime');
    expect(formFieldForPath(['unknown'])).toBeNull();
    expect(segmentIndexOf({ segmentIndex: 2 })).toBe(2);
    expect(segmentIndexOf({})).toBeNull();
  });
});
