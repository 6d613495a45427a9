import { type BookingDto, type UsageLogDto, type UsageLogInput, type UsageSegmentInput, pickerUnits, pulseShapes } from '@femtoslot/shared';
import { z } from 'zod';
import { fieldsToInstant, instantToFields } from '../../../lib/wall-time';
import { nmToText, parseOptionalNumber, parsePositive, rangeToNm } from './range-units';

const date = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Choose a date');
const time = z.string().regex(/^\d{2}:\d{2}$/, 'Choose a time');

export const segmentFormSchema = z
  .object({
    configurationId: z.string().min(1, 'Choose a configuration'),
    minValue: z.string().trim().min(1, 'Give the short end of the range'),
    maxValue: z.string().trim().min(1, 'Give the long end of the range'),
    unit: z.enum(pickerUnits),
    /** the segment spans the whole session; its own times are used only when this is off */
    wholeSession: z.boolean(),
    startDate: z.string(),
    startTime: z.string(),
    endDate: z.string(),
    endTime: z.string(),
    averagePowerMw: z.string().trim(),
    pulseFwhmFs: z.string().trim(),
    pulseShape: z.enum(pulseShapes),
    /** spectral FWHM in nm, optional: with it the API also checks the transform limit */
    spectralFwhmNm: z.string().trim(),
    /** set by a trace upload; '' when the pulse duration was typed */
    traceAttachmentId: z.string(),
    notes: z.string().max(2000, 'Keep segment notes under 2000 characters'),
  })
  .superRefine((s, ctx) => {
    if (s.minValue && parsePositive(s.minValue) === null) ctx.addIssue({ code: 'custom', path: ['minValue'], message: 'Give a positive number' });
    if (s.maxValue && parsePositive(s.maxValue) === null) ctx.addIssue({ code: 'custom', path: ['maxValue'], message: 'Give a positive number' });
    if (parseOptionalNumber(s.averagePowerMw) === null) ctx.addIssue({ code: 'custom', path: ['averagePowerMw'], message: 'Give the power in mW, or leave it empty' });
    const pulse = parseOptionalNumber(s.pulseFwhmFs);
    if (pulse === null || pulse === 0) ctx.addIssue({ code: 'custom', path: ['pulseFwhmFs'], message: 'Give the duration in fs, or leave it empty' });
    const bandwidth = parseOptionalNumber(s.spectralFwhmNm);
    if (bandwidth === null || bandwidth === 0) ctx.addIssue({ code: 'custom', path: ['spectralFwhmNm'], message: 'Give the spectral width in nm, or leave it empty' });
    if (!s.wholeSession) {
      for (const key of ['startDate', 'endDate'] as const) if (!date.safeParse(s[key]).success) ctx.addIssue({ code: 'custom', path: [key], message: 'Choose a date' });
      for (const key of ['startTime', 'endTime'] as const) if (!time.safeParse(s[key]).success) ctx.addIssue({ code: 'custom', path: [key], message: 'Choose a time' });
    }
  });
export type SegmentFormValues = z.infer<typeof segmentFormSchema>;

/** What the log form holds: text as typed, times as wall clock in the facility zone. */
export const usageFormSchema = z.object({
  actualStartDate: date,
  actualStartTime: time,
  actualEndDate: date,
  actualEndTime: time,
  segments: z.array(segmentFormSchema).min(1, 'Log at least one segment').max(20, 'At most 20 segments'),
  notes: z.string().max(4000, 'Keep the notes under 4000 characters'),
});
export type UsageFormValues = z.infer<typeof usageFormSchema>;

export function blankSegment(configurationId: string, range: { minNm: number; maxNm: number } | null, span: { startsAt: string; endsAt: string }, timeZone: string): SegmentFormValues {
  const start = instantToFields(span.startsAt, timeZone);
  const end = instantToFields(span.endsAt, timeZone);
  return {
    configurationId,
    minValue: range ? nmToText(range.minNm, 'nm') : '',
    maxValue: range ? nmToText(range.maxNm, 'nm') : '',
    unit: 'nm',
    wholeSession: true,
    startDate: start.date,
    startTime: start.time,
    endDate: end.date,
    endTime: end.time,
    averagePowerMw: '',
    pulseFwhmFs: '',
    pulseShape: 'gaussian',
    spectralFwhmNm: '',
    traceAttachmentId: '',
    notes: '',
  };
}

const sameInstant = (a: string, b: string) => Date.parse(a) === Date.parse(b);
const numberText = (n: number | null) => (n === null ? '' : String(n));

