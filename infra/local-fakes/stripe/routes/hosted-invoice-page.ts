import express, { Router, type Response } from 'express';
import { DEFAULT_API_VERSION } from '../api-middleware';
import { payInvoice, recordDeclinedAttempt } from '../billing';
import { invoiceSummary, page, paymentForm, stateNotice } from '../hosted-page-html';
import { itemsOfInvoice } from '../render';
import type { InvoiceRecord } from '../store';
import { baseUrl, pathId, type RouteContext } from './route-context';

// Stripe's documented test cards: 4242 4242 4242 4242 succeeds, 4000 0000 0000 0002 is declined (docs, "Testing").
const SUCCEEDS = '4242424242424242';
const DECLINED = '4000000000000002';

/** A plain-HTML page (works without JavaScript) standing in for the hosted invoice page. */
export function hostedInvoiceRoutes(context: RouteContext): Router {
  const router = Router();
  const { store } = context;

  const render = (res: Response, status: number, invoice: InvoiceRecord, extra: string) => {
    const customer = store.data.customers[invoice.customer];
    const summary = invoiceSummary(invoice, itemsOfInvoice(store.data, invoice.id), customer?.name ?? null);
    res.status(status).type('html').send(page(`Invoice ${invoice.number ?? invoice.id}`, `${summary}\n${extra}`));
  };

  const notFound = (res: Response, id: string) =>
    res.status(404).type('html').send(page('Invoice not found', `<h1>Invoice not found</h1><p>No invoice ${id.replace(/[^\w-]/g, '')} exists in this fake.</p>`));

  router.get('/hosted/invoices/:id', (req, res) => {
    const invoice = store.data.invoices[pathId(req)];
    if (!invoice) return notFound(res, pathId(req));
    render(res, 200, invoice, invoice.status === 'open' ? paymentForm(invoice) : stateNotice(invoice));
  });

  router.post('/hosted/invoices/:id/pay', express.urlencoded({ extended: false }), (req, res) => {
    const invoice = store.data.invoices[pathId(req)];
    if (!invoice) return notFound(res, pathId(req));
    if (invoice.status !== 'open') return render(res, 409, invoice, stateNotice(invoice));
    const card = String((req.body as Record<string, unknown> | undefined)?.card_number ?? '').replace(/[\s-]/g, '');
    if (card === SUCCEEDS) {
      const actor = { requestId: null, idempotencyKey: null, apiVersion: DEFAULT_API_VERSION, baseUrl: baseUrl(context, req) };
      payInvoice(context, actor, invoice.id, { kind: 'test_card' });
      return render(res, 200, invoice, '<p class="state paid" role="status">Payment received. Thank you.</p>');
    }
    if (card === DECLINED) {
      recordDeclinedAttempt(context, invoice.id);
      return render(res, 402, invoice, paymentForm(invoice, 'Your card was declined. (Test card 4000 0000 0000 0002 always declines.)'));
    }
    render(res, 400, invoice, paymentForm(invoice, 'That is not one of the test card numbers this page accepts.'));
  });

  return router;
}
