import { pino, type DestinationStream } from 'pino';

/** Paths that must never reach a log line. */
export const redactPaths = [
  'req.headers.cookie',
  'req.headers.authorization',
  'res.headers["set-cookie"]',
  '*.password',
  '*.token',
  '*.passwordHash',
];

export function createLogger(level: string, destination?: DestinationStream) {
  const options = { level, redact: { paths: redactPaths, censor: '[redacted]' }, base: { service: 'femtoslot-api' } };
  return destination ? pino(options, destination) : pino(options);
}
export type Logger = ReturnType<typeof createLogger>;
