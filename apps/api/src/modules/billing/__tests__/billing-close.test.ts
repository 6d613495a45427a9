import type Stripe from 'stripe';
import { parse } from 'csv-parse/sync';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutboxMessage } from '../../../lib/mail/outbox-message.entity';
import { makeBooker, makeInstrument } from '../../../test-support/booking-fixture';
import { makePeople, startTestApi } from '../../../test-support/test-api';
import { BillingJob } from '../billing.entities';
import { CLOSE_CONCURRENCY } from '../close-job';
import { UsageLog } from '../../usage/usage-log.entity';
import { confirmedSession, financeAgent, monthRateCard, startBillingWorld, until, type BillingWorld } from './billing-fixture';

let w: BillingWorld;
beforeAll(async () => { w = await startBillingWorld(); }, 60_000);
afterAll(async () => { await w?.close(); });

type Agent = Awaited<ReturnType<typeof financeAgent>>['finance'];
// supertest hands an unknown binary type to a parser of our own, which keeps the bytes.
const binary = (res: NodeJS.ReadableStream, cb: (err: Error | null, body: unknown) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

async function finishedJob(finance: Agent, jobId: string) {
  return until(async () => {
    const r = await finance.get(`/api/billing/jobs/${jobId}`);
    return ['completed', 'failed'].includes(r.body.job.status) ? r.body.job : null;
  }, 30_000);
}

/** A month with two external accounts and one internal group, each with one confirmed session. */
async function monthWithThreeAccounts(month: string) {
  const { t } = w;
  const people = await financeAgent(t);
  await monthRateCard(people.finance, month);
  const { instrument, configs } = await makeInstrument(t);
  const academic = await makeBooker(t, { kind: 'external_academic' });
  const industry = await makeBooker(t, { kind: 'industry' });
  const internal = await makeBooker(t, { kind: 'internal' });
  const by = people.financeUser.id;
  const s1 = await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.dfg, who: academic, startsAt: `${month}-08T13:00:00Z`, bookedHours: 3, actualEnd: `${month}-08T16:04:00Z`, confirmedBy: by });
  const s2 = await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.opa_signal, who: industry, startsAt: `${month}-09T13:00:00Z`, bookedHours: 2, actualEnd: `${month}-09T15:00:00Z`, confirmedBy: by });
  const s3 = await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.shg, who: internal, startsAt: `${month}-10T13:00:00Z`, bookedHours: 1, actualEnd: `${month}-10T13:50:00Z`, confirmedBy: by });
  return { ...people, academic, industry, internal, configs, sessions: [s1, s2, s3] };
}

