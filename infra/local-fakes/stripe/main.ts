import { z } from 'zod';
import { createStripeFake } from './create-stripe-fake';

// `tsx infra/local-fakes/stripe/main.ts` — the fake on its own, configured from the environment.
const envSchema = z.object({
  STRIPE_FAKE_PORT: z.coerce.number().int().min(0).max(65_535).default(12111),
  STRIPE_FAKE_WEBHOOK_URL: z.url().optional(),
  STRIPE_FAKE_WEBHOOK_SECRET: z.string().min(1).default('whsec_femtoslot_local'),
  STRIPE_FAKE_STATE_FILE: z.string().min(1).optional(),
  /** Comma-separated accepted keys; unset accepts any sk_test_ key. */
  STRIPE_FAKE_API_KEY: z.string().optional(),
});

const parsed = envSchema.safeParse(process.env);
if (!parsed.success) {
  const names = parsed.error.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`).join('; ');
  console.error(`stripe fake: bad environment (${names})`);
  process.exit(1);
}
const env = parsed.data;

const fake = createStripeFake({
  apiKeys: env.STRIPE_FAKE_API_KEY?.split(',').map((k) => k.trim()).filter(Boolean),
  webhookUrl: env.STRIPE_FAKE_WEBHOOK_URL,
  webhookSecret: env.STRIPE_FAKE_WEBHOOK_SECRET,
  stateFile: env.STRIPE_FAKE_STATE_FILE,
});

const server = await fake.listen(env.STRIPE_FAKE_PORT, '127.0.0.1').catch((error: Error) => {
  console.error(`stripe fake: cannot listen on 127.0.0.1:${env.STRIPE_FAKE_PORT} (${error.message})`);
  process.exit(1);
});

console.log(
  `stripe fake ready on ${server.url} (webhooks → ${env.STRIPE_FAKE_WEBHOOK_URL ?? 'none'}, state ${env.STRIPE_FAKE_STATE_FILE ?? 'in memory'})`,
);

let stopping = false;
const stop = (signal: string) => {
  if (stopping) return;
  stopping = true;
  server.close().then(
    () => process.exit(0),
    (error: Error) => {
      console.error(`stripe fake: error while stopping on ${signal}: ${error.message}`);
      process.exit(1);
    },
  );
};
process.on('SIGINT', () => stop('SIGINT'));
process.on('SIGTERM', () => stop('SIGTERM'));
