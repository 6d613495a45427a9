import type { AddressInfo } from 'node:net';
import express, { type Express } from 'express';
import { authenticate, idempotency, requestContext } from './api-middleware';
import { faultInjection, KnobsController, type KnobsInput } from './knobs';
import { customerRoutes } from './routes/customers';
import { eventRoutes } from './routes/events';
import { fakeControlRoutes } from './routes/fake-control';
import { hostedInvoiceRoutes } from './routes/hosted-invoice-page';
import { invoiceItemRoutes } from './routes/invoice-items';
import { invoiceRoutes } from './routes/invoices';
import type { RouteContext } from './routes/route-context';
import { FakeStore } from './store';
import { StripeError, stripeErrorHandler } from './stripe-error';
import { defaultWebhookOptions, WebhookDispatcher, type WebhookOptions } from './webhooks';

export interface StripeFakeOptions {
  /** Accepted secret keys; when empty, any `sk_test_…` key. */
  apiKeys?: string[];
  webhookUrl?: string;
  webhookSecret?: string;
  /** Event types sent to webhookUrl (default: invoice.finalized, invoice.sent, invoice.paid, invoice.voided; `*` for all). */
  webhookEvents?: string[];
  webhookRetry?: Partial<Pick<WebhookOptions, 'maxAttempts' | 'initialDelayMs' | 'maxDelayMs' | 'timeoutMs'>>;
  /** JSON file the state is saved to on every change and loaded from at start. */
  stateFile?: string;
  /** Base of `hosted_invoice_url`; by default the address each request came in on. */
  publicUrl?: string;
  accountName?: string;
  knobs?: KnobsInput;
}

export interface ListeningStripeFake {
  url: string;
  port: number;
  close(): Promise<void>;
}

export interface StripeFake {
  app: Express;
  listen(port?: number, host?: string): Promise<ListeningStripeFake>;
  state: FakeStore;
  knobs: KnobsController;
  webhooks: WebhookDispatcher;
}

const LOOPBACK = new Set(['127.0.0.1', '::1', 'localhost']);

export function createStripeFake(options: StripeFakeOptions = {}): StripeFake {
  const store = new FakeStore(options.stateFile);
  const knobs = new KnobsController(options.knobs);
  const webhooks = new WebhookDispatcher(store, {
    ...defaultWebhookOptions,
    ...options.webhookRetry,
    url: options.webhookUrl,
    secret: options.webhookSecret ?? defaultWebhookOptions.secret,
    enabledEvents: options.webhookEvents ?? defaultWebhookOptions.enabledEvents,
  });
  const context: RouteContext = {
    store,
    webhooks,
    accountName: options.accountName ?? 'Femtoslot local test account',
    publicUrl: options.publicUrl?.replace(/\/$/, ''),
  };

  const app = express();
  app.disable('x-powered-by');
  // Stripe clients encode nested params with brackets even on GET (metadata[k]=v, expand[0]=lines)
  app.set('query parser', 'extended');

  app.use(fakeControlRoutes(context, knobs));
  app.use(hostedInvoiceRoutes(context));

  // The body is read before the latency wait, as a real server has the whole request before it acts on it: a client
  // that goes away during the wait must not leave its call carried out with empty params under its idempotency key.
  app.use('/v1', requestContext, express.urlencoded({ extended: true }), faultInjection(knobs), authenticate(options.apiKeys), idempotency(store));
  app.use(customerRoutes(context));
  app.use(invoiceItemRoutes(context));
  app.use(invoiceRoutes(context));
  app.use(eventRoutes(context));
  app.use('/v1', (req) => {
    throw new StripeError(404, 'invalid_request_error', `Unrecognized request URL (${req.method}: ${req.originalUrl.split('?')[0]}).`, {
      savedForIdempotency: false,
    });
  });
  app.use(stripeErrorHandler);

  const listen = async (port = 0, host = '127.0.0.1'): Promise<ListeningStripeFake> => {
    if (!LOOPBACK.has(host)) throw new Error(`stripe fake: refusing to listen on ${host}; loopback only`);
    const server = app.listen(port, host);
    await new Promise<void>((resolve, reject) => {
      server.once('listening', resolve);
      server.once('error', reject);
    });
    const address = server.address() as AddressInfo;
    webhooks.resumePending();
    const hostPart = address.family === 'IPv6' ? `[${address.address}]` : address.address;
    return {
      url: `http://${hostPart}:${address.port}`,
      port: address.port,
      close: () =>
        new Promise<void>((resolve, reject) => {
          webhooks.cancelAll();
          server.close((error) => (error ? reject(error) : resolve()));
          server.closeAllConnections();
        }),
    };
  };

  return { app, listen, state: store, knobs, webhooks };
}
