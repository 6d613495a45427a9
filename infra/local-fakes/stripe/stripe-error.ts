import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';

export type StripeErrorType =
  | 'api_error'
  | 'card_error'
  | 'idempotency_error'
  | 'invalid_request_error';

export interface StripeErrorOptions {
  code?: string;
  param?: string;
  /**
   * Stripe saves an idempotent result only once the endpoint has begun executing; requests that fail
   * validation (bad or missing params, unknown ids) are not saved, so a corrected retry with the same key runs.
   */
  savedForIdempotency?: boolean;
}

export class StripeError extends Error {
  readonly code?: string;
  readonly param?: string;
  readonly savedForIdempotency: boolean;

  constructor(
    readonly status: number,
    readonly type: StripeErrorType,
    message: string,
    options: StripeErrorOptions = {},
  ) {
    super(message);
    this.code = options.code;
    this.param = options.param;
    this.savedForIdempotency = options.savedForIdempotency ?? true;
  }

  toBody(): { error: Record<string, string> } {
    const error: Record<string, string> = { type: this.type, message: this.message };
    if (this.code) error.code = this.code;
    if (this.param) error.param = this.param;
    return { error };
  }
}

export function invalidRequest(message: string, options: StripeErrorOptions = {}): StripeError {
  return new StripeError(400, 'invalid_request_error', message, options);
}

export function parameterMissing(param: string): StripeError {
  return invalidRequest(`Missing required param: ${param}.`, {
    code: 'parameter_missing',
    param,
    savedForIdempotency: false,
  });
}

export function resourceMissing(kind: string, id: string, param = 'id'): StripeError {
  return new StripeError(404, 'invalid_request_error', `No such ${kind}: '${id}'`, {
    code: 'resource_missing',
    param,
    savedForIdempotency: false,
  });
}

/** `metadata.period` → `metadata[period]`, the way Stripe names nested params in errors. */
export function bracketPath(path: ReadonlyArray<PropertyKey>): string {
  const [head, ...rest] = path.map(String);
  return (head ?? '') + rest.map((part) => `[${part}]`).join('');
}

export function fromZodError(error: ZodError, input: unknown): StripeError {
  const issue = error.issues[0];
  if (!issue) return invalidRequest('Invalid request.', { savedForIdempotency: false });
  if (issue.code === 'unrecognized_keys') {
    const param = bracketPath([...issue.path, issue.keys[0] ?? '']);
    return invalidRequest(`Received unknown parameter: ${param}`, {
      code: 'parameter_unknown',
      param,
      savedForIdempotency: false,
    });
  }
  const param = bracketPath(issue.path);
  if (valueAt(input, issue.path) === undefined) return parameterMissing(param);
  const code = issue.message.startsWith('Invalid integer')
    ? 'parameter_invalid_integer'
    : issue.message.startsWith('Invalid boolean')
      ? 'parameter_invalid_boolean'
      : undefined;
  return invalidRequest(`Invalid ${param}: ${issue.message}`, { code, param, savedForIdempotency: false });
}

function valueAt(input: unknown, path: ReadonlyArray<PropertyKey>): unknown {
  let current: unknown = input;
  for (const key of path) {
    if (current === null || typeof current !== 'object') return undefined;
    current = (current as Record<PropertyKey, unknown>)[key];
  }
  return current;
}

export function toStripeError(error: unknown, input: unknown): StripeError {
  if (error instanceof StripeError) return error;
  if (error instanceof ZodError) return fromZodError(error, input);
  const bodyError = error as { type?: string; status?: number };
  if (bodyError.type === 'entity.parse.failed' || bodyError.status === 400) {
    return invalidRequest('Invalid request body: send application/x-www-form-urlencoded parameters.', {
      savedForIdempotency: false,
    });
  }
  console.error('stripe fake: unexpected error', error);
  return new StripeError(500, 'api_error', 'An unexpected error occurred in the local Stripe fake.');
}

export const stripeErrorHandler: ErrorRequestHandler = (error, req, res, _next) => {
  const stripeError = toStripeError(error, req.body);
  res.locals.savedForIdempotency = stripeError.savedForIdempotency;
  res.status(stripeError.status).json(stripeError.toBody());
};
