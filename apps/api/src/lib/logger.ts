import { pino } from 'pino';

/** Paths that must never reach a log line. */
export const redactPaths = [
  'req.headers.cookie',
  'req.headers.authorization',
  'res.headers["set-cookie"]',
  '*.password',
  '*.token',
  '*.passwordHash',
];

export function createLogger(level: string) {
  return pino({ level, redact: { paths: redactPaths, censor: '[redacted]' }, base: { service: 'femtoslot-api' } });
}
export type Logger = ReturnType<typeof createLogger>;
