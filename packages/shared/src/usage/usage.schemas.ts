import { z } from 'zod';
import { isoInstantSchema } from '../time/iso-schemas';

const isoInstant = isoInstantSchema('Use an ISO 8601 instant with its offset');
const nm = z.number().positive('Wavelengths are positive').max(100_000);

import { pulseShapes } from '../metrology/autocorrelation';

export const usageSegmentInputSchema = z
  .object({
    configurationId: z.uuid(),
    startsAt: isoInstant,
    endsAt: isoInstant,
    minNm: nm,
    maxNm: nm,
    averagePowerMw: z.number().min(0).max(1_000_000).nullable().optional(),
    /** Typed by the user, or computed from an uploaded trace (then `traceAttachmentId` and `pulseShape` are set). */
    pulseFwhmFs: z.number().positive().max(1_000_000).nullable().optional(),
    pulseShape: z.enum(pulseShapes).nullable().optional(),
    /** Spectral FWHM (nm) measured with the pulse: the server then also refuses a pulse below the transform limit. */
    spectralFwhmNm: z.number().positive().max(100_000).nullable().optional(),
    traceAttachmentId: z.uuid().nullable().optional(),
    notes: z.string().trim().max(2000).optional(),
  })
  .refine((s) => s.minNm <= s.maxNm, { message: 'The range must run from short to long', path: ['maxNm'] })
  .refine((s) => Date.parse(s.endsAt) > Date.parse(s.startsAt), { message: 'A segment must end after it starts', path: ['endsAt'] });
export type UsageSegmentInput = z.infer<typeof usageSegmentInputSchema>;

/** POST /api/bookings/:id/usage — creates or replaces the booking's log while it is not billed. */
export const usageLogInputSchema = z
  .object({
    actualStartsAt: isoInstant,
    actualEndsAt: isoInstant,
    segments: z.array(usageSegmentInputSchema).min(1, 'Log at least one segment').max(20),
    notes: z.string().trim().max(4000).optional(),
    attachmentIds: z.array(z.uuid()).max(20).optional(),
  })
  .refine((v) => Date.parse(v.actualEndsAt) > Date.parse(v.actualStartsAt), { message: 'The session must end after it starts', path: ['actualEndsAt'] });
export type UsageLogInput = z.infer<typeof usageLogInputSchema>;

/** POST /api/usage/:id/confirm — staff confirm as logged, or with adjusted times (the change is audited). */
export const confirmUsageInputSchema = z
  .object({ actualStartsAt: isoInstant.optional(), actualEndsAt: isoInstant.optional(), note: z.string().trim().max(1000).optional() })
  .refine((v) => !v.actualStartsAt || !v.actualEndsAt || Date.parse(v.actualEndsAt) > Date.parse(v.actualStartsAt), { message: 'The session must end after it starts', path: ['actualEndsAt'] });

export const usageStatuses = ['submitted', 'confirmed', 'billed'] as const;

export interface AttachmentDto {
  id: string;
  originalName: string;
  contentType: string;
  sizeBytes: number;
  createdAt: string;
  url: string;
}

export interface UsageSegmentDto {
  id: string;
  configurationId: string;
  configurationKey: string;
  startsAt: string;
  endsAt: string;
  minNm: number;
  maxNm: number;
  averagePowerMw: number | null;
  pulseFwhmFs: number | null;
  pulseShape: 'gaussian' | 'sech2' | null;
  spectralFwhmNm: number | null;
  traceAttachmentId: string | null;
  notes: string;
}

export interface UsageLogDto {
  id: string;
  bookingId: string;
  status: (typeof usageStatuses)[number];
  actualStartsAt: string;
  actualEndsAt: string;
  /** Set when the logged times leave the booking by more than the facility's grace: staff should look. */
  outsideGrace: boolean;
  notes: string;
  segments: UsageSegmentDto[];
  attachments: AttachmentDto[];
  submittedBy: string;
  submittedAt: string;
  confirmedBy: string | null;
  confirmedAt: string | null;
  billedBy: string | null;
  billedAt: string | null;
}

export const reportGroupBy = ['week', 'month'] as const;
export const utilisationQuerySchema = z
  .object({ from: isoInstant, to: isoInstant, groupBy: z.enum(reportGroupBy).default('week'), instrumentId: z.uuid().optional() })
  .refine((q) => Date.parse(q.to) > Date.parse(q.from), { message: 'to must be after from', path: ['to'] })
  .refine((q) => Date.parse(q.to) - Date.parse(q.from) <= 400 * 86_400_000, { message: 'Ask for at most 400 days', path: ['to'] });

/** One row per instrument and period: hours booked, logged, in maintenance and lost to changeover. */
export interface UtilisationRowDto {
  period: string; // ISO date of the period's first day in the facility zone
  instrumentId: string;
  instrumentName: string;
  bookedHours: number;
  loggedHours: number;
  maintenanceHours: number;
  changeoverHours: number;
}

export interface HoursByDto {
  key: string;
  label: string;
  loggedHours: number;
}

export interface UtilisationReportDto {
  rows: UtilisationRowDto[];
  byConfiguration: HoursByDto[];
  byOrganisation: HoursByDto[];
}

/** Tuning coverage: each logged segment's range over time, per configuration, for a log-wavelength chart. */
export interface TuningCoverageDto {
  segments: { configurationKey: string; configurationName: string; startsAt: string; minNm: number; maxNm: number }[];
  /** Pump pulse FWHM with the shape it was deconvolved with; autocorrelationFwhmFs = pulse × the shape's factor (null when no shape was stated). */
  pulseTrend: { startsAt: string; pulseFwhmFs: number; configurationKey: string; pulseShape: 'gaussian' | 'sech2' | null; autocorrelationFwhmFs: number | null }[];
  /** The facility's pump pulse-duration specification (fs), drawn as a line. */
  pumpPulseSpecFs: number | null;
}
