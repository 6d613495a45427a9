import { describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { draftInvoiceWithItems, startFake, startReceiver, waitFor, WEBHOOK_SECRET } from './support';

const verifier = new Stripe('sk_test_verifier_only');

describe('webhook delivery', () => {
  it('when an invoice is finalized, then a signed invoice.finalized event reaches the endpoint and verifies with constructEvent', async () => {
    const receiver = await startReceiver();
    const { stripe } = await startFake({ webhookUrl: receiver.url });
    const { invoice } = await draftInvoiceWithItems(stripe, [18_000]);

    await stripe.invoices.finalizeInvoice(invoice.id);
    await waitFor(() => receiver.received.length === 1);

    const [delivery] = receiver.received;
    const header = String(delivery?.headers['stripe-signature']);
    // Stripe docs, "Check the webhook signatures": t=<timestamp>,v1=<HMAC-SHA256 hex>
    expect(header).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
    const event = verifier.webhooks.constructEvent(String(delivery?.rawBody), header, WEBHOOK_SECRET);
    // Stripe API reference, "The Event object": evt_…, type, data.object, created, api_version
    expect(event.id).toMatch(/^evt_/);
    expect(event.object).toBe('event');
    expect(event.type).toBe('invoice.finalized');
    expect(event.api_version).toEqual(expect.any(String));
    expect(event.livemode).toBe(false);
    const object = event.data.object as Stripe.Invoice;
    expect(object.id).toBe(invoice.id);
    expect(object.status).toBe('open');
    expect(object.total).toBe(18_000);
  });

  it('when the body is tampered with or the secret is wrong, then verification fails', async () => {
    const receiver = await startReceiver();
    const { stripe } = await startFake({ webhookUrl: receiver.url });
    const { invoice } = await draftInvoiceWithItems(stripe, [18_000]);
    await stripe.invoices.finalizeInvoice(invoice.id);
    await waitFor(() => receiver.received.length === 1);
    const delivery = receiver.received[0]!;
    const header = String(delivery.headers['stripe-signature']);

    const tampered = delivery.rawBody.replace('"total": 18000', '"total": 1');

    expect(tampered).not.toBe(delivery.rawBody);
    expect(() => verifier.webhooks.constructEvent(tampered, header, WEBHOOK_SECRET)).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
    expect(() => verifier.webhooks.constructEvent(delivery.rawBody, header, 'whsec_wrong')).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
  });

  it('when the receiver answers 500 once, then the event is retried and delivered on the second attempt', async () => {
    const receiver = await startReceiver([500]);
    const { stripe, url } = await startFake({ webhookUrl: receiver.url });
    const { invoice } = await draftInvoiceWithItems(stripe, [5_000]);

    await stripe.invoices.finalizeInvoice(invoice.id);
    await waitFor(() => receiver.received.length === 2);

    const ids = receiver.received.map((r) => (JSON.parse(r.rawBody) as { id: string }).id);
    expect(ids[0]).toBe(ids[1]);
    const deliveries = (await (await fetch(`${url}/_fake/deliveries?event=${ids[0]}`)).json()) as {
      data: Array<{ attempt: number; status: number; ok: boolean }>;
    };
    expect(deliveries.data.map((d) => [d.attempt, d.status, d.ok])).toEqual([
      [1, 500, false],
      [2, 200, true],
    ]);
    const event = await stripe.events.retrieve(String(ids[0]));
    expect(event.pending_webhooks).toBe(0);
  });

  it('when the endpoint is unreachable, then delivery stops after the bounded number of attempts', async () => {
    const { stripe, fake } = await startFake({
      webhookUrl: 'http://127.0.0.1:9/unreachable',
      webhookRetry: { maxAttempts: 3, initialDelayMs: 5 },
    });
    const { invoice } = await draftInvoiceWithItems(stripe, [5_000]);

    await stripe.invoices.finalizeInvoice(invoice.id);
    await fake.webhooks.idle();

    const attempts = fake.state.data.deliveries;
    expect(attempts.map((a) => a.attempt)).toEqual([1, 2, 3]);
    expect(attempts.every((a) => !a.ok && a.status === null && a.error)).toBe(true);
    const [event] = (await stripe.events.list({ type: 'invoice.finalized' })).data;
    expect(event?.pending_webhooks).toBe(1);
  });

  it('when one invoice goes finalized → sent → paid and the first delivery fails, then events still arrive in order', async () => {
    const receiver = await startReceiver([503]);
    const { stripe, fake } = await startFake({ webhookUrl: receiver.url });
    const { invoice } = await draftInvoiceWithItems(stripe, [2_500]);

    await stripe.invoices.finalizeInvoice(invoice.id);
    await stripe.invoices.sendInvoice(invoice.id);
    await stripe.invoices.pay(invoice.id, { paid_out_of_band: true });
    await fake.webhooks.idle();

    const types = receiver.received.map((r) => (JSON.parse(r.rawBody) as { type: string }).type);
    expect(types).toEqual(['invoice.finalized', 'invoice.finalized', 'invoice.sent', 'invoice.paid']);
  });

  it('when an invoice is voided, then invoice.voided is delivered and events are listed newest first', async () => {
    const receiver = await startReceiver();
    const { stripe, fake } = await startFake({ webhookUrl: receiver.url });
    const { invoice } = await draftInvoiceWithItems(stripe, [2_500]);
    await stripe.invoices.finalizeInvoice(invoice.id);
    await stripe.invoices.voidInvoice(invoice.id);
    await fake.webhooks.idle();

    const listed = await stripe.events.list({ type: 'invoice.*' });

    expect(receiver.received.map((r) => (JSON.parse(r.rawBody) as { type: string }).type)).toEqual([
      'invoice.finalized',
      'invoice.voided',
    ]);
    // invoice.created is recorded as an event but not sent: the endpoint did not subscribe to it
    expect(listed.data.map((e) => e.type)).toEqual(['invoice.voided', 'invoice.finalized', 'invoice.created']);
    const retrieved = await stripe.events.retrieve(listed.data[0]!.id);
    expect((retrieved.data.object as Stripe.Invoice).status).toBe('void');
  });
});
