import Stripe from 'stripe';
import type { Env } from '../../config/env';

const clients = new WeakMap<Env, Stripe>();

/**
 * One Stripe client per environment. STRIPE_HOST/PORT/PROTOCOL point it at the local fake in development and tests;
 * the SDK's own retries are off because every call carries our own idempotency key and the close job retries.
 */
export function stripeFor(env: Env): Stripe {
  let client = clients.get(env);
  if (!client) {
    client = new Stripe(env.STRIPE_SECRET_KEY, {
      ...(env.STRIPE_HOST ? { host: env.STRIPE_HOST } : {}),
      ...(env.STRIPE_PORT ? { port: env.STRIPE_PORT } : {}),
      ...(env.STRIPE_PROTOCOL ? { protocol: env.STRIPE_PROTOCOL } : {}),
      maxNetworkRetries: 0,
      telemetry: false,
    });
    clients.set(env, client);
  }
  return client;
}

/** Idempotency keys: derived from what the call is about, so a retry or a restart repeats, never duplicates. */
export const idempotencyKeys = {
  customer: (accountId: string) => `femtoslot:customer:${accountId}`,
  invoice: (periodId: string, accountId: string) => `femtoslot:${periodId}:${accountId}:invoice`,
  item: (periodId: string, accountId: string, lineKey: string) => `femtoslot:${periodId}:${accountId}:item:${lineKey}`,
  finalize: (periodId: string, accountId: string) => `femtoslot:${periodId}:${accountId}:finalize`,
  send: (periodId: string, accountId: string) => `femtoslot:${periodId}:${accountId}:send`,
};
