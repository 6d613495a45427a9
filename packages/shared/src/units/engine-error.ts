import type { z } from 'zod';

export const engineErrorCodes = [
  'invalid_input',
  'invalid_wavelengths',
  'degenerate',
  'invalid_interval',
  'too_few_points',
  'non_numeric',
  'no_peak',
  'peak_at_edge',
  'wrong_columns',
  'malformed_csv',
  'too_many_points',
  'line_too_long',
  'below_optical_cycle',
  'below_transform_limit',
] as const;
export type EngineErrorCode = (typeof engineErrorCodes)[number];

/**
 * The one error type of the pure engine. Every code means "the input cannot be computed on",
 * so the API maps all of them to 422.
 */
export class EngineError extends Error {
  readonly code: EngineErrorCode;
  readonly details: Record<string, unknown>;

  constructor(code: EngineErrorCode, message: string, details: Record<string, unknown> = {}) {
    super(message);
    this.name = 'EngineError';
    this.code = code;
    this.details = details;
  }
}

export function isEngineError(value: unknown): value is EngineError {
  return value instanceof EngineError;
}

/** Parses with a zod schema; a failure becomes an EngineError carrying the zod issues. */
export function parseEngineInput<S extends z.ZodType>(
  schema: S,
  value: unknown,
  code: EngineErrorCode = 'invalid_input',
): z.output<S> {
  const result = schema.safeParse(value);
  if (!result.success) {
    const first = result.error.issues[0];
    const where = first && first.path.length > 0 ? ` at ${first.path.join('.')}` : '';
    throw new EngineError(code, `${first?.message ?? 'Invalid input'}${where}`, {
      issues: result.error.issues.map((i) => ({ path: i.path, message: i.message })),
    });
  }
  return result.data;
}