describe('billing period close', () => {
  it('when the fake fails half-way and the close is restarted, then each account has exactly one Stripe invoice, totals equal the preview, and closing again changes nothing', async () => {
    const { fake, stripe, t } = w;
    const world = await monthWithThreeAccounts('2026-09');
    const { finance } = world;
    const opened = await finance.post('/api/billing/periods').send({ month: '2026-09' });
    const periodId = opened.body.period.id as string;
    const previewTotals = new Map<string, number>(opened.body.preview.accounts.map((a: { accountId: string; totalMinor: number }) => [a.accountId, a.totalMinor]));
    // By hand: 3 h 15 min × $137.50 = $446.88; 2 h × $260 = $520.00; 50 min → 1 h × $60 = $60.00
    expect(previewTotals.get(world.academic.account.id)).toBe(44_688);
    expect(previewTotals.get(world.industry.account.id)).toBe(52_000);
    expect(previewTotals.get(world.internal.account.id)).toBe(6_000);

    fake.knobs.set({ errorRate: 0.5, errorKind: 'api_error', seed: 11 });
    const first = await finance.post(`/api/billing/periods/${periodId}/close`).send({});
    expect(first.status).toBe(202);
    const failed = await finishedJob(finance, first.body.job.id);
    expect(failed.status).toBe('failed');
    expect(failed.errors.length).toBeGreaterThan(0);
    expect(failed.total).toBe(3);
    // Half-way: the internal group (journal, no Stripe) is done, at least one external account is not.
    expect(failed.done).toBeGreaterThan(0);
    expect(failed.done).toBeLessThan(3);

    fake.knobs.set({ errorRate: 0 });
    const second = await finance.post(`/api/billing/periods/${periodId}/close`).send({});
    expect(second.status).toBe(202);
    expect(second.body.job.id).not.toBe(first.body.job.id);
    const done = await finishedJob(finance, second.body.job.id);
    expect(done).toMatchObject({ status: 'completed', done: 3, total: 3, errors: [] });

    const third = await finance.post(`/api/billing/periods/${periodId}/close`).send({});
    expect(third.status).toBe(200);
    expect(third.body.period).toMatchObject({ id: periodId, status: 'closed' });

    const ours: Stripe.Invoice[] = [];
    for await (const inv of stripe.invoices.list({ limit: 100 })) if (inv.metadata?.femtoslot_period === periodId) ours.push(inv);
    expect(ours.map((i) => i.metadata!.femtoslot_account).sort()).toEqual([world.academic.account.id, world.industry.account.id].sort());
    for (const inv of ours) {
      expect(inv.total).toBe(previewTotals.get(inv.metadata!.femtoslot_account!));
      expect(inv.status).toBe('open');
      expect(inv.collection_method).toBe('send_invoice');
      expect((await stripe.invoices.listLineItems(inv.id!, { limit: 100 })).data).toHaveLength(1);
    }
    const customers = Object.values(fake.state.data.customers).filter((c) => [world.academic.account.id, world.industry.account.id].includes(c.metadata.femtoslot_account ?? ''));
    expect(customers).toHaveLength(2);

    const logs = await t.api.ctx.db.getRepository(UsageLog).findBy(world.sessions.map((s) => ({ id: s.log.id })));
    expect(logs.every((l) => l.status === 'billed' && l.billedBy === world.financeUser.id && l.billedAt)).toBe(true);
    const notices = await t.api.ctx.db.getRepository(OutboxMessage).findBy({ template: 'invoice-notice' });
    expect(notices.filter((n) => n.textBody.includes(ours.find((i) => i.metadata!.femtoslot_account === world.academic.account.id)!.hosted_invoice_url!))).toHaveLength(1);
  });

  it('when the API dies in the middle of a close, then a restarted API resumes the job and still makes one invoice per account', async () => {
    const { fake, stripe, t } = w;
    const world = await monthWithThreeAccounts('2026-05');
    const opened = await world.finance.post('/api/billing/periods').send({ month: '2026-05' });
    const periodId = opened.body.period.id as string;
    // Stripe unreachable: the internal group is journalled, both external accounts stay pending.
    fake.knobs.set({ down: true, downMode: 'close' });
    const first = (await world.finance.post(`/api/billing/periods/${periodId}/close`).send({})).body.job;
    expect((await finishedJob(world.finance, first.id)).done).toBe(1);
    fake.knobs.set({ down: false });
    // What a crash leaves behind: the job row still says running, and no pg-boss job is alive for it.
    await t.api.ctx.db.getRepository(BillingJob).update({ id: first.id }, { status: 'running', finishedAt: null });
    const env = t.api.ctx.env;
    const restarted = await startTestApi({ DATABASE_URL: env.DATABASE_URL, STRIPE_HOST: '127.0.0.1', STRIPE_PORT: String(env.STRIPE_PORT), STRIPE_PROTOCOL: 'http', STRIPE_WEBHOOK_SECRET: env.STRIPE_WEBHOOK_SECRET });
    try {
      const resumed = await finishedJob(world.finance, first.id);
      expect(resumed).toMatchObject({ status: 'completed', done: 3, total: 3 });
    } finally {
      await restarted.close();
    }
    const ours: Stripe.Invoice[] = [];
    for await (const inv of stripe.invoices.list({ limit: 100 })) if (inv.metadata?.femtoslot_period === periodId) ours.push(inv);
    expect(ours).toHaveLength(2);
  });

  it('when a period has more accounts than the close bills at once, then every account gets exactly one invoice and each line reaches Stripe or the journal once', async () => {
    const { fake, stripe, t } = w;
    const month = '2026-11';
    const people = await financeAgent(t);
    await monthRateCard(people.finance, month);
    const { instrument, configs } = await makeInstrument(t);
    const kinds = ['external_academic', 'industry', 'internal'] as const;
    const bookers = [];
    for (let i = 0; i < 3 * CLOSE_CONCURRENCY; i++) bookers.push(await makeBooker(t, { kind: kinds[i % 3]! }));
    // Three one-hour sessions per account on its own day, 2 h apart: 09:00, 11:00 and 13:00 New York time.
    for (const [i, who] of bookers.entries()) {
      const day = `${month}-${String(2 + i).padStart(2, '0')}`;
      for (const hour of [14, 16, 18]) {
        await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.opa_signal, who, startsAt: `${day}T${hour}:00:00Z`, bookedHours: 1, actualEnd: `${day}T${hour}:40:00Z`, confirmedBy: people.financeUser.id });
      }
    }
    const opened = await people.finance.post('/api/billing/periods').send({ month });
    const periodId = opened.body.period.id as string;
    expect(opened.body.preview.accounts).toHaveLength(bookers.length);

    fake.knobs.set({ latencyMs: 15 });
    try {
      const close = await people.finance.post(`/api/billing/periods/${periodId}/close`).send({});
      expect(close.status).toBe(202);
      expect(await finishedJob(people.finance, close.body.job.id)).toMatchObject({ status: 'completed', done: bookers.length, total: bookers.length, errors: [] });
    } finally {
      fake.knobs.set({ latencyMs: 0 });
    }

    const db = t.api.ctx.db;
    const ours: { account_id: string; n: number; total: string }[] = await db.query(`SELECT account_id, count(*)::int AS n, sum(total_minor)::text AS total FROM invoices WHERE period_id = $1 GROUP BY account_id`, [periodId]);
    expect(ours).toHaveLength(bookers.length);
    // By hand: 40 min rounds up to 45 min; three sessions × ¾ h × $110 (academic) / $260 (industry) / $60 (internal).
    const perAccount = { external_academic: 24_750, industry: 58_500, internal: 13_500 };
    for (const [i, who] of bookers.entries()) {
      expect(ours.find((r) => r.account_id === who.account.id)).toEqual({ account_id: who.account.id, n: 1, total: String(perAccount[kinds[i % 3]!]) });
    }
    const external = bookers.filter((_, i) => kinds[i % 3] !== 'internal');
    const invoices: Stripe.Invoice[] = [];
    for await (const inv of stripe.invoices.list({ limit: 100 })) if (inv.metadata?.femtoslot_period === periodId) invoices.push(inv);
    expect(invoices.map((i) => i.metadata!.femtoslot_account).sort()).toEqual(external.map((b) => b.account.id).sort());
    for (const inv of invoices) expect((await stripe.invoices.listLineItems(inv.id!, { limit: 100 })).data).toHaveLength(3);
    const journal: { account_id: string; n: number; keys: number; total: string }[] = await db.query(
      `SELECT account_id, count(*)::int AS n, count(DISTINCT line_key)::int AS keys, sum(amount_minor)::text AS total FROM journal_lines WHERE period_id = $1 GROUP BY account_id`, [periodId]);
    expect(journal.map((j) => j.account_id).sort()).toEqual(bookers.filter((_, i) => kinds[i % 3] === 'internal').map((b) => b.account.id).sort());
    for (const j of journal) expect(j).toMatchObject({ n: 3, keys: 3, total: '13500' });
  });

  it('when Stripe refuses half its calls with 429 (rate limited), then the close waits and repeats them and finishes in one run with one invoice', async () => {
    const { fake, stripe, t } = w;
    const month = '2026-06';
    const people = await financeAgent(t);
    await monthRateCard(people.finance, month);
    const { instrument, configs } = await makeInstrument(t);
    // One external account, so its calls, and the fake's seeded draws, come in one fixed order.
    const industry = await makeBooker(t, { kind: 'industry' });
    await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.opa_signal, who: industry, startsAt: `${month}-09T13:00:00Z`, bookedHours: 2, actualEnd: `${month}-09T15:00:00Z`, confirmedBy: people.financeUser.id });
    const opened = await people.finance.post('/api/billing/periods').send({ month });
    const periodId = opened.body.period.id as string;

    fake.knobs.set({ errorRate: 0.5, errorKind: 'rate_limit', seed: 7 });
    try {
      const close = await people.finance.post(`/api/billing/periods/${periodId}/close`).send({});
      expect(await finishedJob(people.finance, close.body.job.id)).toMatchObject({ status: 'completed', done: 1, total: 1, errors: [] });
    } finally {
      fake.knobs.set({ errorRate: 0 });
    }
    const ours: Stripe.Invoice[] = [];
    for await (const inv of stripe.invoices.list({ limit: 100 })) if (inv.metadata?.femtoslot_period === periodId) ours.push(inv);
    expect(ours).toHaveLength(1);
    // By hand: 2 h × $260 = $520.00, in one line.
    expect(ours[0]!.total).toBe(52_000);
    expect((await stripe.invoices.listLineItems(ours[0]!.id!, { limit: 100 })).data).toHaveLength(1);
  });

  it('when a billed session is logged again, then it is refused as locked (409 log_locked)', async () => {
    const world = await monthWithThreeAccounts('2026-08');
    const opened = await world.finance.post('/api/billing/periods').send({ month: '2026-08' });
    const job = (await world.finance.post(`/api/billing/periods/${opened.body.period.id}/close`).send({})).body.job;
    expect((await finishedJob(world.finance, job.id)).status).toBe('completed');
    const { booking } = world.sessions[2]!;
    const r = await world.internal.agent.post(`/api/bookings/${booking.id}/usage`).send({
      actualStartsAt: '2026-08-10T13:00:00Z', actualEndsAt: '2026-08-10T14:00:00Z',
      segments: [{ configurationId: world.configs.shg.id, startsAt: '2026-08-10T13:00:00Z', endsAt: '2026-08-10T14:00:00Z', minNm: 400, maxNm: 400 }],
    });
    expect(r.status).toBe(409);
    expect(r.body.error.code).toBe('log_locked');
  });

  it('when invoices are listed and exported, then a collaborator sees only their organisation’s, and the PDF and CSVs carry the lines and totals', async () => {
    const { t, stripe } = w;
    const world = await monthWithThreeAccounts('2026-07');
    const { finance } = world;
    const opened = await finance.post('/api/billing/periods').send({ month: '2026-07' });
    const job = (await finance.post(`/api/billing/periods/${opened.body.period.id}/close`).send({})).body.job;
    expect((await finishedJob(finance, job.id)).status).toBe('completed');

    const mine = await world.academic.agent.get('/api/invoices');
    expect(mine.status).toBe(200);
    expect(mine.body.invoices.length).toBeGreaterThan(0);
    expect(mine.body.invoices.every((i: { organisationId: string }) => i.organisationId === world.academic.org.id)).toBe(true);
    const invoice = mine.body.invoices[0];
    expect(invoice.hostedInvoiceUrl).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/hosted\/invoices\/in_/);
    const foreign = (await finance.get('/api/invoices')).body.invoices.find((i: { accountId: string }) => i.accountId === world.industry.account.id);
    expect((await world.academic.agent.get(`/api/invoices/${foreign.id}.pdf`)).status).toBe(403);
    const member = await makePeople(t, ['member']);
    expect((await (await t.signIn(member.users.member!.email)).get('/api/invoices')).status).toBe(403);

    const pdf = await world.academic.agent.get(`/api/invoices/${invoice.id}.pdf`).buffer(true).parse(binary as unknown as Parameters<ReturnType<Agent['get']>['parse']>[0]);
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    const parser = new PDFParse({ data: new Uint8Array(pdf.body as Buffer) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    expect(text).toContain('3 h 15 min (rounded up from 3 h 4 min) × $137.50/h DFG class, external academic');
    expect(text).toContain('Total $446.88');
    expect(text).toContain(invoice.number);

    const csv = await finance.get('/api/invoices/export.csv');
    expect(csv.headers['content-type']).toMatch(/^text\/csv/);
    expect(csv.text).toContain('\r\n');
    const rows = parse(csv.text, { columns: true }) as Record<string, string>[];
    expect(rows.find((r) => r.number === invoice.number)).toMatchObject({ total: '446.88', currency: 'USD', kind: 'external', status: 'open' });
    const journals = parse((await finance.get('/api/journals/export.csv')).text, { columns: true }) as Record<string, string>[];
    const line = journals.find((r) => r.cost_centre === world.internal.account.costCentreCode);
    expect(line).toMatchObject({ amount: '60.00', amount_minor: '6000', currency: 'USD' });
    expect((await world.academic.agent.get('/api/journals/export.csv')).status).toBe(403);

    // Paid on the fake: its signed invoice.paid webhook marks our invoice paid.
    const [{ stripe_invoice_id: stripeInvoiceId }] = await t.api.ctx.db.query('SELECT stripe_invoice_id FROM invoices WHERE id = $1', [invoice.id]);
    await stripe.invoices.pay(stripeInvoiceId, { paid_out_of_band: true });
    const paid = await until(async () => {
      const r = await world.academic.agent.get('/api/invoices');
      const i = r.body.invoices.find((x: { id: string }) => x.id === invoice.id);
      return i.status === 'paid' ? i : null;
    });
    expect(paid.amountPaidMinor).toBe(44_688);
  });
});
