import { type CreateBookingInput, pickerUnits } from '@femtoslot/shared';
import { z } from 'zod';
import { type ResolvedFields, fieldsToInstant } from '../../../lib/wall-time';
import { targetToNm } from './target-units';

const date = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Choose a date');
const time = z.string().regex(/^\d{2}:\d{2}$/, 'Choose a time');

/** What the request form holds: text as typed, times as wall clock in the facility zone. */
export const requestFormSchema = z
  .object({
    instrumentId: z.string().min(1, 'Choose an instrument'),
    configurationId: z.string().min(1, 'Choose a configuration'),
    targetMode: z.enum(['single', 'range']),
    targetValue: z.string().trim().min(1, 'Give a target wavelength'),
    targetToValue: z.string().trim(),
    unit: z.enum(pickerUnits),
    startDate: date,
    startTime: time,
    endDate: date,
    endTime: time,
    accountId: z.string().min(1, 'Choose an account'),
    purpose: z.string().trim().min(3, 'Say in a few words what the beam time is for').max(500),
    /** End stations booked with the source (bench instrument ids). */
    stationIds: z.array(z.string()).optional(),
  })
  .superRefine((v, ctx) => {
    if (!targetToNm('single', v.targetValue, '', v.unit)) ctx.addIssue({ code: 'custom', path: ['targetValue'], message: 'Give a positive number' });
    if (v.targetMode === 'range' && !targetToNm('single', v.targetToValue, '', v.unit)) {
      ctx.addIssue({ code: 'custom', path: ['targetToValue'], message: 'Give the other end of the range' });
    }
  });
export type RequestFormValues = z.infer<typeof requestFormSchema>;

export interface BuiltRequest {
  body: CreateBookingInput;
  start: ResolvedFields;
  end: ResolvedFields;
  minutes: number;
}

/**
 * The POST /api/bookings body from the form, or null while it is incomplete. Wall times are read in the facility
 * zone (RFC 5545 §3.3.5 for gaps and overlaps); wavelengths go out in nm.
 */
export function buildRequest(values: Partial<RequestFormValues>, timeZone: string, rebookOf?: string): BuiltRequest | null {
  const start = fieldsToInstant({ date: values.startDate ?? '', time: values.startTime ?? '' }, timeZone);
  const end = fieldsToInstant({ date: values.endDate ?? '', time: values.endTime ?? '' }, timeZone);
  const target = targetToNm(values.targetMode ?? 'single', values.targetValue ?? '', values.targetToValue ?? '', values.unit ?? 'nm');
  if (!start || !end || !target || !values.instrumentId || !values.configurationId) return null;
  const minutes = Math.round((end.instant.getTime() - start.instant.getTime()) / 60_000);
  const body: CreateBookingInput = {
    instrumentId: values.instrumentId,
    configurationId: values.configurationId,
    startsAt: start.instant.toISOString(),
    endsAt: end.instant.toISOString(),
    ...target,
    accountId: values.accountId ?? '',
    purpose: values.purpose ?? '',
    ...(rebookOf ? { rebookOf } : {}),
    ...(values.stationIds?.length ? { stationIds: [...values.stationIds] } : {}),
  };
  return { body, start, end, minutes };
}

/** Where the API's validation issue paths land in the form. */
export const serverFieldFor: Record<string, keyof RequestFormValues> = {
  instrumentId: 'instrumentId',
  configurationId: 'configurationId',
  targetNm: 'targetValue',
  minNm: 'targetValue',
  maxNm: 'targetToValue',
  startsAt: 'startTime',
  endsAt: 'endTime',
  accountId: 'accountId',
  purpose: 'purpose',
};
