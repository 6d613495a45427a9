import { z } from 'zod';
import { type OutputKind, outputKinds } from './output-kinds';

export { type OutputKind, outputKinds };
export const outputKindSchema = z.enum(outputKinds);

export const rateClasses = ['standard', 'dfg'] as const;
export const rateClassSchema = z.enum(rateClasses);
export type RateClass = z.infer<typeof rateClassSchema>;

export const instrumentKinds = ['source', 'bench'] as const;

export const facilitySchema = z.object({
  name: z.string(),
  timeZone: z.string(),
  currency: z.string().length(3),
});
export type Facility = z.infer<typeof facilitySchema>;

export const eyewearBandSchema = z
  .object({ minNm: z.number().positive(), maxNm: z.number().positive(), od: z.number().min(0).max(12) })
  .refine((b) => b.minNm < b.maxNm, { message: 'minNm must be below maxNm' });
export type EyewearBand = z.infer<typeof eyewearBandSchema>;

/**
 * The OD the laser-safety officer requires over a wavelength band for one configuration. Bands may overlap: at a
 * wavelength the highest OD of the bands covering it applies.
 */
export const requiredOdBandSchema = eyewearBandSchema;
export type RequiredOdBand = EyewearBand;
export const requiredOdBandsSchema = z
  .array(requiredOdBandSchema)
  .min(1, 'Give at least one wavelength band with its required OD')
  .max(20, 'At most 20 bands');

const wholeHours = (max: number) => z.number().int('Whole hours').min(0).max(max);
const clock = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'A time as HH:MM (24-hour clock)');

/**
 * Booking and cancellation rules a facility sets (the demo seed has the usual defaults). The bounds are sanity limits,
 * not advice (common practice, chosen here): a booking lasts between half an hour (shorter than a changeover plus a
 * pulse check is not useful beam time) and 24 hours (one facility day; longer runs are split so the source is checked
 * daily); the horizon is at most a year and every notice period at most 30 days (720 h).
 */
const policyShape = {
  minBookingHours: z.number().multipleOf(0.5, 'Half-hour steps').min(0.5).max(12),
  maxBookingHours: z.number().multipleOf(0.5, 'Half-hour steps').min(1).max(24),
  horizonDays: z.number().int('Whole days').min(1).max(365),
  externalLeadHours: wholeHours(720),
  cancellationFreeHours: wholeHours(720),
  cancellationHalfFeeHours: wholeHours(720),
  /** Minutes a logged start or end may differ from the booking before staff are asked to look (default 30). */
  usageGraceMinutes: z.number().int('Whole minutes').min(0).max(240).optional(),
  /** The pump's pulse-duration specification in fs, drawn on the pulse trend (none when unset). */
  pumpPulseSpecFs: z.number().positive().max(10_000).nullable().optional(),
  /** Days before a training record or sign-off expires that its holder is reminded by e-mail (default 30). */
  trainingReminderDays: z.number().int('Whole days').min(1).max(365).optional(),
  /** Days an external invoice is due after it is sent (default 30). */
  invoiceDaysUntilDue: z.number().int('Whole days').min(0).max(365).optional(),
  /** Staffed hours in the facility zone, preferred for slots offered to displaced bookings (default 08:00–18:00, Mon–Fri). */
  workingHours: z
    .strictObject({
      start: clock,
      end: clock,
      weekdays: z
        .array(z.number().int().min(0, '0 is Sunday').max(6, '6 is Saturday'))
        .min(1, 'Pick at least one weekday')
        .max(7)
        .refine((d) => new Set(d).size === d.length, 'Each weekday once'),
    })
    .refine((w) => w.start < w.end, { message: 'Working hours must start before they end', path: ['end'] })
    .optional(),
};

/** Minutes actual session times may lie before the booking's start and after its end (default 60, at most a day). */
export const usageWindowMinutesSchema = z.number().int('Whole minutes').min(0).max(1440);

/** Rules across fields, each reported at the field a person would change. */
function checkPolicies(p: { minBookingHours: number; maxBookingHours: number; cancellationFreeHours: number; cancellationHalfFeeHours: number }, ctx: z.RefinementCtx) {
  if (p.minBookingHours > p.maxBookingHours) ctx.addIssue({ code: 'custom', path: ['maxBookingHours'], message: 'The longest booking cannot be shorter than the shortest' });
  if (p.cancellationFreeHours < p.cancellationHalfFeeHours) ctx.addIssue({ code: 'custom', path: ['cancellationFreeHours'], message: 'Free cancellation must end no later than the half-fee window starts (free hours ≥ half-fee hours)' });
}

export const facilityPoliciesSchema = z.object(policyShape).superRefine(checkPolicies);
export type FacilityPolicies = z.infer<typeof facilityPoliciesSchema>;

/** The whole editable set (policies plus the session-log window), as the Settings form holds it. */
export const facilityPolicySettingsSchema = z.object({ ...policyShape, usageWindowMinutes: usageWindowMinutesSchema }).superRefine(checkPolicies);
export type FacilityPolicySettings = z.infer<typeof facilityPolicySettingsSchema>;

/** PATCH /api/facility/policies: any subset; unknown keys are refused. The merged result is checked again as a whole. */
export const facilityPoliciesPatchSchema = z.strictObject({ ...policyShape, usageWindowMinutes: usageWindowMinutesSchema }).partial();
export type FacilityPoliciesPatch = z.infer<typeof facilityPoliciesPatchSchema>;

/** A configuration as GET /api/configurations answers it. */
export interface ConfigurationDto {
  id: string;
  instrumentId: string;
  key: string;
  name: string;
  outputKind: OutputKind;
  minNm: number;
  maxNm: number;
  defaultNm: number;
  rateClass: RateClass;
  /** Required OD per wavelength band, set by the laser-safety officer. */
  requiredOdBands: RequiredOdBand[];
  retuneMinutesPerNm: number | null;
  active: boolean;
}
