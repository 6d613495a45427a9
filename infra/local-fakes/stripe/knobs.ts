import type { RequestHandler } from 'express';
import { z } from 'zod';
import { StripeError } from './stripe-error';

export const knobsSchema = z.strictObject({
  /** Fraction (0–1) of /v1 calls that fail before the endpoint runs. */
  errorRate: z.number().min(0).max(1),
  /** Which failure errorRate produces: a 500 api_error, a 429 rate limit, or either (drawn from the seed). */
  errorKind: z.enum(['mixed', 'api_error', 'rate_limit']),
  /** Added to every /v1 call before it is handled. */
  latencyMs: z.number().int().min(0).max(60_000),
  /** The API is unreachable: sockets are destroyed (`close`) or answered with 503 (`503`). */
  down: z.boolean(),
  downMode: z.enum(['close', '503']),
  /** Seed for the errorRate draws; setting it restarts the sequence, so a test sees the same failures each run. */
  seed: z.number().int(),
});

export type Knobs = z.infer<typeof knobsSchema>;
export type KnobsInput = Partial<Knobs>;

export const defaultKnobs: Knobs = {
  errorRate: 0,
  errorKind: 'mixed',
  latencyMs: 0,
  down: false,
  downMode: 'close',
  seed: 1,
};

/** mulberry32: tiny, seedable, good enough to spread injected faults. */
function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export class KnobsController {
  private values: Knobs;
  private random: () => number;

  constructor(initial: KnobsInput = {}) {
    this.values = knobsSchema.parse({ ...defaultKnobs, ...initial });
    this.random = seededRandom(this.values.seed);
  }

  get current(): Knobs {
    return { ...this.values };
  }

  set(update: KnobsInput): Knobs {
    this.values = knobsSchema.parse({ ...this.values, ...update });
    if (update.seed !== undefined || update.errorRate !== undefined) this.random = seededRandom(this.values.seed);
    return this.current;
  }

  reset(): Knobs {
    this.values = { ...defaultKnobs };
    this.random = seededRandom(this.values.seed);
    return this.current;
  }

  /** Draws the fault for one call, or null. */
  drawFault(): StripeError | null {
    const { errorRate, errorKind } = this.values;
    if (errorRate <= 0 || this.random() >= errorRate) return null;
    const kind = errorKind === 'mixed' ? (this.random() < 0.5 ? 'api_error' : 'rate_limit') : errorKind;
    return kind === 'api_error'
      ? new StripeError(500, 'api_error', 'Injected failure (errorRate knob of the local Stripe fake).', {
          savedForIdempotency: false,
        })
      : // Stripe changelog 2015-09-08: rate limits answer HTTP 429 and no longer carry a `rate_limit` code
        new StripeError(429, 'invalid_request_error', 'Too many requests (errorRate knob of the local Stripe fake).', {
          savedForIdempotency: false,
        });
  }
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** Runs before authentication and idempotency, so an injected fault never becomes a key's saved result. */
export function faultInjection(knobs: KnobsController): RequestHandler {
  return async (req, res, next) => {
    const { down, downMode, latencyMs } = knobs.current;
    if (down) {
      if (downMode === 'close') {
        req.socket.destroy();
        return;
      }
      res.status(503).json(new StripeError(503, 'api_error', 'The local Stripe fake is down (down knob).').toBody());
      return;
    }
    if (latencyMs > 0) await sleep(latencyMs);
    const fault = knobs.drawFault();
    if (fault) {
      res.locals.savedForIdempotency = false;
      res.setHeader('Stripe-Should-Retry', 'true');
      res.status(fault.status).json(fault.toBody());
      return;
    }
    next();
  };
}
