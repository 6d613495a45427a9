import { z } from 'zod';
import type { BookingDto } from '../bookings/booking.schemas';

/** `GET /api/groups/spend?organisationId=&from=YYYY-MM`: from a facility-local month on, or since the start. */
export const groupSpendQuerySchema = z.strictObject({
  organisationId: z.uuid().optional(),
  from: z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, 'Use a month as YYYY-MM').optional(),
});
export type GroupSpendQuery = z.infer<typeof groupSpendQuerySchema>;

/** `GET /api/me/beam-time?limit=`: the caller's own bookings that have not ended yet, soonest first. */
export const myBeamTimeQuerySchema = z.strictObject({
  limit: z.coerce.number().int().min(1).max(200).default(100),
});

export interface SpendAmounts {
  /** On invoices and journals already issued (void ones left out). */
  billedMinor: number;
  /** Confirmed session logs and cancellation fees not invoiced yet, priced by the billing engine as a close would. */
  unbilledMinor: number;
  totalMinor: number;
  billedFormatted: string;
  unbilledFormatted: string;
  totalFormatted: string;
}

export interface SpendLineDto {
  key: string;
  bookingId: string;
  accountName: string;
  label: string;
  explanation: string;
  amountMinor: number;
  amountFormatted: string;
}

export interface GroupSpendDto extends SpendAmounts {
  /** 'organisation': every account of the group; 'own': only the caller's own bookings (members, collaborators). */
  scope: 'organisation' | 'own';
  organisation: { id: string; name: string };
  currency: string;
  from: string | null;
  accounts: ({ accountId: string; accountName: string } & SpendAmounts)[];
  unbilledLines: SpendLineDto[];
}

export interface MyBeamTimeDto {
  /** Upcoming and running bookings of the caller, soonest first, every status. */
  bookings: (BookingDto & { instrumentName: string; configurationName: string })[];
}
