import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeBooker } from '../../../test-support/booking-fixture';
import { uniqueTag } from '../../../test-support/test-api';
import { BillingPeriod } from '../billing.entities';
import { startBillingWorld, WEBHOOK_SECRET, type BillingWorld } from './billing-fixture';
import { Invoice } from '../../invoices/invoice.entity';
import { StripeEvent } from '../../webhooks/stripe-event.entity';

let w: BillingWorld;
const sdk = new Stripe('sk_test_webhook_tests', { telemetry: false });
beforeAll(async () => { w = await startBillingWorld(); }, 60_000);
afterAll(async () => { await w?.close(); });

/** An open invoice of ours with a Stripe id, as the close job leaves it. */
async function openInvoice(month: string) {
  const { t } = w;
  const ext = await makeBooker(t, { kind: 'external_academic' });
  const db = t.api.ctx.db;
  const period = await db.getRepository(BillingPeriod).save(db.getRepository(BillingPeriod).create({
    month, startsAt: new Date(`${month}-01T04:00:00Z`), endsAt: new Date(`${month}-28T04:00:00Z`), timeZone: 'America/New_York', status: 'closed',
  }));
  const stripeInvoiceId = `in_test_${uniqueTag()}`;
  const invoice = await db.getRepository(Invoice).save(db.getRepository(Invoice).create({
    periodId: period.id, accountId: ext.account.id, organisationId: ext.org.id, number: `FS-TEST-${uniqueTag()}`, kind: 'external', status: 'open',
    currency: 'USD', totalMinor: 12_345, amountPaidMinor: 0, lines: [], stripeInvoiceId,
  }));
  return { invoice, stripeInvoiceId };
}

// Event shape after Stripe's API reference ("The Event object"), trimmed to what the handler reads.
const eventFor = (id: string, type: string, invoiceId: string, amountPaid = 0) => JSON.stringify({
  id, object: 'event', api_version: '2025-01-27.acacia', created: Math.floor(Date.now() / 1000), livemode: false, pending_webhooks: 1,
  request: { id: null, idempotency_key: null }, type, data: { object: { id: invoiceId, object: 'invoice', status: type === 'invoice.paid' ? 'paid' : 'open', amount_paid: amountPaid, metadata: {} } },
});

const post = (payload: string, header: string) => w.t.http().post('/api/webhooks/stripe').set('Content-Type', 'application/json').set('Stripe-Signature', header).send(payload);

describe('Stripe webhooks', () => {
  it('when a correctly signed invoice.paid arrives, then the invoice is paid with the amount; replayed, it changes nothing', async () => {
    const { invoice, stripeInvoiceId } = await openInvoice('2025-01');
    const id = `evt_${uniqueTag()}`;
    const payload = eventFor(id, 'invoice.paid', stripeInvoiceId, 12_345);
    const first = await post(payload, sdk.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET }));
    expect(first.status).toBe(200);
    expect(first.body.outcome).toBe('invoice_paid');
    const paid = await w.t.api.ctx.db.getRepository(Invoice).findOneByOrFail({ id: invoice.id });
    expect(paid).toMatchObject({ status: 'paid', amountPaidMinor: 12_345 });

    const replay = await post(payload, sdk.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET }));
    expect(replay.status).toBe(200);
    expect(replay.body.outcome).toBe('duplicate');
    const after = await w.t.api.ctx.db.getRepository(Invoice).findOneByOrFail({ id: invoice.id });
    expect(after.updatedAt.getTime()).toBe(paid.updatedAt.getTime());
    expect(await w.t.api.ctx.db.getRepository(StripeEvent).countBy({ id })).toBe(1);
  });

  it('when a late invoice.finalized follows invoice.paid, then the invoice stays paid', async () => {
    const { invoice, stripeInvoiceId } = await openInvoice('2025-02');
    for (const type of ['invoice.paid', 'invoice.finalized']) {
      const payload = eventFor(`evt_${uniqueTag()}`, type, stripeInvoiceId, 12_345);
      expect((await post(payload, sdk.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET }))).status).toBe(200);
    }
    expect((await w.t.api.ctx.db.getRepository(Invoice).findOneByOrFail({ id: invoice.id })).status).toBe('paid');
  });

  it('when the body is tampered with, the secret is wrong or the timestamp is ten minutes old, then it is refused (400) and nothing changes', async () => {
    const { invoice, stripeInvoiceId } = await openInvoice('2025-03');
    const payload = eventFor(`evt_${uniqueTag()}`, 'invoice.voided', stripeInvoiceId);
    const tampered = await post(payload.replace('"livemode":false', '"livemode":true'), sdk.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET }));
    const wrongSecret = await post(payload, sdk.webhooks.generateTestHeaderString({ payload, secret: 'whsec_someone_else' }));
    const stale = await post(payload, sdk.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET, timestamp: Math.floor(Date.now() / 1000) - 600 }));
    const unsigned = await w.t.http().post('/api/webhooks/stripe').set('Content-Type', 'application/json').send(payload);
    for (const r of [tampered, wrongSecret, stale, unsigned]) {
      expect(r.status).toBe(400);
      expect(r.body.error.code).toBe('bad_signature');
    }
    expect((await w.t.api.ctx.db.getRepository(Invoice).findOneByOrFail({ id: invoice.id })).status).toBe('open');

    const good = await post(payload, sdk.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET }));
    expect(good.body.outcome).toBe('invoice_void');
  });
});
