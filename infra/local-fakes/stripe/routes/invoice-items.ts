import { Router } from 'express';
import { z } from 'zod';
import { attachItem } from '../billing';
import { lineAmount } from '../money';
import {
  booleanParam,
  currencyParam,
  decimalParam,
  expandParam,
  idParam,
  integerParam,
  listParams,
  mergeMetadata,
  metadataParam,
  nonNegativeIntegerParam,
  parseParams,
} from '../params';
import { paginate } from '../pagination';
import { renderInvoiceItem } from '../render';
import { invalidRequest, parameterMissing, resourceMissing } from '../stripe-error';
import { type InvoiceItemRecord, newId, nowSeconds } from '../store';
import { pathId, type RouteContext } from './route-context';

// API reference, "Create an invoice item" (the subset Femtoslot needs; `pricing[price]` needs Price objects this fake lacks).
const createSchema = z.strictObject({
  customer: idParam,
  amount: integerParam.optional(),
  currency: currencyParam.optional(),
  description: z.string().max(5000).optional(),
  invoice: idParam.optional(),
  metadata: metadataParam.optional(),
  quantity: nonNegativeIntegerParam.optional(),
  unit_amount_decimal: decimalParam.optional(),
  price_data: z
    .strictObject({
      currency: currencyParam,
      product: idParam,
      unit_amount: nonNegativeIntegerParam.optional(),
      unit_amount_decimal: decimalParam.optional(),
      tax_behavior: z.enum(['exclusive', 'inclusive', 'unspecified']).optional(),
    })
    .optional(),
  period: z.strictObject({ start: integerParam, end: integerParam }).optional(),
  discountable: booleanParam.optional(),
  expand: expandParam.optional(),
});

const listSchema = z.strictObject({
  ...listParams,
  customer: idParam.optional(),
  invoice: idParam.optional(),
  pending: booleanParam.optional(),
});

type CreateParams = z.output<typeof createSchema>;

function priceOf(params: CreateParams): { amount: number; quantity: number; unitAmountDecimal: string } {
  const given = [params.amount, params.unit_amount_decimal, params.price_data].filter((v) => v !== undefined);
  if (given.length > 1) {
    throw invalidRequest('You may only specify one of these parameters: amount, price_data, unit_amount_decimal.', {
      param: 'amount',
      savedForIdempotency: false,
    });
  }
  const quantity = params.quantity ?? 1;
  if (params.amount !== undefined) {
    if (quantity !== 1) {
      throw invalidRequest('quantity cannot be combined with amount; send unit_amount_decimal with quantity instead.', {
        param: 'quantity',
        savedForIdempotency: false,
      });
    }
    return { amount: params.amount, quantity, unitAmountDecimal: String(params.amount) };
  }
  const unit =
    params.unit_amount_decimal ??
    params.price_data?.unit_amount_decimal ??
    (params.price_data?.unit_amount !== undefined ? String(params.price_data.unit_amount) : undefined);
  if (unit === undefined) {
    throw params.price_data ? parameterMissing('price_data[unit_amount]') : parameterMissing('amount');
  }
  return { amount: lineAmount(quantity, unit), quantity, unitAmountDecimal: unit };
}

export function invoiceItemRoutes(context: RouteContext): Router {
  const router = Router();
  const { store } = context;

  const find = (id: string): InvoiceItemRecord => {
    const item = store.data.invoiceItems[id];
    if (!item) throw resourceMissing('invoiceitem', id);
    return item;
  };

  router.post('/v1/invoiceitems', (req, res) => {
    const params = parseParams(createSchema, req.body);
    const customer = store.data.customers[params.customer];
    if (!customer || customer.deleted) throw resourceMissing('customer', params.customer, 'customer');
    const invoice = params.invoice ? store.data.invoices[params.invoice] : undefined;
    if (params.invoice && !invoice) throw resourceMissing('invoice', params.invoice, 'invoice');
    if (invoice && invoice.customer !== customer.id) {
      throw invalidRequest(`Invoice ${invoice.id} belongs to another customer than ${customer.id}.`, {
        param: 'invoice',
        savedForIdempotency: false,
      });
    }
    if (invoice && invoice.status !== 'draft') {
      throw invalidRequest(`Invoice ${invoice.id} is ${invoice.status}; invoice items can only be added to a draft invoice.`, {
        code: 'invoice_not_editable',
        param: 'invoice',
      });
    }
    const { amount, quantity, unitAmountDecimal } = priceOf(params);
    const currency = params.currency ?? params.price_data?.currency ?? invoice?.currency ?? customer.currency;
    if (!currency) throw parameterMissing('currency');
    if (invoice && currency !== invoice.currency) {
      throw invalidRequest(`The currency ${currency} does not match the invoice's currency ${invoice.currency}.`, {
        param: 'currency',
        savedForIdempotency: false,
      });
    }
    const now = nowSeconds();
    const item: InvoiceItemRecord = {
      id: newId('ii'),
      created: now,
      customer: customer.id,
      invoice: null,
      line_id: null,
      amount,
      currency,
      description: params.description ?? null,
      quantity,
      unit_amount_decimal: unitAmountDecimal,
      period: params.period ?? { start: now, end: now },
      metadata: mergeMetadata({}, params.metadata),
    };
    store.data.invoiceItems[item.id] = item;
    if (invoice) attachItem(context, item.id, invoice);
    store.changed();
    res.json(renderInvoiceItem(item));
  });

  router.get('/v1/invoiceitems/:id', (req, res) => {
    res.json(renderInvoiceItem(find(pathId(req))));
  });

  router.delete('/v1/invoiceitems/:id', (req, res) => {
    const item = find(pathId(req));
    const invoice = item.invoice ? store.data.invoices[item.invoice] : undefined;
    if (invoice && invoice.status !== 'draft') {
      throw invalidRequest(`Invoice item ${item.id} is on ${invoice.status} invoice ${invoice.id} and can no longer be deleted.`, {
        code: 'invoice_not_editable',
      });
    }
    delete store.data.invoiceItems[item.id];
    store.changed();
    res.json({ id: item.id, object: 'invoiceitem', deleted: true });
  });

  router.get('/v1/invoiceitems', (req, res) => {
    const params = parseParams(listSchema, req.query);
    const items = Object.values(store.data.invoiceItems).filter(
      (item) =>
        (params.customer === undefined || item.customer === params.customer) &&
        (params.invoice === undefined || item.invoice === params.invoice) &&
        (params.pending === undefined || (item.invoice === null) === params.pending),
    );
    res.json(paginate(items, params, '/v1/invoiceitems', renderInvoiceItem));
  });

  return router;
}
