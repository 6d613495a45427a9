import type { z } from 'zod';

/** The first message zod gives for each top-level field. */
export function fieldErrors(result: z.ZodSafeParseResult<unknown>): Record<string, string> {
  const errors: Record<string, string> = {};
  if (result.success) return errors;
  for (const issue of result.error.issues) {
    const field = String(issue.path[0] ?? '_');
    errors[field] ??= issue.message;
  }
  return errors;
}

/** A number typed in a field: blank is null (the "not set" of optional figures), anything else a number or NaN. */
export const numberOrNull = (raw: string): number | null => (raw.trim() === '' ? null : Number(raw));
export const asText = (value: number | null | undefined) => (value === null || value === undefined || Number.isNaN(value) ? '' : String(value));
