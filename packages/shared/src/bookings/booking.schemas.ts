import { z } from 'zod';
import { isoInstantSchema } from '../time/iso-schemas';

const isoInstant = isoInstantSchema();
const uuid = z.uuid({ message: 'Must be an id' });
const nm = z.number().positive('Wavelengths are positive').max(100_000, 'Wavelength is implausibly long');

export const bookingTargetSchema = z.union([
  z.object({ targetNm: nm }),
  z.object({ minNm: nm, maxNm: nm }).refine((r) => r.minNm <= r.maxNm, { message: 'The range must run from short to long', path: ['maxNm'] }),
]);
export type BookingTarget = z.infer<typeof bookingTargetSchema>;

const bookingBase = z.object({
  instrumentId: uuid,
  configurationId: uuid,
  startsAt: isoInstant,
  endsAt: isoInstant,
  targetNm: nm.optional(),
  minNm: nm.optional(),
  maxNm: nm.optional(),
  accountId: uuid,
  purpose: z.string().trim().min(3, 'Say in a few words what the beam time is for').max(500),
  /** The displaced booking this request replaces, when rebooking from the offered alternatives. */
  rebookOf: uuid.optional(),
  /** End stations (benches) fed by the chosen configuration, booked for the same interval. */
  stationIds: z.array(uuid).max(8, 'At most 8 end stations').optional(),
});

function targetOf(v: { targetNm?: number; minNm?: number; maxNm?: number }): BookingTarget | null {
  if (v.targetNm !== undefined && v.minNm === undefined && v.maxNm === undefined) return { targetNm: v.targetNm };
  if (v.targetNm === undefined && v.minNm !== undefined && v.maxNm !== undefined) return { minNm: v.minNm, maxNm: v.maxNm };
  return null;
}

/** `{instrumentId, configurationId, startsAt, endsAt, targetNm | {minNm, maxNm}, accountId, purpose}`. */
function checkRequestShape(v: { targetNm?: number; minNm?: number; maxNm?: number; startsAt: string; endsAt: string; stationIds?: string[] }, ctx: z.RefinementCtx): void {
  if (!targetOf(v)) ctx.addIssue({ code: 'custom', path: ['targetNm'], message: 'Give either a target wavelength or a range (minNm and maxNm)' });
  if (v.minNm !== undefined && v.maxNm !== undefined && v.minNm > v.maxNm) ctx.addIssue({ code: 'custom', path: ['maxNm'], message: 'The range must run from short to long' });
  if (Date.parse(v.endsAt) <= Date.parse(v.startsAt)) ctx.addIssue({ code: 'custom', path: ['endsAt'], message: 'The end must be after the start' });
  if (v.stationIds && new Set(v.stationIds).size !== v.stationIds.length) ctx.addIssue({ code: 'custom', path: ['stationIds'], message: 'Each end station once' });
}

export const createBookingInputSchema = bookingBase
  .superRefine(checkRequestShape)
  .transform((v) => ({ ...v, target: targetOf(v)! }));
export type CreateBookingInput = z.input<typeof createBookingInputSchema>;
export type CreateBooking = z.output<typeof createBookingInputSchema>;

export const moveBookingInputSchema = z
  .object({ startsAt: isoInstant, endsAt: isoInstant, note: z.string().trim().max(500).optional() })
  .refine((v) => Date.parse(v.endsAt) > Date.parse(v.startsAt), { message: 'The end must be after the start', path: ['endsAt'] });
export type MoveBookingInput = z.infer<typeof moveBookingInputSchema>;

export const declineBookingInputSchema = z.object({ reason: z.string().trim().min(3, 'Give the requester a reason').max(500) });
export const cancelBookingInputSchema = z.object({ reason: z.string().trim().max(500).optional() });

export const bookingListQuerySchema = z
  .object({ from: isoInstant, to: isoInstant, instrumentId: uuid.optional() })
  .refine((q) => Date.parse(q.to) > Date.parse(q.from), { message: 'to must be after from', path: ['to'] })
  .refine((q) => Date.parse(q.to) - Date.parse(q.from) <= 100 * 86_400_000, { message: 'Ask for at most 100 days at a time', path: ['to'] });

