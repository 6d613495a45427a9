import { describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { draftInvoiceWithItems, startFake, startReceiver, waitFor, WEBHOOK_SECRET } from './support';

const payWithCard = (hostedUrl: string, cardNumber: string) =>
  fetch(`${hostedUrl}/pay`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card_number: cardNumber }).toString(),
  });

describe('hosted invoice page', () => {
  it('when the hosted URL is opened, then the page shows the number, lines, total, due date and a no-JS card form', async () => {
    const { stripe } = await startFake();
    const { invoice } = await draftInvoiceWithItems(stripe, [123_456, 50]);
    const open = await stripe.invoices.finalizeInvoice(invoice.id);

    const response = await fetch(String(open.hosted_invoice_url));
    const html = await response.text();

    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toMatch(/text\/html/);
    expect(html).toContain('local test payment page');
    expect(html).toContain(String(open.number));
    expect(html).toContain('Beam time, OPA signal, session 1');
    // 123456 + 50 = 123506 minor units; USD has 2 minor-unit digits (ISO 4217)
    expect(html).toContain('<td class="amount" id="total">USD 1,235.06</td>');
    expect(html).toContain(new Date(Number(open.due_date) * 1000).toISOString().slice(0, 10));
    expect(html).toMatch(/<form method="post" action="\/hosted\/invoices\/in_\w+\/pay">/);
  });

  it('when 4242 4242 4242 4242 is submitted, then the invoice is paid and invoice.paid is delivered', async () => {
    const receiver = await startReceiver();
    const { stripe } = await startFake({ webhookUrl: receiver.url });
    const { invoice } = await draftInvoiceWithItems(stripe, [40_000]);
    const open = await stripe.invoices.finalizeInvoice(invoice.id);

    const response = await payWithCard(String(open.hosted_invoice_url), '4242 4242 4242 4242');

    expect(response.status).toBe(200);
    expect(await response.text()).toContain('Payment received');
    const paid = await stripe.invoices.retrieve(invoice.id);
    expect(paid.status).toBe('paid');
    expect(paid.amount_paid).toBe(40_000);
    await waitFor(() => receiver.received.length === 2);
    const last = receiver.received[1]!;
    const event = new Stripe('sk_test_verifier_only').webhooks.constructEvent(
      last.rawBody,
      String(last.headers['stripe-signature']),
      WEBHOOK_SECRET,
    );
    expect(event.type).toBe('invoice.paid');
    expect((event.data.object as Stripe.Invoice).id).toBe(invoice.id);
  });

  it('when 4000 0000 0000 0002 is submitted, then the page says declined and the invoice stays open', async () => {
    const { stripe } = await startFake();
    const { invoice } = await draftInvoiceWithItems(stripe, [40_000]);
    const open = await stripe.invoices.finalizeInvoice(invoice.id);

    const response = await payWithCard(String(open.hosted_invoice_url), '4000000000000002');
    const html = await response.text();

    expect(response.status).toBe(402);
    expect(html).toContain('Your card was declined');
    expect(html).toContain('<form method="post"');
    const after = await stripe.invoices.retrieve(invoice.id);
    expect(after.status).toBe('open');
    expect(after.attempt_count).toBe(1);
  });

  it('when a paid or void invoice is opened or paid again, then the page shows that state and takes no payment', async () => {
    const { stripe, fake } = await startFake();
    const { invoice: paid } = await draftInvoiceWithItems(stripe, [1_000]);
    const { invoice: voided } = await draftInvoiceWithItems(stripe, [2_000]);
    const paidUrl = String((await stripe.invoices.finalizeInvoice(paid.id)).hosted_invoice_url);
    const voidUrl = String((await stripe.invoices.finalizeInvoice(voided.id)).hosted_invoice_url);
    await stripe.invoices.pay(paid.id, { paid_out_of_band: true });
    await stripe.invoices.voidInvoice(voided.id);
    const eventsBefore = Object.keys(fake.state.data.events).length;

    const paidPage = await (await fetch(paidUrl)).text();
    const secondPayment = await payWithCard(paidUrl, '4242424242424242');
    const voidPayment = await payWithCard(voidUrl, '4242424242424242');

    expect(paidPage).toContain('This invoice has been paid');
    expect(paidPage).not.toContain('<form');
    expect(secondPayment.status).toBe(409);
    expect(voidPayment.status).toBe(409);
    expect(await voidPayment.text()).toContain('voided');
    expect(Object.keys(fake.state.data.events)).toHaveLength(eventsBefore);
  });

  it('when an unknown invoice or card is used, then the page says so', async () => {
    const { stripe, url } = await startFake();
    const { invoice } = await draftInvoiceWithItems(stripe, [1_000]);
    const open = await stripe.invoices.finalizeInvoice(invoice.id);

    const missing = await fetch(`${url}/hosted/invoices/in_missing`);
    const otherCard = await payWithCard(String(open.hosted_invoice_url), '5555 5555 5555 4444');

    expect(missing.status).toBe(404);
    expect(otherCard.status).toBe(400);
    expect((await stripe.invoices.retrieve(invoice.id)).status).toBe('open');
  });
});
