import { z } from 'zod';
import { organisationKindSchema } from '../auth/auth.schemas';
import { calendarDateSchema, calendarMonthSchema } from '../time/iso-schemas';

const isoDate = calendarDateSchema;
const minorAmount = z.number().int().min(0).max(100_000_000);
const classRates = z.strictObject({ standard: minorAmount, dfg: minorAmount });

export const rateTableSchema = z.strictObject({ internal: classRates, external_academic: classRates, industry: classRates });
export type RateTable = z.infer<typeof rateTableSchema>;

export const rateCardInputSchema = z.strictObject({
  name: z.string().trim().min(1).max(120),
  effectiveFrom: isoDate,
  effectiveTo: isoDate.nullish(),
  currency: z.string().regex(/^[A-Z]{3}$/, 'Use an ISO 4217 code such as USD'),
  billingIncrementMinutes: z.number().int().min(1).max(240).default(15),
  changeoverSharePercent: z.number().int().min(0).max(100).default(0),
  minimumChargeMinutes: z.number().int().min(0).max(720).default(0),
  rates: rateTableSchema,
}).refine((c) => !c.effectiveTo || c.effectiveTo > c.effectiveFrom, { message: 'effectiveTo must be after effectiveFrom', path: ['effectiveTo'] });
export type RateCardInput = z.input<typeof rateCardInputSchema>;

export const ratePreviewInputSchema = z.strictObject({ bookingId: z.uuid() });

export const billingPeriodInputSchema = z.strictObject({
  month: calendarMonthSchema,
});
export type BillingPeriodInput = z.infer<typeof billingPeriodInputSchema>;

/** Closing a period that leaves sessions out needs their count echoed back, so nobody closes past a list they have not seen. */
export const billingCloseInputSchema = z.strictObject({
  leftOutCount: z.number().int().min(0).max(100_000).optional(),
});
export type BillingCloseInput = z.infer<typeof billingCloseInputSchema>;

/** Cost-centre codes: "CC-", four digits, "-", three digits (facility finance's format). */
export const costCentreCodeSchema = z.string().trim().regex(/^CC-\d{4}-\d{3}$/, 'Use a cost centre code like CC-1234-567');

const accountCommon = {
  name: z.string().trim().min(1).max(120),
  organisationId: z.uuid().optional(),
};
export const createAccountInputSchema = z.discriminatedUnion('kind', [
  z.strictObject({ ...accountCommon, kind: z.literal('cost_centre'), costCentreCode: costCentreCodeSchema }),
  z.strictObject({
    ...accountCommon,
    kind: z.literal('external'),
    billingContactEmail: z.string().trim().toLowerCase().pipe(z.email({ message: 'Enter a valid billing contact e-mail' })),
    taxId: z.string().trim().min(2).max(40).optional(),
    poNumber: z.string().trim().min(1).max(60),
    poExpiresOn: isoDate.optional(),
  }),
]);
export type CreateAccountInput = z.infer<typeof createAccountInputSchema>;

export const priceLineKinds = ['usage', 'changeover', 'cancellation_fee', 'displacement'] as const;
export const priceLineSchema = z.object({
  key: z.string(),
  kind: z.enum(priceLineKinds),
  bookingId: z.uuid(),
  usageLogId: z.uuid().nullable(),
  label: z.string(),
  explanation: z.string(),
  minutes: z.number().int(),
  rateMinorPerHour: z.number().int(),
  amountMinor: z.number().int(),
  category: organisationKindSchema,
  rateClass: z.enum(['standard', 'dfg']),
});
export type PriceLine = z.infer<typeof priceLineSchema>;

/** One account's lines for a billing period, as the preview and the close job see them. */
export interface AccountStatement {
  accountId: string;
  accountName: string;
  accountKind: 'cost_centre' | 'external';
  organisationId: string;
  organisationName: string;
  costCentreCode: string | null;
  /** Shown on the preview when the API sends it. */
  poNumber?: string | null;
  currency: string;
  lines: PriceLine[];
  totalMinor: number;
}

/** Why a booking of the month is not on its statement. */
export type LeftOutReason = 'unlogged' | 'log_not_confirmed' | 'not_approved';

/** A booking in the month that the statement does not bill, and why (instants as ISO 8601 strings). */
export interface LeftOutSession {
  bookingId: string;
  reason: LeftOutReason;
  bookingStatus: string;
  usageLogId: string | null;
  startsAt: string;
  endsAt: string;
  instrumentName: string;
  configurationName: string | null;
  userId: string | null;
  userName: string | null;
  userEmail: string | null;
  accountId: string | null;
  accountName: string | null;
  organisationName: string | null;
}
