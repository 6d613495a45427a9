import { Router } from 'express';
import { z } from 'zod';
import {
  attachItem,
  deleteInvoice,
  finalizeInvoice,
  getInvoice,
  invoiceObject,
  payInvoice,
  sendInvoice,
  voidInvoice,
} from '../billing';
import {
  booleanParam,
  currencyParam,
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
import { itemsOfInvoice, renderLineItem } from '../render';
import { invalidRequest, resourceMissing } from '../stripe-error';
import { type InvoiceRecord, newId, nowSeconds } from '../store';
import { actorOf, pathId, type RouteContext } from './route-context';

// API reference, "Invoices": create, retrieve, update, list, lines, finalize, send, pay, void, delete.
const collectionMethod = z.enum(['charge_automatically', 'send_invoice']);

const editableFields = {
  auto_advance: booleanParam.optional(),
  collection_method: collectionMethod.optional(),
  days_until_due: nonNegativeIntegerParam.optional(),
  due_date: integerParam.optional(),
  description: z.string().max(1500).optional(),
  footer: z.string().max(5000).optional(),
  metadata: metadataParam.optional(),
  expand: expandParam.optional(),
};

const createSchema = z.strictObject({
  ...editableFields,
  customer: idParam,
  currency: currencyParam.optional(),
  pending_invoice_items_behavior: z.enum(['include', 'exclude']).optional(),
});
const updateSchema = z.strictObject(editableFields);
const listSchema = z.strictObject({
  ...listParams,
  customer: idParam.optional(),
  status: z.enum(['draft', 'open', 'paid', 'uncollectible', 'void']).optional(),
  collection_method: collectionMethod.optional(),
});
const finalizeSchema = z.strictObject({ auto_advance: booleanParam.optional(), expand: expandParam.optional() });
const paySchema = z.strictObject({ paid_out_of_band: booleanParam.optional(), expand: expandParam.optional() });
const plainSchema = z.strictObject({ expand: expandParam.optional() });
const linesSchema = z.strictObject(listParams);

function checkDueFields(collection: string, params: { days_until_due?: number; due_date?: number }): void {
  if (collection !== 'send_invoice' && (params.days_until_due !== undefined || params.due_date !== undefined)) {
    const param = params.days_until_due !== undefined ? 'days_until_due' : 'due_date';
    throw invalidRequest(`${param} can only be set when collection_method is send_invoice.`, { param, savedForIdempotency: false });
  }
}

export function invoiceRoutes(context: RouteContext): Router {
  const router = Router();
  const { store } = context;
  const send = (invoice: InvoiceRecord) => invoiceObject(context, invoice);

  router.post('/v1/invoices', (req, res) => {
    const params = parseParams(createSchema, req.body);
    const customer = store.data.customers[params.customer];
    if (!customer || customer.deleted) throw resourceMissing('customer', params.customer, 'customer');
    const collection = params.collection_method ?? 'charge_automatically';
    checkDueFields(collection, params);
    // API reference: pending_invoice_items_behavior defaults to `exclude`
    const include = params.pending_invoice_items_behavior === 'include';
    const pending = Object.values(store.data.invoiceItems).filter((i) => i.customer === customer.id && i.invoice === null);
    const currency = params.currency ?? customer.currency ?? (include ? pending[0]?.currency : undefined) ?? 'usd';
    const invoice: InvoiceRecord = {
      id: newId('in'),
      created: nowSeconds(),
      customer: customer.id,
      currency,
      status: 'draft',
      collection_method: collection,
      days_until_due: params.days_until_due ?? null,
      due_date: params.due_date ?? null,
      auto_advance: params.auto_advance ?? false,
      description: params.description ?? null,
      footer: params.footer ?? null,
      metadata: mergeMetadata({}, params.metadata),
      number: null,
      hosted_invoice_url: null,
      amount_paid: 0,
      paid_out_of_band: false,
      attempt_count: 0,
      status_transitions: { finalized_at: null, marked_uncollectible_at: null, paid_at: null, voided_at: null },
    };
    store.data.invoices[invoice.id] = invoice;
    if (include) {
      for (const item of pending) if (item.currency === currency) attachItem(context, item.id, invoice);
    }
    store.changed();
    context.webhooks.emit('invoice.created', send(invoice), {
      id: String(res.locals.requestId),
      idempotencyKey: (res.locals.idempotencyKey as string | undefined) ?? null,
      apiVersion: String(res.locals.apiVersion),
    });
    res.json(send(invoice));
  });

  router.get('/v1/invoices/:id', (req, res) => {
    parseParams(plainSchema, req.query);
    res.json(send(getInvoice(context, pathId(req))));
  });

  router.post('/v1/invoices/:id', (req, res) => {
    const params = parseParams(updateSchema, req.body);
    const invoice = getInvoice(context, pathId(req));
    const { metadata, description, footer, expand: _expand, ...draftOnly } = params;
    const touchesDraftOnly = Object.values(draftOnly).some((value) => value !== undefined);
    if (invoice.status !== 'draft' && touchesDraftOnly) {
      throw invalidRequest(`Invoice ${invoice.id} is ${invoice.status}; only metadata, description and footer can change after finalization.`, {
        code: 'invoice_not_editable',
      });
    }
    const collection = params.collection_method ?? invoice.collection_method;
    checkDueFields(collection, params);
    invoice.collection_method = collection;
    if (params.auto_advance !== undefined) invoice.auto_advance = params.auto_advance;
    if (params.days_until_due !== undefined) invoice.days_until_due = params.days_until_due;
    if (params.due_date !== undefined) invoice.due_date = params.due_date;
    if (description !== undefined) invoice.description = description || null;
    if (footer !== undefined) invoice.footer = footer || null;
    invoice.metadata = mergeMetadata(invoice.metadata, metadata);
    store.changed();
    res.json(send(invoice));
  });

  router.get('/v1/invoices', (req, res) => {
    const params = parseParams(listSchema, req.query);
    const invoices = Object.values(store.data.invoices).filter(
      (invoice) =>
        (params.customer === undefined || invoice.customer === params.customer) &&
        (params.status === undefined || invoice.status === params.status) &&
        (params.collection_method === undefined || invoice.collection_method === params.collection_method),
    );
    res.json(paginate(invoices, params, '/v1/invoices', send));
  });

  router.get('/v1/invoices/:id/lines', (req, res) => {
    const params = parseParams(linesSchema, req.query);
    const invoice = getInvoice(context, pathId(req));
    // line items are listed oldest first on the invoice; paginate() expects oldest first and flips, so flip back
    const lines = itemsOfInvoice(store.data, invoice.id)
      .reverse()
      .map((item) => ({ id: String(item.line_id), item }));
    res.json(paginate(lines, params, `/v1/invoices/${invoice.id}/lines`, (line) => renderLineItem(line.item)));
  });

  router.post('/v1/invoices/:id/finalize', (req, res) => {
    const params = parseParams(finalizeSchema, req.body);
    res.json(send(finalizeInvoice(context, actorOf(context, req, res), pathId(req), params.auto_advance)));
  });

  router.post('/v1/invoices/:id/send', (req, res) => {
    parseParams(plainSchema, req.body);
    res.json(send(sendInvoice(context, actorOf(context, req, res), pathId(req))));
  });

  router.post('/v1/invoices/:id/pay', (req, res) => {
    const params = parseParams(paySchema, req.body);
    getInvoice(context, pathId(req));
    if (params.paid_out_of_band !== true) {
      throw invalidRequest(
        'The local Stripe fake cannot charge a saved payment method: pass paid_out_of_band=true, or pay with a test card on the hosted invoice page.',
        { param: 'paid_out_of_band', savedForIdempotency: false },
      );
    }
    res.json(send(payInvoice(context, actorOf(context, req, res), pathId(req), { kind: 'out_of_band' })));
  });

  router.post('/v1/invoices/:id/void', (req, res) => {
    parseParams(plainSchema, req.body);
    res.json(send(voidInvoice(context, actorOf(context, req, res), pathId(req))));
  });

  router.delete('/v1/invoices/:id', (req, res) => {
    res.json(deleteInvoice(context, pathId(req)));
  });

  return router;
}
