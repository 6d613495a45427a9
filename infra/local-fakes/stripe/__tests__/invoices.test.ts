import { describe, expect, it } from 'vitest';
import Stripe from 'stripe';
import { draftInvoiceWithItems, startFake } from './support';

describe('customers and invoices through the official SDK', () => {
  it('when a customer is created, then it is retrieved in the Stripe customer shape', async () => {
    const { stripe } = await startFake();

    const created = await stripe.customers.create({
      name: 'Harbourview Gas Sensing Ltd',
      email: 'ap@harbourview.example',
      metadata: { accountId: 'acct-42' },
    });
    const retrieved = await stripe.customers.retrieve(created.id);

    // Stripe API reference, "The Customer object": id cus_…, object, created (unix s), livemode, metadata
    expect(created.id).toMatch(/^cus_\w+$/);
    expect(retrieved).toMatchObject({
      id: created.id,
      object: 'customer',
      livemode: false,
      name: 'Harbourview Gas Sensing Ltd',
      email: 'ap@harbourview.example',
      metadata: { accountId: 'acct-42' },
    });
    expect(Math.abs((retrieved as Stripe.Customer).created - Date.now() / 1000)).toBeLessThan(5);
  });

  it('when a customer is updated, then metadata merges and an empty value unsets a key', async () => {
    const { stripe } = await startFake();
    const customer = await stripe.customers.create({ metadata: { a: '1', b: '2' } });

    const updated = await stripe.customers.update(customer.id, { name: 'Renamed', metadata: { b: '', c: '3' } });

    // Stripe API reference, "Metadata": posting an empty value unsets that key
    expect(updated.metadata).toEqual({ a: '1', c: '3' });
    expect(updated.name).toBe('Renamed');
  });

  it('when a send_invoice draft with items is finalized, then it is open with a number, hosted URL, due date and summed totals', async () => {
    const { stripe, url } = await startFake();
    const { invoice: draft, items } = await draftInvoiceWithItems(stripe, [26_000, 13_750, 4_125]);
    expect(draft.status).toBe('draft');
    expect(draft.hosted_invoice_url).toBeNull();

    const invoice = await stripe.invoices.finalizeInvoice(draft.id);

    // Stripe API reference, "Finalize an invoice": returns the invoice with status=open
    expect(invoice.id).toMatch(/^in_/);
    expect(invoice.status).toBe('open');
    expect(invoice.number).toMatch(/^[0-9A-F]{8}-0001$/);
    expect(invoice.hosted_invoice_url).toBe(`${url}/hosted/invoices/${invoice.id}`);
    expect(invoice.due_date).toBe(invoice.created + 30 * 86_400);
    expect(invoice.status_transitions.finalized_at).not.toBeNull();
    expect(invoice.metadata).toEqual({ period: '2026-11' });
    // totals are the integer sum of the items: 26000 + 13750 + 4125 = 43875
    expect(invoice.subtotal).toBe(43_875);
    expect(invoice.total).toBe(43_875);
    expect(invoice.amount_due).toBe(43_875);
    expect(invoice.lines.object).toBe('list');
    expect(invoice.lines.data.map((line) => line.amount)).toEqual([26_000, 13_750, 4_125]);
    expect(invoice.lines.data[0]?.parent?.invoice_item_details?.invoice_item).toBe(items[0]?.id);
    expect(invoice.lines.data[0]?.metadata).toEqual({ usageLogId: 'log-1' });
  });

  it('when an item is given quantity and unit_amount_decimal, then its amount is their product', async () => {
    const { stripe } = await startFake();
    const customer = await stripe.customers.create({});

    const item = await stripe.invoiceItems.create({
      customer: customer.id,
      currency: 'usd',
      quantity: 4,
      unit_amount_decimal: '2750' as unknown as Stripe.Decimal,
    });

    // 4 × 2750 = 11000 minor units
    expect(item).toMatchObject({ object: 'invoiceitem', amount: 11_000, quantity: 4, invoice: null });
    expect(item.id).toMatch(/^ii_/);
  });

  it('when pending_invoice_items_behavior is include, then pending items are attached; with exclude they stay pending', async () => {
    const { stripe } = await startFake();
    const customer = await stripe.customers.create({});
    await stripe.invoiceItems.create({ customer: customer.id, amount: 5_000, currency: 'usd' });

    const excluded = await stripe.invoices.create({ customer: customer.id, pending_invoice_items_behavior: 'exclude' });
    const included = await stripe.invoices.create({ customer: customer.id, pending_invoice_items_behavior: 'include' });

    expect(excluded.lines.data).toHaveLength(0);
    expect(excluded.total).toBe(0);
    expect(included.lines.data).toHaveLength(1);
    expect(included.total).toBe(5_000);
    const onIncluded = await stripe.invoiceItems.list({ invoice: included.id });
    expect(onIncluded.data).toHaveLength(1);
  });

  it('when invoices are listed with a limit, then pages follow starting_after/has_more and auto-pagination sees all', async () => {
    const { stripe } = await startFake();
    const customer = await stripe.customers.create({});
    const ids: string[] = [];
    for (let i = 0; i < 5; i += 1) ids.push((await stripe.invoices.create({ customer: customer.id })).id);
    const newestFirst = [...ids].reverse();

    const first = await stripe.invoices.list({ customer: customer.id, limit: 2 });
    const second = await stripe.invoices.list({ customer: customer.id, limit: 2, starting_after: first.data[1]?.id });
    const last = await stripe.invoices.list({ customer: customer.id, limit: 2, starting_after: second.data[1]?.id });
    const before = await stripe.invoices.list({ customer: customer.id, limit: 2, ending_before: last.data[0]?.id });
    const all: string[] = [];
    for await (const invoice of stripe.invoices.list({ customer: customer.id, limit: 2 })) all.push(invoice.id);

    // Stripe API reference, "Pagination": newest first, has_more tells whether another page exists
    expect(first.data.map((i) => i.id)).toEqual(newestFirst.slice(0, 2));
    expect(first.has_more).toBe(true);
    expect(second.data.map((i) => i.id)).toEqual(newestFirst.slice(2, 4));
    expect(last.data.map((i) => i.id)).toEqual(newestFirst.slice(4));
    expect(last.has_more).toBe(false);
    expect(before.data.map((i) => i.id)).toEqual(newestFirst.slice(2, 4));
    expect(all).toEqual(newestFirst);
  });

  it('when invoices are listed by status, then only that status comes back', async () => {
    const { stripe } = await startFake();
    const { invoice } = await draftInvoiceWithItems(stripe, [1_000]);
    await stripe.invoices.create({ customer: String(invoice.customer) });
    await stripe.invoices.finalizeInvoice(invoice.id);

    const open = await stripe.invoices.list({ status: 'open' });
    const drafts = await stripe.invoices.list({ status: 'draft' });

    expect(open.data.map((i) => i.id)).toEqual([invoice.id]);
    expect(drafts.data).toHaveLength(1);
    expect(drafts.data[0]?.id).not.toBe(invoice.id);
  });

  it('when an open invoice is paid out of band, then it is paid with amount_paid and paid_at', async () => {
    const { stripe } = await startFake();
    const { invoice } = await draftInvoiceWithItems(stripe, [12_000, 3_000]);
    await stripe.invoices.finalizeInvoice(invoice.id);

    const paid = await stripe.invoices.pay(invoice.id, { paid_out_of_band: true });

    // Stripe API reference, "Pay an invoice": status paid, amount_paid, status_transitions.paid_at
    expect(paid.status).toBe('paid');
    expect(paid.amount_paid).toBe(15_000);
    expect(paid.amount_remaining).toBe(0);
    expect(paid.status_transitions.paid_at).toEqual(expect.any(Number));
    await expect(stripe.invoices.pay(invoice.id, { paid_out_of_band: true })).rejects.toBeInstanceOf(
      Stripe.errors.StripeInvalidRequestError,
    );
  });

  it('when an open invoice is voided, then it is void and cannot be finalized or paid', async () => {
    const { stripe } = await startFake();
    const { invoice } = await draftInvoiceWithItems(stripe, [9_900]);
    await stripe.invoices.finalizeInvoice(invoice.id);

    const voided = await stripe.invoices.voidInvoice(invoice.id);

    expect(voided.status).toBe('void');
    expect(voided.status_transitions.voided_at).toEqual(expect.any(Number));
    const finalizeError = await stripe.invoices.finalizeInvoice(invoice.id).catch((e: unknown) => e);
    expect(finalizeError).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((finalizeError as Stripe.errors.StripeError).type).toBe('StripeInvalidRequestError');
    expect((finalizeError as Stripe.errors.StripeError).statusCode).toBe(400);
    await expect(stripe.invoices.pay(invoice.id, { paid_out_of_band: true })).rejects.toThrow(/void/);
  });

  it('when a draft is deleted, then it is gone; when a finalized invoice is deleted, then Stripe refuses', async () => {
    const { stripe } = await startFake();
    const { invoice: draft } = await draftInvoiceWithItems(stripe, [1_000]);
    const { invoice: finalized } = await draftInvoiceWithItems(stripe, [2_000]);
    await stripe.invoices.finalizeInvoice(finalized.id);

    const deleted = await stripe.invoices.del(draft.id);
    const refused = await stripe.invoices.del(finalized.id).catch((e: unknown) => e);

    // Stripe API reference, "Delete a draft invoice": { id, object: 'invoice', deleted: true }
    expect(deleted).toMatchObject({ id: draft.id, object: 'invoice', deleted: true });
    const missing = await stripe.invoices.retrieve(draft.id).catch((e: unknown) => e);
    expect((missing as Stripe.errors.StripeError).statusCode).toBe(404);
    expect((missing as Stripe.errors.StripeError).code).toBe('resource_missing');
    expect(refused).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((await stripe.invoices.retrieve(finalized.id)).status).toBe('open');
  });

  it('when an item is added to a finalized invoice, then it fails with invoice_not_editable', async () => {
    const { stripe } = await startFake();
    const { customer, invoice } = await draftInvoiceWithItems(stripe, [1_000]);
    await stripe.invoices.finalizeInvoice(invoice.id);

    const error = await stripe.invoiceItems
      .create({ customer: customer.id, invoice: invoice.id, amount: 500, currency: 'usd' })
      .catch((e: unknown) => e);

    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect((error as Stripe.errors.StripeError).code).toBe('invoice_not_editable');
    expect((await stripe.invoices.retrieve(invoice.id)).total).toBe(1_000);
  });

  it('when a draft is sent, then it is finalized first and stays open', async () => {
    const { stripe } = await startFake();
    const { invoice } = await draftInvoiceWithItems(stripe, [7_000]);

    const sent = await stripe.invoices.sendInvoice(invoice.id);

    // Stripe API reference, "Finalize an invoice": Stripe finalizes drafts before sending
    expect(sent.status).toBe('open');
    expect(sent.number).not.toBeNull();
  });
});
