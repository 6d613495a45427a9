import { type OrganisationKind, type RateCardInput, type RateClass, rateCardInputSchema } from '@femtoslot/shared';
import { z } from 'zod';
import { minorToDecimalString, minorUnitExponent, parseMajorToMinor } from '../../../lib/money';
import type { RateCard } from '../api/get-rate-cards';

export const categories: readonly OrganisationKind[] = ['internal', 'external_academic', 'industry'];
export const rateClassesShown: readonly RateClass[] = ['standard', 'dfg'];
export const categoryLabels: Record<OrganisationKind, string> = { internal: 'Internal', external_academic: 'External academic', industry: 'Industry' };
export const rateClassLabels: Record<RateClass, string> = { standard: 'Standard', dfg: 'DFG mid-IR' };

type RateTexts = Record<OrganisationKind, Record<RateClass, string>>;

/** What the form holds: every number as typed text; amounts in major units per hour. */
export interface RateCardFormValues {
  name: string;
  effectiveFrom: string;
  effectiveTo: string;
  billingIncrementMinutes: string;
  changeoverSharePercent: string;
  minimumChargeMinutes: string;
  rates: RateTexts;
}

const wholeNumber = /^\s*\d+\s*$/;

/** Form text → RateCardInput, then the shared rateCardInputSchema; its issue paths match the form's field names. */
export function rateCardFormSchema(currency: string) {
  const exponent = minorUnitExponent(currency);
  const money = z.string().superRefine((text, ctx) => {
    const parsed = parseMajorToMinor(text, exponent);
    if (!parsed.ok) ctx.addIssue({ code: 'custom', message: parsed.message });
  });
  const integer = (what: string) => z.string().regex(wholeNumber, `Type ${what} as a whole number`);
  const row = z.object({ standard: money, dfg: money });
  return z
    .object({
      name: z.string(),
      effectiveFrom: z.string(),
      effectiveTo: z.string(),
      billingIncrementMinutes: integer('the increment'),
      changeoverSharePercent: integer('the share'),
      minimumChargeMinutes: integer('the minimum charge'),
      rates: z.object({ internal: row, external_academic: row, industry: row }),
    })
    .transform((values): RateCardInput => toRateCardInput(values, currency))
    .pipe(rateCardInputSchema);
}

const minor = (text: string, exponent: number) => {
  const parsed = parseMajorToMinor(text, exponent);
  return parsed.ok ? parsed.minor : Number.NaN;
};

export function toRateCardInput(values: RateCardFormValues, currency: string): RateCardInput {
  const exponent = minorUnitExponent(currency);
  const rates = Object.fromEntries(
    categories.map((c) => [c, { standard: minor(values.rates[c].standard, exponent), dfg: minor(values.rates[c].dfg, exponent) }]),
  ) as RateCardInput['rates'];
  return {
    name: values.name.trim(),
    effectiveFrom: values.effectiveFrom,
    effectiveTo: values.effectiveTo.trim() ? values.effectiveTo : null,
    currency,
    billingIncrementMinutes: Number(values.billingIncrementMinutes),
    changeoverSharePercent: Number(values.changeoverSharePercent),
    minimumChargeMinutes: Number(values.minimumChargeMinutes),
    rates,
  };
}

/** Starts from the newest card (or blank), so a new card is usually a few edits of the last one. */
export function rateCardFormDefaults(latest: RateCard | undefined, currency: string, effectiveFrom: string): RateCardFormValues {
  const text = (c: OrganisationKind, k: RateClass) => (latest ? minorToDecimalString(latest.rates[c][k], currency) : '');
  const rates = Object.fromEntries(categories.map((c) => [c, { standard: text(c, 'standard'), dfg: text(c, 'dfg') }])) as RateTexts;
  return {
    name: '',
    effectiveFrom,
    effectiveTo: '',
    billingIncrementMinutes: String(latest?.billingIncrementMinutes ?? 15),
    changeoverSharePercent: String(latest?.changeoverSharePercent ?? 0),
    minimumChargeMinutes: String(latest?.minimumChargeMinutes ?? 0),
    rates,
  };
}
