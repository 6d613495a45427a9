import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { z } from 'zod';

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  APP_URL: z.url().optional(),
  DATABASE_URL: z.string().regex(/^postgres(ql)?:\/\//, 'must be a postgres:// URL'),
  DATA_DIR: z.string().min(1),
  JWT_SECRET: z.string().min(32, 'must be at least 32 characters').optional(),
  SESSION_TTL_HOURS: z.coerce.number().positive().max(24 * 30).default(12),
  INVITATION_TTL_HOURS: z.coerce.number().positive().default(72),
  RESET_TTL_MINUTES: z.coerce.number().positive().default(60),
  LOGIN_RATE_LIMIT: z.coerce.number().int().positive().default(10),
  LOGIN_RATE_WINDOW_MINUTES: z.coerce.number().positive().default(15),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().positive().default(1025),
  MAIL_FROM: z.string().default('Femtoslot <no-reply@femtoslot.test>'),
  OUTBOX_RETRY_LIMIT: z.coerce.number().int().min(0).default(12),
  OUTBOX_RETRY_DELAY_SECONDS: z.coerce.number().int().min(1).default(5),
  WEB_DIST: z.string().optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  // No default here: outside production the local fake's test key is used (checked in loadEnv).
  STRIPE_SECRET_KEY: z.string().regex(/^sk_(test|live)_/, 'must be a Stripe secret key (sk_test_… or sk_live_…)').optional(),
  STRIPE_HOST: z.string().optional(),
  STRIPE_PORT: z.coerce.number().int().min(1).max(65535).optional(),
  STRIPE_PROTOCOL: z.enum(['http', 'https']).optional(),
  // No default here: the local fake's value is public, so production must set its own (checked in loadEnv).
  STRIPE_WEBHOOK_SECRET: z.string().min(1).optional(),
  /** Requests for e-mailed links (reset, invitation) per address per 15 minutes. */
  MAIL_RATE_LIMIT: z.coerce.number().int().positive().default(20),
});

/** Secrets that have a convenience value outside production and must be set in production. */
const requiredInProduction = ['JWT_SECRET', 'STRIPE_WEBHOOK_SECRET', 'STRIPE_SECRET_KEY'] as const;
const LOCAL_WEBHOOK_SECRET = 'whsec_femtoslot_local';
const LOCAL_STRIPE_KEY = 'sk_test_femtoslot_local';

export type Env = Omit<z.infer<typeof envSchema>, 'JWT_SECRET' | 'APP_URL' | 'STRIPE_WEBHOOK_SECRET' | 'STRIPE_SECRET_KEY'> & {
  JWT_SECRET: string;
  STRIPE_WEBHOOK_SECRET: string;
  STRIPE_SECRET_KEY: string;
  APP_URL: string;
};

/** In development and tests the signing secret is made once per install and kept in the data folder. */
function developmentSecret(dataDir: string): string {
  const file = path.join(dataDir, 'jwt-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(48).toString('base64url');
  writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.') || '(root)'}: ${i.message}`);
    throw new Error(`Configuration is invalid (see .env.example):\n${lines.join('\n')}`);
  }
  const env = parsed.data;
  const missing = env.NODE_ENV === 'production' ? requiredInProduction.filter((name) => !env[name]) : [];
  if (missing.length > 0) {
    throw new Error(`Configuration is invalid (see .env.example):\n${missing.map((name) => `  ${name}: required in production`).join('\n')}`);
  }
  return {
    ...env,
    JWT_SECRET: env.JWT_SECRET ?? developmentSecret(env.DATA_DIR),
    STRIPE_WEBHOOK_SECRET: env.STRIPE_WEBHOOK_SECRET ?? LOCAL_WEBHOOK_SECRET,
    STRIPE_SECRET_KEY: env.STRIPE_SECRET_KEY ?? LOCAL_STRIPE_KEY,
    APP_URL: env.APP_URL ?? `http://${env.HOST}:${env.PORT}`,
  };
}
