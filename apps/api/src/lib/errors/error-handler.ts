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

/** body-parser's error types (http-errors with a 4xx status), each with the answer the client gets. */
const BODY_ERRORS: Record<string, [code: string, message: string]> = {
  'charset.unsupported': ['unsupported_charset', 'The request body must be UTF-8 (Content-Type: application/json; charset=utf-8)'],
  'encoding.unsupported': ['unsupported_encoding', 'The request body\'s Content-Encoding is not supported: send it as identity, gzip, deflate or br'],
  'entity.parse.failed': ['invalid_json', 'The request body is not valid JSON'],
  'entity.too.large': ['payload_too_large', 'The request body is too large'],
  'request.aborted': ['request_aborted', 'The request body ended before it was complete'],
  'request.size.invalid': ['invalid_body', 'The request body does not match its Content-Length'],
  'parameters.too.many': ['payload_too_large', 'The request body has too many parameters'],
};

/**
 * Errors that libraries raise for a bad request and mark as such with a 4xx status (http-errors' convention, used by
 * body-parser and by the router for a path that is not valid percent-encoding).
 */
function fromHttpError(err: { status?: unknown; type?: unknown; code?: unknown; message?: unknown; expose?: unknown }): AppError | null {
  const status = typeof err.status === 'number' ? err.status : null;
  if (status === null || status < 400 || status > 499) return null;
  const known = typeof err.type === 'string' ? BODY_ERRORS[err.type] : undefined;
  if (known) return new AppError(known[0], known[1], status);
  if (err instanceof URIError) return new AppError('invalid_path', 'The address is not valid percent-encoding', 400);
  if (typeof err.code === 'string' && err.code.startsWith('Z_')) return new AppError('invalid_body_encoding', 'The request body could not be decompressed as its Content-Encoding says', 400);
  if (status === 404) return new AppError('not_found', 'That file was not found', 404);
  return new AppError('bad_request', err.expose === true && typeof err.message === 'string' ? err.message : 'The request could not be read', status);
}

// Busboy 1.x (under multer 2) reports broken multipart framing with plain Errors; multer adds the request ones.
const MULTIPART_FRAMING = /^(Multipart: Boundary not found|Malformed part header|Unexpected end of (form|file)|Malformed content type|Missing Content-Type|Unsupported content type|Malformed urlencoded form|Request (aborted|closed|error))/;

function fromUpload(err: { name?: unknown; code?: unknown; message?: unknown }): AppError | null {
  if (err.name === 'MulterError') {
    return err.code === 'LIMIT_FILE_SIZE' ? new AppError('payload_too_large', 'The file is too large', 413) : new AppError('bad_upload', `The upload was refused: ${String(err.message)}`, 400);
  }
  if (err instanceof Error && MULTIPART_FRAMING.test(err.message)) return new AppError('bad_upload', `The multipart body is malformed: ${err.message}`, 400);
  return null;
}

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let appError: AppError | null = null;
  if (err instanceof AppError) appError = err;
  else if (isEngineError(err)) appError = new AppError(err.code, err.message, 422, err.details);
  else if (err instanceof ZodError) {
    appError = new AppError('validation_failed', 'Some fields are missing or invalid', 400, err.issues.map((i) => ({ path: i.path, message: i.message, code: i.code })));
  } else if (err instanceof QueryFailedError) appError = fromDatabase(err);
  else if (err && typeof err === 'object') appError = fromHttpError(err) ?? fromUpload(err);
  if (!appError && isDatabaseUnavailable(err)) appError = new AppError('database_unavailable', 'The database is unavailable for a moment; try again shortly', 503);

  if (!appError) {
    req.log?.error({ err }, 'unhandled error');
    res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on our side' } });
    return;
  }
  if (appError.code === 'unsupported_encoding') res.set('Accept-Encoding', 'gzip, deflate, br');
  res.status(appError.status).json({
    error: { code: appError.code, message: appError.message, ...(appError.details !== undefined ? { details: appError.details } : {}) },
  });
};

export const notFoundHandler: RequestHandler = (req, res) => {
  res.status(404).json({ error: { code: 'not_found', message: `No route for ${req.method} ${req.path}` } });
};
