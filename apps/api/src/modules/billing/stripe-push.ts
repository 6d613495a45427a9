import type Stripe from 'stripe';
import type { PriceLine } from '@femtoslot/shared';
import { z } from 'zod';
import type { AppContext } from '../../lib/context';
import { retryRateLimited } from '../../lib/stripe/rate-limit';
import { idempotencyKeys, stripeFor } from '../../lib/stripe/stripe-client';
import { Account } from '../accounts/account.entity';
import type { FacilitySettings } from '../facility/facility-settings.entity';
import type { BillingPeriod, BillingPeriodAccount } from './billing.entities';

const daysUntilDueSchema = z.number().int().min(0).max(365).catch(30);

/** Facility setting `policies.invoiceDaysUntilDue` (default 30 days). */
export const daysUntilDue = (f: FacilitySettings) => daysUntilDueSchema.parse((f.policies as unknown as Record<string, unknown>).invoiceDaysUntilDue ?? 30);

/** The Stripe customer of an external account, created once (the account row is locked while it is made). */
async function ensureCustomer(ctx: AppContext, stripe: Stripe, accountId: string): Promise<string> {
  return ctx.db.transaction(async (m) => {
    const account = await m.getRepository(Account).findOneOrFail({ where: { id: accountId }, lock: { mode: 'pessimistic_write' } });
    if (account.stripeCustomerId) return account.stripeCustomerId;
    const customer = await retryRateLimited(() => stripe.customers.create({
      name: account.name, email: account.billingContactEmail ?? undefined, metadata: { femtoslot_account: account.id, ...(account.poNumber ? { po_number: account.poNumber } : {}) },
    }, { idempotencyKey: idempotencyKeys.customer(account.id) }));
    await m.getRepository(Account).update({ id: account.id }, { stripeCustomerId: customer.id });
    return customer.id;
  });
}

export interface PushedInvoice { stripeInvoice: Stripe.Invoice }

/**
 * Customer, draft invoice, one invoice item per line, finalize, send: each call keyed by period, account and line,
 * and the draft's id kept as soon as it exists, so a retry — or a restart days later — adds nothing twice.
 */
export async function pushToStripe(ctx: AppContext, period: BillingPeriod, row: BillingPeriodAccount, lines: PriceLine[], facility: FacilitySettings): Promise<PushedInvoice> {
  const stripe = stripeFor(ctx.env);
  const customer = await ensureCustomer(ctx, stripe, row.accountId);
  const currency = row.currency.trim().toLowerCase();
  let invoiceId = row.stripeInvoiceId;
  let invoice: Stripe.Invoice;
  let present: Set<string> | null = null;
  if (!invoiceId) {
    invoice = await retryRateLimited(() => stripe.invoices.create({
      customer, currency, collection_method: 'send_invoice', days_until_due: daysUntilDue(facility), auto_advance: false,
      description: `Beam time ${period.month} — ${facility.name}`, metadata: { femtoslot_period: period.id, femtoslot_account: row.accountId },
    }, { idempotencyKey: idempotencyKeys.invoice(period.id, row.accountId) }));
    invoiceId = invoice.id!;
    await ctx.db.query(`UPDATE billing_period_accounts SET stripe_invoice_id = $3, updated_at = now() WHERE period_id = $1 AND account_id = $2`, [period.id, row.accountId, invoiceId]);
    // Items are added only after the draft's id is stored, so a draft whose id was not stored yet — new, or replayed
    // for a run that died between the create and the UPDATE — holds none of ours and is still a draft.
    present = new Set();
  } else {
    const stored = invoiceId;
    invoice = await retryRateLimited(() => stripe.invoices.retrieve(stored));
  }
  const id = invoiceId;
  if (invoice.status === 'draft') {
    present ??= await retryRateLimited(async () => {
      const keys = new Set<string>();
      for await (const l of stripe.invoices.listLineItems(id, { limit: 100 })) if (l.metadata?.femtoslot_line) keys.add(l.metadata.femtoslot_line);
      return keys;
    });
    for (const line of lines) {
      if (present.has(line.key)) continue;
      await retryRateLimited(() => stripe.invoiceItems.create({
        customer, invoice: id, currency, amount: line.amountMinor, description: `${line.label}: ${line.explanation}`.slice(0, 5000),
        metadata: { femtoslot_line: line.key, femtoslot_booking: line.bookingId },
      }, { idempotencyKey: idempotencyKeys.item(period.id, row.accountId, line.key) }));
    }
    invoice = await retryRateLimited(() => stripe.invoices.finalizeInvoice(id, { auto_advance: false }, { idempotencyKey: idempotencyKeys.finalize(period.id, row.accountId) }));
  }
  if (invoice.status === 'open') invoice = await retryRateLimited(() => stripe.invoices.sendInvoice(id, {}, { idempotencyKey: idempotencyKeys.send(period.id, row.accountId) }));
  return { stripeInvoice: invoice };
}
