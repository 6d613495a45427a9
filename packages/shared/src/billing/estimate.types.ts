import type { PriceLine } from './billing.schemas';

/** One cancellation window of an estimate, with what cancelling in it would cost. */
export interface EstimateCancellationWindow {
  percent: 0 | 50 | 100;
  /** null: from the moment of booking */
  from: string | null;
  until: string;
  /** wall time in the facility zone, "2026-12-07 09:00" */
  fromLocal: string | null;
  untilLocal: string;
  amountMinor: number;
  explanation: string;
}

/** POST /api/bookings/estimate: what a booking would cost, priced by the engine that prices the invoice. */
export interface BookingEstimateDto {
  quoteNumber: string;
  /** facility-local date the quote was made, and the last date it is valid */
  issuedOn: string;
  validUntil: string;
  facilityName: string;
  timeZone: string;
  currency: string;
  account: { id: string; name: string; kind: 'cost_centre' | 'external'; poNumber: string | null; organisationName: string; category: string };
  instrument: { id: string; name: string };
  configuration: { id: string; name: string; rateClass: 'standard' | 'dfg' };
  wavelength: string;
  startsAt: string;
  endsAt: string;
  startsAtLocal: string;
  endsAtLocal: string;
  rateCard: { id: string; name: string; effectiveFrom: string; billingIncrementMinutes: number; minimumChargeMinutes: number; changeoverSharePercent: number };
  /** changeover the source needs before this booking, from the approved booking before it (charged only at the card's share) */
  changeoverMinutes: number;
  lines: PriceLine[];
  totalMinor: number;
  cancellation: { description: string; windows: EstimateCancellationWindow[] };
}
