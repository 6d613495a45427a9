import { createServer, type IncomingHttpHeaders } from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { afterEach } from 'vitest';
import { createStripeFake, type StripeFake, type StripeFakeOptions } from '../create-stripe-fake';

const cleanups: Array<() => Promise<void>> = [];

afterEach(async () => {
  while (cleanups.length) await cleanups.pop()?.();
});

export const TEST_KEY = 'sk_test_femtoslot_fake';
export const WEBHOOK_SECRET = 'whsec_test_femtoslot';

export function stripeClient(port: number, key = TEST_KEY): Stripe {
  return new Stripe(key, { host: '127.0.0.1', port, protocol: 'http', maxNetworkRetries: 0, telemetry: false });
}

export interface RunningFake {
  fake: StripeFake;
  url: string;
  port: number;
  stripe: Stripe;
  close(): Promise<void>;
}

export async function startFake(options: StripeFakeOptions = {}): Promise<RunningFake> {
  const fake = createStripeFake({
    webhookSecret: WEBHOOK_SECRET,
    ...options,
    webhookRetry: { initialDelayMs: 20, maxDelayMs: 100, timeoutMs: 2_000, ...options.webhookRetry },
  });
  const server = await fake.listen(0);
  let closed = false;
  const close = async () => {
    if (closed) return;
    closed = true;
    await server.close();
  };
  cleanups.push(close);
  return { fake, url: server.url, port: server.port, stripe: stripeClient(server.port), close };
}

export interface ReceivedWebhook {
  rawBody: string;
  headers: IncomingHttpHeaders;
  status: number;
}

/** A bare node:http receiver (raw bodies matter for signature checks) answering with scripted statuses. */
export async function startReceiver(statuses: number[] = []): Promise<{ url: string; received: ReceivedWebhook[] }> {
  const received: ReceivedWebhook[] = [];
  const script = [...statuses];
  const server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      const status = script.shift() ?? 200;
      received.push({ rawBody: Buffer.concat(chunks).toString('utf8'), headers: req.headers, status });
      res.writeHead(status, { 'Content-Type': 'application/json' }).end('{}');
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  cleanups.push(
    () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  );
  return { url: `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/webhooks/stripe`, received };
}

export async function waitFor(check: () => boolean, timeoutMs = 5_000): Promise<void> {
  const started = Date.now();
  while (!check()) {
    if (Date.now() - started > timeoutMs) throw new Error('waitFor: condition not met in time');
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
}

/** A customer plus a send_invoice draft holding the given item amounts (minor units). */
export async function draftInvoiceWithItems(stripe: Stripe, amounts: number[], currency = 'usd') {
  const customer = await stripe.customers.create({ name: 'Lakeshore Photonics Lab', email: 'billing@lakeshore.example' });
  const invoice = await stripe.invoices.create({
    customer: customer.id,
    collection_method: 'send_invoice',
    days_until_due: 30,
    currency,
    pending_invoice_items_behavior: 'exclude',
    metadata: { period: '2026-11' },
  });
  const items = [];
  for (const [index, amount] of amounts.entries()) {
    items.push(
      await stripe.invoiceItems.create({
        customer: customer.id,
        invoice: invoice.id,
        amount,
        currency,
        description: `Beam time, OPA signal, session ${index + 1}`,
        metadata: { usageLogId: `log-${index + 1}` },
      }),
    );
  }
  return { customer, invoice, items };
}
