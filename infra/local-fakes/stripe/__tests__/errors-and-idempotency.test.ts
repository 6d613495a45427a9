import { request } from 'node:http';
import { describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { startFake, stripeClient, TEST_KEY } from './support';

describe('errors and idempotency', () => {
  it('when a POST is repeated with the same Idempotency-Key and params, then the first response is replayed', async () => {
    const { stripe, fake } = await startFake();

    const first = await stripe.customers.create({ name: 'Replay Lab' }, { idempotencyKey: 'cust-replay-1' });
    const second = await stripe.customers.create({ name: 'Replay Lab' }, { idempotencyKey: 'cust-replay-1' });

    // Stripe API reference, "Idempotent requests": same key → the saved status and body
    expect(second.id).toBe(first.id);
    expect(second.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect(first.lastResponse.headers['idempotent-replayed']).toBeUndefined();
    expect(Object.keys(fake.state.data.customers)).toHaveLength(1);
  });

  it('when the same Idempotency-Key comes with different params, then the SDK raises StripeIdempotencyError', async () => {
    const { stripe } = await startFake();
    await stripe.customers.create({ name: 'First' }, { idempotencyKey: 'cust-conflict' });

    const error = await stripe.customers.create({ name: 'Second' }, { idempotencyKey: 'cust-conflict' }).catch((e: unknown) => e);

    expect(error).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    expect((error as Stripe.errors.StripeError).statusCode).toBe(400);
    expect((error as Stripe.errors.StripeError).raw).toMatchObject({ type: 'idempotency_error' });
  });

  it('when the client goes away while its POST waits out the latency, then the call is carried out with the params it sent and a retry with the key replays it', async () => {
    const { stripe, fake, port } = await startFake();
    fake.knobs.set({ latencyMs: 300 });
    const body = 'name=Gone+Lab&metadata[lab]=gone';
    await new Promise<void>((resolve) => {
      const req = request({ host: '127.0.0.1', port, path: '/v1/customers', method: 'POST', headers: {
        Authorization: `Bearer ${TEST_KEY}`, 'Content-Type': 'application/x-www-form-urlencoded', 'Content-Length': Buffer.byteLength(body), 'Idempotency-Key': 'cust-gone',
      } });
      req.on('error', () => resolve());
      req.end(body);
      // Gone after the whole request was sent, while the fake is still waiting: what a client killed mid-call looks like.
      setTimeout(() => req.destroy(), 50);
    });
    await new Promise((r) => setTimeout(r, 400));

    const retried = await stripe.customers.create({ name: 'Gone Lab', metadata: { lab: 'gone' } }, { idempotencyKey: 'cust-gone' });

    expect(retried.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect(retried).toMatchObject({ name: 'Gone Lab', metadata: { lab: 'gone' } });
    expect(Object.values(fake.state.data.customers).map((c) => c.name)).toEqual(['Gone Lab']);
  });

  it('when two API keys use the same Idempotency-Key, then each gets its own result', async () => {
    const { stripe, port } = await startFake();
    const other = stripeClient(port, 'sk_test_other_account');

    const mine = await stripe.customers.create({ name: 'Same' }, { idempotencyKey: 'shared-key' });
    const theirs = await other.customers.create({ name: 'Same' }, { idempotencyKey: 'shared-key' });

    expect(theirs.id).not.toBe(mine.id);
  });

  it('when the API key is wrong or missing, then the answer is 401 and the SDK raises StripeAuthenticationError', async () => {
    const { port, url } = await startFake({ apiKeys: [TEST_KEY] });

    const wrongKey = await stripeClient(port, 'sk_test_not_accepted').customers.list().catch((e: unknown) => e);
    const noKey = await fetch(`${url}/v1/customers`);
    const liveKey = await fetch(`${url}/v1/customers`, { headers: { Authorization: 'Bearer sk_live_abc' } });

    expect(wrongKey).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    expect((wrongKey as Stripe.errors.StripeError).statusCode).toBe(401);
    expect(noKey.status).toBe(401);
    expect(await noKey.json()).toMatchObject({ error: { type: 'invalid_request_error' } });
    expect(liveKey.status).toBe(401);
  });

  it('when the key is sent as the HTTP Basic user, then it is accepted', async () => {
    const { url } = await startFake();

    const response = await fetch(`${url}/v1/customers`, {
      method: 'POST',
      headers: {
        Authorization: `Basic ${Buffer.from(`${TEST_KEY}:`).toString('base64')}`,
        'Content-Type': 'application/x-www-form-urlencoded',
      },
      body: 'name=Basic+Lab&metadata[period]=2026-11',
    });

    expect(response.status).toBe(200);
    expect(await response.json()).toMatchObject({ object: 'customer', name: 'Basic Lab', metadata: { period: '2026-11' } });
  });

  it('when a required param is missing, then the SDK raises StripeInvalidRequestError naming the param', async () => {
    const { stripe } = await startFake();

    const error = await stripe.invoices.create({} as Stripe.InvoiceCreateParams).catch((e: unknown) => e);

    // Stripe API reference, "Errors": invalid_request_error with code parameter_missing and param
    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((error as Stripe.errors.StripeError).param).toBe('customer');
    expect((error as Stripe.errors.StripeError).code).toBe('parameter_missing');
    expect((error as Stripe.errors.StripeError).statusCode).toBe(400);
  });

  it('when an unknown or malformed param is sent, then the error names it in bracket notation', async () => {
    const { url } = await startFake();
    const post = (body: string) =>
      fetch(`${url}/v1/invoiceitems`, {
        method: 'POST',
        headers: { Authorization: `Bearer ${TEST_KEY}`, 'Content-Type': 'application/x-www-form-urlencoded' },
        body,
      }).then(async (r) => ({ status: r.status, body: (await r.json()) as { error: Record<string, string> } }));

    const unknown = await post('customer=cus_x&amount=100&currency=usd&colour=blue');
    const badInteger = await post('customer=cus_x&amount=12.5&currency=usd');
    const nested = await post('customer=cus_x&currency=usd&price_data[currency]=usd&price_data[product]=prod_x&price_data[unit_amount]=ten');

    expect(unknown).toMatchObject({ status: 400, body: { error: { code: 'parameter_unknown', param: 'colour' } } });
    expect(badInteger).toMatchObject({ status: 400, body: { error: { code: 'parameter_invalid_integer', param: 'amount' } } });
    expect(nested.body.error.param).toBe('price_data[unit_amount]');
  });

  it('when an object does not exist, then the answer is 404 resource_missing', async () => {
    const { stripe } = await startFake();

    const error = await stripe.invoices.retrieve('in_doesnotexist').catch((e: unknown) => e);

    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((error as Stripe.errors.StripeError).statusCode).toBe(404);
    expect((error as Stripe.errors.StripeError).code).toBe('resource_missing');
  });

  it('when a validation error answers a keyed request, then a corrected retry with the same key runs', async () => {
    const { stripe } = await startFake();
    const customer = await stripe.customers.create({});

    const first = await stripe.invoiceItems
      .create({ customer: customer.id, currency: 'usd' }, { idempotencyKey: 'item-fixup' })
      .catch((e: unknown) => e);
    const retried = await stripe.invoiceItems.create(
      { customer: customer.id, currency: 'usd', amount: 4_200 },
      { idempotencyKey: 'item-fixup' },
    );

    // Stripe API reference, "Idempotent requests": results are saved only after the endpoint starts executing
    expect(first).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(retried.amount).toBe(4_200);
  });

  it('when GET carries bracket-notation query params, then they are parsed', async () => {
    const { url, stripe } = await startFake();
    const invoice = await stripe.invoices.create({ customer: (await stripe.customers.create({})).id });

    const response = await fetch(`${url}/v1/invoices/${invoice.id}?expand[]=lines&expand[]=customer`, {
      headers: { Authorization: `Bearer ${TEST_KEY}` },
    });
    const unknownRoute = await fetch(`${url}/v1/charges`, { headers: { Authorization: `Bearer ${TEST_KEY}` } });

    expect(response.status).toBe(200);
    expect(response.headers.get('request-id')).toMatch(/^req_/);
    expect(unknownRoute.status).toBe(404);
  });
});
