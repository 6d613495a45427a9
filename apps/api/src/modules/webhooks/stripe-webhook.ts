import type { Request, Response } from 'express';
import type Stripe from 'stripe';
import type { AppContext } from '../../lib/context';
import { AppError } from '../../lib/errors/app-error';
import { stripeFor } from '../../lib/stripe/stripe-client';
import { Invoice, type InvoiceStatus } from '../invoices/invoice.entity';
import { StripeEvent } from './stripe-event.entity';

const TOLERANCE_SECONDS = 300;
const statusFor: Record<string, InvoiceStatus> = { 'invoice.paid': 'paid', 'invoice.voided': 'void', 'invoice.finalized': 'open' };

/** Stripe's order of states: an event never moves an invoice backwards (a late `finalized` after `paid`). */
const rank: Record<InvoiceStatus, number> = { draft: 0, open: 1, paid: 2, void: 2, journal: 9 };

/**
 * POST /api/webhooks/stripe, mounted with express.raw before the JSON parser: the signature is over the exact bytes.
 * Each event id is recorded once (stripe_events primary key), in the same transaction as its effect.
 */
export function stripeWebhookHandler(ctx: AppContext) {
  return async (req: Request, res: Response): Promise<void> => {
    const header = req.get('stripe-signature');
    if (!header || !Buffer.isBuffer(req.body)) throw new AppError('bad_signature', 'Missing Stripe-Signature header or body', 400);
    let event: Stripe.Event;
    try {
      event = stripeFor(ctx.env).webhooks.constructEvent(req.body, header, ctx.env.STRIPE_WEBHOOK_SECRET, TOLERANCE_SECONDS);
    } catch (err) {
      throw new AppError('bad_signature', `Webhook signature check failed: ${(err as Error).message}`, 400);
    }
    const target = statusFor[event.type];
    const object = event.data.object as { id?: string; metadata?: Record<string, string> | null; amount_paid?: number };
    const stripeInvoiceId = event.type.startsWith('invoice.') ? object.id ?? null : null;
    const outcome = await ctx.db.transaction(async (m) => {
      const inserted = await m.query(`INSERT INTO stripe_events (id, type, stripe_invoice_id, outcome) VALUES ($1, $2, $3, 'pending') ON CONFLICT (id) DO NOTHING RETURNING id`, [event.id, event.type, stripeInvoiceId]);
      if (!inserted.length) return 'duplicate';
      let result = 'ignored';
      if (target && stripeInvoiceId) {
        const invoice = await m.getRepository(Invoice).findOne({ where: { stripeInvoiceId }, lock: { mode: 'pessimistic_write' } });
        if (!invoice) {
          // Ours but not recorded yet (the close job is between Stripe and its own commit): let Stripe retry later.
          if (object.metadata?.femtoslot_period) throw new AppError('not_ready', 'Invoice not recorded yet; retry later', 503);
          result = 'unknown_invoice';
        } else if (rank[target] > rank[invoice.status]) {
          invoice.status = target;
          if (target === 'paid') {
            invoice.amountPaidMinor = object.amount_paid ?? invoice.totalMinor;
            invoice.paidAt = new Date(event.created * 1000);
          }
          await m.getRepository(Invoice).save(invoice);
          result = `invoice_${target}`;
        } else {
          result = 'no_change';
        }
      }
      await m.getRepository(StripeEvent).update({ id: event.id }, { outcome: result });
      return result;
    });
    res.json({ received: true, outcome });
  };
}
