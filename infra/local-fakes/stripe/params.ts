import { z } from 'zod';
import { invalidRequest } from './stripe-error';
import type { Metadata } from './store';

// Form bodies carry every value as a string (Stripe API reference: "Request encoding"), so each
// typed parameter is a string schema that validates and converts.

export const integerParam = z
  .string()
  .regex(/^-?\d+$/, 'Invalid integer')
  .transform(Number)
  .refine(Number.isSafeInteger, 'Invalid integer');

export const nonNegativeIntegerParam = integerParam.refine((value) => value >= 0, 'Must be at least 0');

export const booleanParam = z.enum(['true', 'false'], { error: 'Invalid boolean' }).transform((v) => v === 'true');

export const currencyParam = z
  .string()
  .regex(/^[a-zA-Z]{3}$/, 'Must be a three-letter ISO 4217 currency code')
  .transform((v) => v.toLowerCase());

/** Up to 12 decimal places, as the reference describes `unit_amount_decimal`. */
export const decimalParam = z.string().regex(/^\d+(\.\d{1,12})?$/, 'Must be a decimal with at most 12 places');

export const idParam = z.string().min(1, 'Must not be empty');

// Stripe metadata limits (API reference, "Metadata"): 50 keys, key ≤ 40 chars, value ≤ 500 chars.
// An empty string unsets: the whole object for `metadata=`, or one key for `metadata[key]=`.
export const metadataParam = z.union([
  z.literal(''),
  z
    .record(z.string().max(40, 'Metadata keys can be at most 40 characters'), z.string().max(500, 'Metadata values can be at most 500 characters'))
    .refine((value) => Object.keys(value).length <= 50, 'Metadata can have at most 50 keys'),
]);

export const expandParam = z.unknown();

export function mergeMetadata(current: Metadata, update: z.infer<typeof metadataParam> | undefined): Metadata {
  if (update === undefined) return current;
  if (update === '') return {};
  const merged = { ...current };
  for (const [key, value] of Object.entries(update)) {
    if (value === '') delete merged[key];
    else merged[key] = value;
  }
  if (Object.keys(merged).length > 50) {
    throw invalidRequest('Metadata can have at most 50 keys.', { param: 'metadata', savedForIdempotency: false });
  }
  return merged;
}

export const listParams = {
  limit: integerParam.refine((v) => v >= 1 && v <= 100, 'Must be between 1 and 100').optional(),
  starting_after: idParam.optional(),
  ending_before: idParam.optional(),
  expand: expandParam.optional(),
};

export function parseParams<T extends z.ZodType>(schema: T, input: unknown): z.output<T> {
  return schema.parse(input ?? {});
}