/** The form's starting values: the saved log when there is one, else the booking as booked. */
export function initialUsageValues(booking: BookingDto, log: UsageLogDto | null, timeZone: string): UsageFormValues {
  const startsAt = log?.actualStartsAt ?? booking.startsAt;
  const endsAt = log?.actualEndsAt ?? booking.endsAt;
  const start = instantToFields(startsAt, timeZone);
  const end = instantToFields(endsAt, timeZone);
  const target = booking.detail ? { minNm: booking.detail.targetMinNm, maxNm: booking.detail.targetMaxNm } : null;
  const segments = log?.segments.length
    ? log.segments.map((s) => ({
        ...blankSegment(s.configurationId, { minNm: s.minNm, maxNm: s.maxNm }, s, timeZone),
        wholeSession: sameInstant(s.startsAt, startsAt) && sameInstant(s.endsAt, endsAt),
        averagePowerMw: numberText(s.averagePowerMw),
        pulseFwhmFs: numberText(s.pulseFwhmFs),
        pulseShape: s.pulseShape ?? 'gaussian',
        spectralFwhmNm: numberText(s.spectralFwhmNm),
        traceAttachmentId: s.traceAttachmentId ?? '',
        notes: s.notes ?? '',
      }))
    : [blankSegment(booking.configurationId, target, { startsAt, endsAt }, timeZone)];
  return { actualStartDate: start.date, actualStartTime: start.time, actualEndDate: end.date, actualEndTime: end.time, segments, notes: log?.notes ?? '' };
}

export interface BuiltUsage {
  body: UsageLogInput;
  /** plain-English notes on clock changes met while reading the wall times */
  notes: string[];
}

/**
 * The POST /api/bookings/:id/usage body, or null while the form is incomplete. Wall times are read in the
 * facility zone (RFC 5545 §3.3.5 for gaps and overlaps); wavelengths go out in nm, short end first.
 */
export function buildUsageBody(values: UsageFormValues, timeZone: string, attachmentIds: readonly string[]): BuiltUsage | null {
  const start = fieldsToInstant({ date: values.actualStartDate, time: values.actualStartTime }, timeZone);
  const end = fieldsToInstant({ date: values.actualEndDate, time: values.actualEndTime }, timeZone);
  if (!start || !end) return null;
  const actualStartsAt = start.instant.toISOString();
  const actualEndsAt = end.instant.toISOString();
  const notes = [start.note, end.note].filter((n): n is string => Boolean(n));
  const segments: UsageSegmentInput[] = [];
  for (const s of values.segments) {
    const range = rangeToNm(s.minValue, s.maxValue, s.unit);
    if (!range || !s.configurationId) return null;
    let span = { startsAt: actualStartsAt, endsAt: actualEndsAt };
    if (!s.wholeSession) {
      const from = fieldsToInstant({ date: s.startDate, time: s.startTime }, timeZone);
      const to = fieldsToInstant({ date: s.endDate, time: s.endTime }, timeZone);
      if (!from || !to) return null;
      span = { startsAt: from.instant.toISOString(), endsAt: to.instant.toISOString() };
      notes.push(...[from.note, to.note].filter((n): n is string => Boolean(n)));
    }
    const power = parseOptionalNumber(s.averagePowerMw);
    const pulse = parseOptionalNumber(s.pulseFwhmFs);
    const bandwidth = parseOptionalNumber(s.spectralFwhmNm);
    if (power === null || pulse === null || bandwidth === null) return null;
    const fromTrace = s.traceAttachmentId !== '' && pulse !== undefined;
    segments.push({
      configurationId: s.configurationId,
      ...span,
      ...range,
      averagePowerMw: power ?? null,
      pulseFwhmFs: pulse ?? null,
      // the shape the duration was deconvolved with (here from a trace, or by the user): the pulse trend keeps shapes apart
      pulseShape: pulse !== undefined ? s.pulseShape : null,
      spectralFwhmNm: pulse !== undefined ? (bandwidth ?? null) : null,
      traceAttachmentId: fromTrace ? s.traceAttachmentId : null,
      ...(s.notes.trim() ? { notes: s.notes.trim() } : {}),
    });
  }
  const body: UsageLogInput = {
    actualStartsAt,
    actualEndsAt,
    segments,
    ...(values.notes.trim() ? { notes: values.notes.trim() } : {}),
    attachmentIds: [...attachmentIds],
  };
  return { body, notes: [...new Set(notes)] };
}

const segmentFields: Record<string, keyof SegmentFormValues> = {
  configurationId: 'configurationId',
  minNm: 'minValue',
  maxNm: 'maxValue',
  startsAt: 'startTime',
  endsAt: 'endTime',
  averagePowerMw: 'averagePowerMw',
  pulseFwhmFs: 'pulseFwhmFs',
  pulseShape: 'pulseShape',
  spectralFwhmNm: 'spectralFwhmNm',
  traceAttachmentId: 'pulseFwhmFs',
  notes: 'notes',
};
const topFields: Record<string, keyof UsageFormValues | 'actualStartTime' | 'actualEndTime'> = {
  actualStartsAt: 'actualStartTime',
  actualEndsAt: 'actualEndTime',
  notes: 'notes',
};

/** Where an API issue path (['segments', 0, 'minNm']) lands in the form ('segments.0.minValue'). */
export function formFieldForPath(path: readonly unknown[]): string | null {
  if (path[0] === 'segments' && typeof path[1] === 'number') {
    const field = segmentFields[String(path[2] ?? 'minNm')];
    return field ? `segments.${path[1]}.${field}` : null;
  }
  return topFields[String(path[0])] ?? null;
}

/** The segment a 422 refers to, when the API says (details.segmentIndex, .index or .segment). */
export function segmentIndexOf(details: unknown): number | null {
  if (typeof details !== 'object' || details === null) return null;
  const d = details as Record<string, unknown>;
  for (const key of ['segmentIndex', 'index', 'segment']) if (typeof d[key] === 'number') return d[key] as number;
  return null;
}
