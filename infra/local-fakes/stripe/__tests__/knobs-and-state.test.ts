import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { createStripeFake } from '../create-stripe-fake';
import { draftInvoiceWithItems, startFake, stripeClient, TEST_KEY } from './support';

const setKnobs = (url: string, knobs: Record<string, unknown>) =>
  fetch(`${url}/_fake/knobs`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(knobs) });

describe('knobs', () => {
  it('when errorRate is 1, then calls fail, and a retry with the same key after errorRate 0 succeeds exactly once', async () => {
    const { stripe, url, fake } = await startFake();
    const customer = await stripe.customers.create({});
    await setKnobs(url, { errorRate: 1, errorKind: 'api_error' });
    const params = { customer: customer.id, amount: 8_800, currency: 'usd', description: 'Pump-probe, 2 h' };

    const failed = await stripe.invoiceItems.create(params, { idempotencyKey: 'usage-log-77' }).catch((e: unknown) => e);
    await setKnobs(url, { errorRate: 0 });
    const retried = await stripe.invoiceItems.create(params, { idempotencyKey: 'usage-log-77' });
    const replayed = await stripe.invoiceItems.create(params, { idempotencyKey: 'usage-log-77' });

    expect(failed).toBeInstanceOf(Stripe.errors.StripeAPIError);
    expect((failed as Stripe.errors.StripeError).statusCode).toBe(500);
    expect(replayed.id).toBe(retried.id);
    expect(Object.values(fake.state.data.invoiceItems)).toHaveLength(1);
  });

  it('when errorKind is rate_limit, then the SDK raises StripeRateLimitError', async () => {
    const { stripe } = await startFake({ knobs: { errorRate: 1, errorKind: 'rate_limit' } });

    const error = await stripe.customers.list().catch((e: unknown) => e);

    expect(error).toBeInstanceOf(Stripe.errors.StripeRateLimitError);
    expect((error as Stripe.errors.StripeError).statusCode).toBe(429);
  });

  it('when two fakes share a seed, then errorRate fails the same calls in both', async () => {
    const outcomes = async () => {
      const { stripe } = await startFake({ knobs: { errorRate: 0.5, seed: 2026 } });
      const results: string[] = [];
      for (let i = 0; i < 12; i += 1) {
        results.push(await stripe.customers.list().then(() => 'ok', (e: Stripe.errors.StripeError) => String(e.statusCode)));
      }
      return results;
    };

    const first = await outcomes();
    const second = await outcomes();

    expect(second).toEqual(first);
    expect(first).toContain('ok');
    expect(first.some((o) => o !== 'ok')).toBe(true);
  });

  it('when down, then /v1 connections fail (or answer 503), and the API recovers when up again', async () => {
    const { stripe, url, fake } = await startFake();
    fake.knobs.set({ down: true });

    const closed = await stripe.customers.list().catch((e: unknown) => e);
    fake.knobs.set({ downMode: '503' });
    const unavailable = await fetch(`${url}/v1/customers`, { headers: { Authorization: `Bearer ${TEST_KEY}` } });
    fake.knobs.set({ down: false });
    const recovered = await stripe.customers.list();

    expect(closed).toBeInstanceOf(Stripe.errors.StripeConnectionError);
    expect(unavailable.status).toBe(503);
    expect(recovered.object).toBe('list');
  });

  it('when latencyMs is set, then /v1 calls take at least that long', async () => {
    const { stripe } = await startFake({ knobs: { latencyMs: 150 } });

    const started = performance.now();
    await stripe.customers.list();

    expect(performance.now() - started).toBeGreaterThanOrEqual(140);
  });

  it('when knobs are invalid or the fake is reset, then /_fake answers accordingly', async () => {
    const { stripe, url } = await startFake();
    await stripe.customers.create({});

    const invalid = await setKnobs(url, { errorRate: 2 });
    await setKnobs(url, { latencyMs: 5 });
    const reset = await fetch(`${url}/_fake/reset`, { method: 'POST' });
    const state = (await (await fetch(`${url}/_fake/state`)).json()) as { customers: object };
    const knobs = (await (await fetch(`${url}/_fake/knobs`)).json()) as { latencyMs: number };

    expect(invalid.status).toBe(400);
    expect(reset.status).toBe(200);
    expect(state.customers).toEqual({});
    expect(knobs.latencyMs).toBe(0);
  });
});

describe('persistence and the CLI', () => {
  it('when the fake restarts on the same state file, then invoices, numbering and idempotency keys survive', async () => {
    const stateFile = join(mkdtempSync(join(tmpdir(), 'stripe-fake-')), 'state.json');
    const first = await startFake({ stateFile });
    const { invoice, customer } = await draftInvoiceWithItems(first.stripe, [31_000]);
    const open = await first.stripe.invoices.finalizeInvoice(invoice.id, {}, { idempotencyKey: 'finalize-1' });
    await first.close();

    const second = await startFake({ stateFile });
    const reloaded = await second.stripe.invoices.retrieve(invoice.id);
    const replay = await second.stripe.invoices.finalizeInvoice(invoice.id, {}, { idempotencyKey: 'finalize-1' });
    const next = await draftInvoiceWithItems(second.stripe, [1_000]);
    const nextInvoice = await second.stripe.invoices.create({ customer: customer.id });
    const nextOpen = await second.stripe.invoices.finalizeInvoice(nextInvoice.id);

    expect(JSON.parse(readFileSync(stateFile, 'utf8'))).toMatchObject({ version: 1 });
    expect(reloaded).toMatchObject({ status: 'open', number: open.number, total: 31_000 });
    expect(replay.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect(next.invoice.id).not.toBe(invoice.id);
    expect(nextOpen.number).toBe(String(open.number).replace(/0001$/, '0002'));
  });

  it('when the app is used without listen, then supertest-style in-process use works', async () => {
    const fake = createStripeFake();
    const server = fake.app.listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    const port = (server.address() as { port: number }).port;

    const customer = await stripeClient(port).customers.create({ name: 'In-process' });

    expect(fake.state.data.customers[customer.id]?.name).toBe('In-process');
    await new Promise((resolve) => server.close(resolve));
  });

  it('when main.ts starts, then it prints one ready line, serves /v1 and exits 0 on SIGTERM', async () => {
    const mainPath = fileURLToPath(new URL('../main.ts', import.meta.url));
    const tsx = fileURLToPath(new URL('../../../../node_modules/.bin/tsx', import.meta.url));
    const child = spawn(tsx, [mainPath], {
      env: { ...process.env, STRIPE_FAKE_PORT: '0', STRIPE_FAKE_API_KEY: 'sk_test_cli_a,sk_test_cli_b' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let output = '';
    child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
    const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
    try {
      const started = Date.now();
      while (!output.includes('\n') && Date.now() - started < 15_000) await new Promise((r) => setTimeout(r, 25));
      const url = /ready on (http:\/\/127\.0\.0\.1:\d+)/.exec(output)?.[1];
      expect(url).toBeDefined();

      const accepted = await fetch(`${url}/v1/customers`, { headers: { Authorization: 'Bearer sk_test_cli_b' } });
      const refused = await fetch(`${url}/v1/customers`, { headers: { Authorization: 'Bearer sk_test_other' } });
      child.kill('SIGTERM');

      expect(accepted.status).toBe(200);
      expect(refused.status).toBe(401);
      expect(await exited).toBe(0);
      expect(output.trim().split('\n')).toHaveLength(1);
    } finally {
      if (child.exitCode === null) child.kill('SIGKILL');
    }
  });
});
