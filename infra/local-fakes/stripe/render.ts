import type { CustomerRecord, FakeState, InvoiceItemRecord, InvoiceRecord } from './store';

// Object shapes follow Stripe's API reference ("The Customer object", "The Invoice Item object",
// "The Invoice Line Item object", "The Invoice object") as typed by stripe-node 23.1; fields this fake
// has no notion of (tax, discounts, shipping, payment settings) carry their empty values.

export interface RenderContext {
  state: FakeState;
  accountName: string;
}

export function renderCustomer(customer: CustomerRecord): Record<string, unknown> {
  if (customer.deleted) return { id: customer.id, object: 'customer', deleted: true };
  return {
    id: customer.id,
    object: 'customer',
    address: null,
    balance: 0,
    created: customer.created,
    currency: customer.currency,
    default_source: null,
    delinquent: false,
    description: customer.description,
    discount: null,
    email: customer.email,
    invoice_prefix: customer.invoice_prefix,
    invoice_settings: { custom_fields: null, default_payment_method: null, footer: null, rendering_options: null },
    livemode: false,
    metadata: customer.metadata,
    name: customer.name,
    next_invoice_sequence: customer.next_invoice_sequence,
    phone: customer.phone,
    preferred_locales: [],
    shipping: null,
    tax_exempt: 'none',
    test_clock: null,
  };
}

function pricing(item: InvoiceItemRecord): Record<string, unknown> {
  return {
    type: 'price_details',
    unit_amount_decimal: item.unit_amount_decimal,
  };
}

export function renderInvoiceItem(item: InvoiceItemRecord): Record<string, unknown> {
  return {
    id: item.id,
    object: 'invoiceitem',
    amount: item.amount,
    currency: item.currency,
    customer: item.customer,
    customer_account: null,
    date: item.created,
    description: item.description,
    discountable: true,
    discounts: [],
    invoice: item.invoice,
    livemode: false,
    metadata: item.metadata,
    net_amount: item.amount,
    parent: null,
    period: item.period,
    pricing: pricing(item),
    proration: false,
    quantity: item.quantity,
    quantity_decimal: String(item.quantity),
    tax_rates: [],
    test_clock: null,
  };
}

export function renderLineItem(item: InvoiceItemRecord): Record<string, unknown> {
  return {
    id: item.line_id,
    object: 'line_item',
    amount: item.amount,
    currency: item.currency,
    description: item.description,
    discount_amounts: [],
    discountable: true,
    discounts: [],
    invoice: item.invoice,
    livemode: false,
    metadata: item.metadata,
    parent: {
      type: 'invoice_item_details',
      invoice_item_details: { invoice_item: item.id, proration: false, proration_details: null, subscription: null },
      subscription_item_details: null,
    },
    period: item.period,
    pretax_credit_amounts: [],
    pricing: pricing(item),
    quantity: item.quantity,
    quantity_decimal: String(item.quantity),
    subscription: null,
    subtotal: item.amount,
    taxes: [],
  };
}

export function itemsOfInvoice(state: FakeState, invoiceId: string): InvoiceItemRecord[] {
  return Object.values(state.invoiceItems).filter((item) => item.invoice === invoiceId);
}

export function invoiceTotal(state: FakeState, invoiceId: string): number {
  return itemsOfInvoice(state, invoiceId).reduce((sum, item) => sum + item.amount, 0);
}

export function renderInvoice(context: RenderContext, invoice: InvoiceRecord): Record<string, unknown> {
  const { state } = context;
  const customer = state.customers[invoice.customer];
  const items = itemsOfInvoice(state, invoice.id);
  const total = items.reduce((sum, item) => sum + item.amount, 0);
  const amountRemaining = invoice.status === 'void' ? 0 : Math.max(total - invoice.amount_paid, 0);
  const periodStart = items.length ? Math.min(...items.map((i) => i.period.start)) : invoice.created;
  const periodEnd = items.length ? Math.max(...items.map((i) => i.period.end)) : invoice.created;
  return {
    id: invoice.id,
    object: 'invoice',
    account_country: 'US',
    account_name: context.accountName,
    account_tax_ids: null,
    amount_due: total,
    amount_overpaid: 0,
    amount_paid: invoice.amount_paid,
    amount_remaining: amountRemaining,
    amount_shipping: 0,
    application: null,
    attempt_count: invoice.attempt_count,
    attempted: invoice.attempt_count > 0,
    auto_advance: invoice.auto_advance,
    automatic_tax: { disabled_reason: null, enabled: false, liability: null, provider: null, status: null },
    automatically_finalizes_at: null,
    billing_reason: 'manual',
    collection_method: invoice.collection_method,
    created: invoice.created,
    currency: invoice.currency,
    custom_fields: null,
    customer: invoice.customer,
    customer_account: null,
    customer_address: null,
    customer_email: customer?.email ?? null,
    customer_name: customer?.name ?? null,
    customer_phone: customer?.phone ?? null,
    customer_shipping: null,
    customer_tax_exempt: 'none',
    customer_tax_ids: [],
    default_payment_method: null,
    default_source: null,
    default_tax_rates: [],
    description: invoice.description,
    discounts: [],
    due_date: invoice.due_date,
    effective_at: invoice.status_transitions.finalized_at,
    ending_balance: invoice.status === 'draft' ? null : 0,
    footer: invoice.footer,
    from_invoice: null,
    hosted_invoice_url: invoice.hosted_invoice_url,
    invoice_pdf: null,
    issuer: { type: 'self' },
    last_finalization_error: null,
    latest_revision: null,
    lines: {
      object: 'list',
      data: items.map(renderLineItem),
      has_more: false,
      total_count: items.length,
      url: `/v1/invoices/${invoice.id}/lines`,
    },
    livemode: false,
    metadata: invoice.metadata,
    next_payment_attempt: null,
    number: invoice.number,
    on_behalf_of: null,
    parent: null,
    payment_settings: { default_mandate: null, payment_method_options: null, payment_method_types: null },
    period_end: periodEnd,
    period_start: periodStart,
    post_payment_credit_notes_amount: 0,
    pre_payment_credit_notes_amount: 0,
    receipt_number: null,
    rendering: null,
    shipping_cost: null,
    shipping_details: null,
    starting_balance: 0,
    statement_descriptor: null,
    status: invoice.status,
    status_transitions: invoice.status_transitions,
    subtotal: total,
    subtotal_excluding_tax: total,
    test_clock: null,
    total,
    total_discount_amounts: [],
    total_excluding_tax: total,
    total_pretax_credit_amounts: [],
    total_taxes: [],
    webhooks_delivered_at: null,
  };
}
