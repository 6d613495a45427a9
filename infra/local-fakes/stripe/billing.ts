import { invalidRequest, resourceMissing } from './stripe-error';
import { invoiceTotal, renderInvoice } from './render';
import { type FakeStore, type InvoiceRecord, newId, nowSeconds } from './store';
import type { WebhookDispatcher } from './webhooks';

export interface BillingContext {
  store: FakeStore;
  webhooks: WebhookDispatcher;
  accountName: string;
}

/** Who caused a change: recorded on the event's `request`, and the base URL for hosted pages. */
export interface Actor {
  requestId: string | null;
  idempotencyKey: string | null;
  apiVersion: string;
  baseUrl: string;
}

export function getInvoice(context: BillingContext, id: string): InvoiceRecord {
  const invoice = context.store.data.invoices[id];
  if (!invoice) throw resourceMissing('invoice', id);
  return invoice;
}

export function invoiceObject(context: BillingContext, invoice: InvoiceRecord): Record<string, unknown> {
  return renderInvoice({ state: context.store.data, accountName: context.accountName }, invoice);
}

function emit(context: BillingContext, actor: Actor, type: string, invoice: InvoiceRecord): void {
  context.webhooks.emit(type, invoiceObject(context, invoice), {
    id: actor.requestId,
    idempotencyKey: actor.idempotencyKey,
    apiVersion: actor.apiVersion,
  });
}

function stateError(invoice: InvoiceRecord, action: string): Error {
  return invalidRequest(`Invoice ${invoice.id} is ${invoice.status}: ${action}`, { param: 'invoice' });
}

function markPaid(context: BillingContext, actor: Actor, invoice: InvoiceRecord, outOfBand: boolean): void {
  invoice.status = 'paid';
  invoice.amount_paid = invoiceTotal(context.store.data, invoice.id);
  invoice.paid_out_of_band = outOfBand;
  invoice.status_transitions.paid_at = nowSeconds();
  context.store.changed();
  emit(context, actor, 'invoice.paid', invoice);
}

// API reference, "Finalize an invoice": a draft becomes `open` with a number and a hosted page.
export function finalizeInvoice(context: BillingContext, actor: Actor, id: string, autoAdvance?: boolean): InvoiceRecord {
  const invoice = getInvoice(context, id);
  if (invoice.status !== 'draft') throw stateError(invoice, 'only a draft invoice can be finalized.');
  const customer = context.store.data.customers[invoice.customer];
  if (!customer) throw resourceMissing('customer', invoice.customer, 'customer');
  const now = nowSeconds();
  invoice.status = 'open';
  invoice.number = `${customer.invoice_prefix}-${String(customer.next_invoice_sequence).padStart(4, '0')}`;
  customer.next_invoice_sequence += 1;
  invoice.status_transitions.finalized_at = now;
  invoice.hosted_invoice_url = `${actor.baseUrl}/hosted/invoices/${invoice.id}`;
  if (autoAdvance !== undefined) invoice.auto_advance = autoAdvance;
  if (invoice.collection_method === 'send_invoice' && invoice.due_date === null && invoice.days_until_due !== null) {
    // API reference, `days_until_due`: "the number of days from when the invoice is created until it is due"
    invoice.due_date = invoice.created + invoice.days_until_due * 86_400;
  }
  context.store.changed();
  emit(context, actor, 'invoice.finalized', invoice);
  // a zero-total invoice has nothing to collect and is paid on finalization
  if (invoiceTotal(context.store.data, invoice.id) === 0) markPaid(context, actor, invoice, false);
  return invoice;
}

// API reference, "Send an invoice for manual payment": drafts are finalized first.
export function sendInvoice(context: BillingContext, actor: Actor, id: string): InvoiceRecord {
  const invoice = getInvoice(context, id);
  if (invoice.collection_method !== 'send_invoice') {
    throw invalidRequest(`Invoice ${id} has collection_method=${invoice.collection_method}; only send_invoice invoices can be sent.`, {
      param: 'collection_method',
    });
  }
  if (invoice.status === 'draft') finalizeInvoice(context, actor, id);
  if (invoice.status !== 'open') throw stateError(invoice, 'only an open invoice can be sent.');
  emit(context, actor, 'invoice.sent', invoice);
  return invoice;
}

export type PaymentMethod = { kind: 'out_of_band' } | { kind: 'test_card' };

// API reference, "Pay an invoice": drafts are finalized first; `paid_out_of_band` marks it paid without a charge.
export function payInvoice(context: BillingContext, actor: Actor, id: string, method: PaymentMethod): InvoiceRecord {
  const invoice = getInvoice(context, id);
  if (invoice.status === 'draft') finalizeInvoice(context, actor, id);
  if (invoice.status === 'paid') throw stateError(invoice, 'it has already been paid.');
  if (invoice.status !== 'open') throw stateError(invoice, 'only an open invoice can be paid.');
  if (method.kind === 'test_card') invoice.attempt_count += 1;
  markPaid(context, actor, invoice, method.kind === 'out_of_band');
  return invoice;
}

export function recordDeclinedAttempt(context: BillingContext, id: string): void {
  const invoice = getInvoice(context, id);
  invoice.attempt_count += 1;
  context.store.changed();
}

// API reference, "Void an invoice": only open (or uncollectible) invoices; drafts are deleted instead.
export function voidInvoice(context: BillingContext, actor: Actor, id: string): InvoiceRecord {
  const invoice = getInvoice(context, id);
  if (invoice.status !== 'open') throw stateError(invoice, 'only an open invoice can be voided (delete a draft instead).');
  invoice.status = 'void';
  invoice.status_transitions.voided_at = nowSeconds();
  context.store.changed();
  emit(context, actor, 'invoice.voided', invoice);
  return invoice;
}

// API reference, "Delete a draft invoice": finalized invoices can only be voided.
export function deleteInvoice(context: BillingContext, id: string): { id: string; object: 'invoice'; deleted: true } {
  const invoice = getInvoice(context, id);
  if (invoice.status !== 'draft') throw stateError(invoice, 'only a draft invoice can be deleted; void it instead.');
  const { data } = context.store;
  for (const item of Object.values(data.invoiceItems)) {
    if (item.invoice === id) delete data.invoiceItems[item.id];
  }
  delete data.invoices[id];
  context.store.changed();
  return { id, object: 'invoice', deleted: true };
}

export function attachItem(context: BillingContext, itemId: string, invoice: InvoiceRecord): void {
  const item = context.store.data.invoiceItems[itemId];
  if (!item) return;
  item.invoice = invoice.id;
  item.line_id = newId('il', 24);
}