export const maintenanceInputSchema = z
  .object({ instrumentId: uuid, startsAt: isoInstant, endsAt: isoInstant, reason: z.string().trim().min(3, 'Say what the maintenance is').max(500) })
  .refine((v) => Date.parse(v.endsAt) > Date.parse(v.startsAt), { message: 'The end must be after the start', path: ['endsAt'] });
export type MaintenanceInput = z.infer<typeof maintenanceInputSchema>;
export const updateMaintenanceInputSchema = z
  .object({ startsAt: isoInstant, endsAt: isoInstant, reason: z.string().trim().min(3).max(500).optional() })
  .refine((v) => Date.parse(v.endsAt) > Date.parse(v.startsAt), { message: 'The end must be after the start', path: ['endsAt'] });

export const bookingStatuses = ['requested', 'approved', 'declined', 'completed', 'cancelled', 'displaced'] as const;
export type BookingStatusName = (typeof bookingStatuses)[number];

export interface SlotDto {
  startsAt: string;
  endsAt: string;
}

/** A booking as the calendar sees it. `detail` is null when the viewer may only see busy/free. */
export interface BookingDto {
  id: string;
  instrumentId: string;
  configurationId: string;
  configurationKey: string;
  outputKind: string;
  status: BookingStatusName;
  startsAt: string;
  endsAt: string;
  own: boolean;
  /** The end stations (bench instrument ids) booked with it; busy/free like the booking itself. Always sent by the API. */
  stationIds?: string[];
  detail: null | {
    userId: string;
    userName: string;
    organisationId: string;
    organisationName: string;
    accountId: string;
    accountName: string;
    purpose: string;
    targetMinNm: number;
    targetMaxNm: number;
    declineReason: string | null;
    cancellationFeePercent: number | null;
    /** Alternatives offered after a displacement (earliest first). */
    alternatives: SlotDto[];
    rebookedAs: string | null;
    changeoverBeforeMinutes: number | null;
  };
}

export interface MaintenanceDto {
  id: string;
  instrumentId: string;
  startsAt: string;
  endsAt: string;
  reason: string;
  status: 'scheduled' | 'cancelled';
}

/** A thin band after a block: the changeover the next block needs. */
export interface ChangeoverBandDto {
  instrumentId: string;
  afterId: string;
  beforeId: string;
  startsAt: string;
  endsAt: string;
  minutes: number;
  availableMinutes: number;
}

export interface CalendarDto {
  bookings: BookingDto[];
  maintenance: MaintenanceDto[];
  changeovers: ChangeoverBandDto[];
}

export interface NeighbourCheckDto {
  neighbourId: string;
  neededMinutes: number;
  availableMinutes: number;
  shortfallMinutes: number;
}

/** What POST /api/bookings/check answers for the request form, without writing anything. */
export interface BookingCheckDto {
  ok: boolean;
  problems: { code: string; message: string; details?: unknown }[];
  derived: Record<string, { minNm: number; maxNm: number }>;
  onTable: { role: string; minNm: number; maxNm: number }[];
  /** Per wavelength on the table: the OD the laser-safety officer requires there (null: none set) and the eyewear rated for it. */
  odByWavelength: { role: string; minNm: number; maxNm: number; requiredOd: number | null; eyewear: { id: string; label: string }[] }[];
  /** The eyewear rated for every wavelength on the table. */
  eyewear: { id: string; label: string }[];
  timeline: {
    before: NeighbourCheckDto | null; after: NeighbourCheckDto | null; overlaps: string[]; earliestStart: string | null;
    /** whether one of the overlapped blocks is a maintenance window */
    overlapsMaintenance?: boolean;
  };
  status: 'requested' | 'approved';
  cancellationPolicy: string;
}

/** A booking request priced before it is sent (POST /api/bookings/estimate): the same body, the purpose not needed yet. */
export const bookingEstimateInputSchema = bookingBase
  .extend({ purpose: z.string().trim().max(500).optional() })
  .superRefine(checkRequestShape)
  .transform((v) => ({ ...v, target: targetOf(v)! }));
export type BookingEstimateInput = z.input<typeof bookingEstimateInputSchema>;
export type BookingEstimateRequest = z.output<typeof bookingEstimateInputSchema>;
