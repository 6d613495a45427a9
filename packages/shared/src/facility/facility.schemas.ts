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

/** Booking and cancellation rules a facility sets (PRODUCT.md §4 defaults in the demo seed). */
export interface FacilityPolicies {
  minBookingHours: number;
  maxBookingHours: number;
  horizonDays: number;
  externalLeadHours: number;
  cancellationFreeHours: number;
  cancellationHalfFeeHours: number;
  /** Minutes a logged start or end may differ from the booking before staff are asked to look (default 30). */
  usageGraceMinutes?: number;
  /** The pump's pulse-duration specification in fs, drawn on the pulse trend (none when unset). */
  pumpPulseSpecFs?: number | null;
  /** Days before a training record or sign-off expires that its holder is reminded by e-mail (default 30). */
  trainingReminderDays?: number;
  /** Staffed hours in the facility zone, preferred for slots offered to displaced bookings (default 08:00–18:00, Mon–Fri). */
  workingHours?: { start: string; end: string; weekdays: number[] };
}

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
