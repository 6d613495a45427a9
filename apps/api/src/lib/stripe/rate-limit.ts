export interface RateLimitRetry {
  /** Repeats after the first refusal. */
  retries: number;
  /** Wait before the first repeat; each later one doubles it, with ±50 % jitter so parallel callers spread out. */
  baseDelayMs: number;
}

/** At most 4 repeats, waiting about 0.25, 0.5, 1 and 2 s: under 4 s in all before the error is reported. */
export const stripeRateLimitRetry: RateLimitRetry = { retries: 4, baseDelayMs: 250 };

const isRateLimited = (err: unknown) => typeof err === 'object' && err !== null && (err as { statusCode?: unknown }).statusCode === 429;

/**
 * A Stripe call that answered 429 (too many requests) is made again after an exponential backoff, as Stripe's
 * rate-limit guidance asks of clients. A 429 means the request was not carried out, and the call is repeated with the
 * same idempotency key, so it cannot take effect twice. Any other error is thrown at once.
 */
export async function retryRateLimited<T>(call: () => Promise<T>, policy: RateLimitRetry = stripeRateLimitRetry): Promise<T> {
  for (let attempt = 0; ; attempt++) {
    try {
      return await call();
    } catch (err) {
      if (!isRateLimited(err) || attempt >= policy.retries) throw err;
      await new Promise((resolve) => setTimeout(resolve, policy.baseDelayMs * 2 ** attempt * (0.5 + Math.random())));
    }
  }
}
