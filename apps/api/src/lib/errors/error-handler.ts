import type { ErrorRequestHandler, RequestHandler } from 'express';
import { QueryFailedError } from 'typeorm';
import { ZodError } from 'zod';
import { isEngineError } from '@femtoslot/shared';
import { AppError } from './app-error';

function fromDatabase(err: QueryFailedError): AppError | null {
  const code = (err as unknown as { driverError?: { code?: string; constraint?: string } }).driverError;
  if (code?.code === '23P01') {
    return new AppError('overlap', 'That time overlaps another booking or a maintenance window on this instrument', 409, {
      constraint: code.constraint,
    });
  }
  if (code?.code === '23505') return new AppError('conflict', 'That record already exists', 409, { constraint: code.constraint });
  if (code?.code === '23514') return new AppError('rule_violation', 'The values break a rule of the data model', 422, { constraint: code.constraint });
  return null;
}

const UNREACHABLE = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', '57P01', '57P02', '57P03', '08000', '08003', '08006']);

/** The database is down or restarting: clients and load balancers should retry, not report a bug. */
function isDatabaseUnavailable(err: unknown): boolean {
  const e = err as { code?: string; driverError?: { code?: string }; message?: string } | null;
  const code = e?.driverError?.code ?? e?.code;
  if (code && UNREACHABLE.has(code)) return true;
  return /Connection terminated|timeout exceeded when trying to connect|connect ECONNREFUSED/i.test(String(e?.message ?? ''));
}

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let appError: AppError | null = null;
  if (err instanceof AppError) appError = err;
  else if (isEngineError(err)) appError = new AppError(err.code, err.message, 422, err.details);
  else if (err instanceof ZodError) {
    appError = new AppError('validation_failed', 'Some fields are missing or invalid', 400, err.issues.map((i) => ({ path: i.path, message: i.message, code: i.code })));
  } else if (err instanceof QueryFailedError) appError = fromDatabase(err);
  else if (err?.type === 'entity.parse.failed') appError = new AppError('invalid_json', 'The request body is not valid JSON', 400);
  else if (err?.type === 'entity.too.large') appError = new AppError('payload_too_large', 'The request body is too large', 413);
  else if (isDatabaseUnavailable(err)) appError = new AppError('database_unavailable', 'The database is unavailable for a moment; try again shortly', 503);
  else if (err?.name === 'MulterError') appError = new AppError(err.code === 'LIMIT_FILE_SIZE' ? 'payload_too_large' : 'bad_upload', err.code === 'LIMIT_FILE_SIZE' ? 'The file is too large' : `The upload was refused: ${err.message}`, err.code === 'LIMIT_FILE_SIZE' ? 413 : 400);

  if (!appError) {
    req.log?.error({ err }, 'unhandled error');
    res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on our side' } });
    return;
  }
  res.status(appError.status).json({
    error: { code: appError.code, message: appError.message, ...(appError.details !== undefined ? { details: appError.details } : {}) },
  });
};

export const notFoundHandler: RequestHandler = (req, res) => {
  res.status(404).json({ error: { code: 'not_found', message: `No route for ${req.method} ${req.path}` } });
};
