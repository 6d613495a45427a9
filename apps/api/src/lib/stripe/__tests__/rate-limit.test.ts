import Stripe from 'stripe';
import { describe, expect, it } from 'vitest';
import { retryRateLimited } from '../rate-limit';

const quick = { retries: 3, baseDelayMs: 1 };
// The SDK's own error classes, built from the raw shape it parses out of a Stripe error response.
const tooMany = () => Stripe.errors.StripeError.generate({ type: 'invalid_request_error', statusCode: 429, message: 'Too many requests' } as never);
const apiError = () => Stripe.errors.StripeError.generate({ type: 'api_error', statusCode: 500, message: 'Internal' } as never);

function failing(errors: (() => Error)[], answer = 'ok') {
  let calls = 0;
  return { fn: async () => { const e = errors[calls++]; if (e) throw e(); return answer; }, calls: () => calls };
}

describe('Stripe calls refused with 429', () => {
  it('when Stripe answers 429 twice and then succeeds, then the call is made three times and its answer returned', async () => {
    const f = failing([tooMany, tooMany]);
    await expect(retryRateLimited(f.fn, quick)).resolves.toBe('ok');
    expect(f.calls()).toBe(3);
  });

  it('when Stripe keeps answering 429, then the call is given up after the last repeat with the 429 itself', async () => {
    const f = failing([tooMany, tooMany, tooMany, tooMany, tooMany]);
    await expect(retryRateLimited(f.fn, quick)).rejects.toMatchObject({ statusCode: 429 });
    expect(f.calls()).toBe(4);
  });

  it('when Stripe answers 500, then the error is thrown at once and the call is not repeated', async () => {
    const f = failing([apiError]);
    await expect(retryRateLimited(f.fn, quick)).rejects.toMatchObject({ statusCode: 500 });
    expect(f.calls()).toBe(1);
  });
});
