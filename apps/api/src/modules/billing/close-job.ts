import { localDate } from '@femtoslot/shared';
import { formatMoney } from '@femtoslot/shared/billing/money';
import { In, type EntityManager } from 'typeorm';
import type { AppContext } from '../../lib/context';
import { Account } from '../accounts/account.entity';
import { FacilitySettings } from '../facility/facility-settings.entity';
import { Invoice, type InvoiceStatus } from '../invoices/invoice.entity';
import { invoiceNoticeMail } from '../invoices/invoice-mail';
import { UsageLog } from '../usage/usage-log.entity';
import { BillingJob, BillingPeriod, BillingPeriodAccount, JournalLine, type BillingJobError } from './billing.entities';
import { BILLING_CLOSE_QUEUE } from './billing.service';
import { eachBounded, latestWins } from './bounded-work';
import { pushToStripe } from './stripe-push';

async function nextNumber(m: EntityManager, month: string, prefix: 'INV' | 'JNL'): Promise<string> {
  const [{ n }] = await m.query(`SELECT nextval('invoice_number_seq')::int AS n`);
  return `FS-${prefix}-${month.replace('-', '')}-${String(n).padStart(5, '0')}`;
}

/** What every account of one run shares: read once per run, not once per account. */
interface CloseRun { ctx: AppContext; period: BillingPeriod; billedBy: string; facility: FacilitySettings; accounts: Map<string, Account> }

function accountOf(run: CloseRun, accountId: string): Account {
  const account = run.accounts.get(accountId);
  if (!account) throw new Error(`account ${accountId} not found`);
  return account;
}

/**
 * Records one account as done, in one transaction: the invoice row, journal lines (internal), the logs marked
 * billed, the progress row. The row lock makes a second runner wait and then see that the account is done.
 */
async function recordDone(run: CloseRun, accountId: string, external: { status: InvoiceStatus; stripeInvoiceId: string; number: string | null; url: string | null; dueDate: string | null; amountPaid: number } | null): Promise<void> {
  const { ctx, period, billedBy, facility } = run;
  const account = accountOf(run, accountId);
  await ctx.db.transaction(async (m) => {
    const row = await m.getRepository(BillingPeriodAccount).findOne({ where: { periodId: period.id, accountId }, lock: { mode: 'pessimistic_write' } });
    if (!row || row.status === 'done') return;
    const internal = account.kind === 'cost_centre';
    const invoice = await m.getRepository(Invoice).save(m.getRepository(Invoice).create({
      periodId: period.id, accountId, organisationId: account.organisationId, number: await nextNumber(m, period.month, internal ? 'JNL' : 'INV'),
      kind: internal ? 'internal' : 'external', status: internal ? 'journal' : external?.status ?? 'paid', currency: row.currency.trim(), totalMinor: row.totalMinor,
      amountPaidMinor: external?.amountPaid ?? 0, paidAt: external?.status === 'paid' ? new Date() : null, lines: row.lines,
      poNumber: internal ? null : account.poNumber, stripeInvoiceId: external?.stripeInvoiceId ?? null, stripeInvoiceNumber: external?.number ?? null, hostedInvoiceUrl: external?.url ?? null, dueDate: external?.dueDate ?? null,
    }));
    if (internal && row.lines.length) {
      await m.getRepository(JournalLine).insert(row.lines.map((line) => ({
        periodId: period.id, accountId, invoiceId: invoice.id, costCentreCode: account.costCentreCode!, lineKey: line.key,
        amountMinor: line.amountMinor, currency: row.currency.trim(), description: `${line.label}: ${line.explanation}`,
      })));
    }
    const logIds = [...new Set(row.lines.filter((l) => l.kind === 'usage' && l.usageLogId).map((l) => l.usageLogId!))];
    if (logIds.length) await m.getRepository(UsageLog).update({ id: In(logIds) }, { status: 'billed', billedBy, billedAt: new Date() });
    await m.getRepository(BillingPeriodAccount).update({ periodId: period.id, accountId }, { status: 'done', invoiceId: invoice.id, lastError: null });
    if (!internal && external && account.billingContactEmail && row.totalMinor > 0) {
      await ctx.outbox.enqueue(m, account.billingContactEmail, invoiceNoticeMail({
        accountName: account.name, facility: facility.name, number: external.number ?? invoice.number, month: period.month,
        total: formatMoney(row.totalMinor, row.currency.trim()), dueDate: external.dueDate, url: external.url,
      }));
    }
  });
}

async function billAccount(run: CloseRun, row: BillingPeriodAccount): Promise<void> {
  const { ctx, period, facility } = run;
  const account = accountOf(run, row.accountId);
  if (account.kind === 'cost_centre' || row.totalMinor === 0) {
    // Internal groups are charged by journal; a zero statement has nothing to collect, so it needs no Stripe invoice.
    await recordDone(run, row.accountId, null);
    return;
  }
  const { stripeInvoice: inv } = await pushToStripe(ctx, period, row, row.lines, facility);
  await recordDone(run, row.accountId, {
    status: inv.status === 'paid' ? 'paid' : inv.status === 'void' ? 'void' : 'open', stripeInvoiceId: inv.id!, number: inv.number ?? null,
    url: inv.hosted_invoice_url ?? null, dueDate: inv.due_date ? localDate(new Date(inv.due_date * 1000), facility.timeZone) : null, amountPaid: inv.amount_paid ?? 0,
  });
}

const runnerLockKey = (jobId: string) => `billing-close:${jobId}`;

/**
 * Runs the close while holding a session advisory lock on a connection of its own. pg-boss keeps a job "active" for
 * its expiry (15 min) after the worker's process died; the lock, which PostgreSQL drops with the dead process's
 * connection, is what tells a restarted process that nobody is working the job any more.
 */
export async function runCloseJob(ctx: AppContext, jobId: string): Promise<void> {
  const runner = ctx.db.createQueryRunner();
  await runner.connect();
  try {
    const [{ ok }] = await runner.query(`SELECT pg_try_advisory_lock(hashtext($1)) AS ok`, [runnerLockKey(jobId)]);
    // Thrown, not skipped: pg-boss retries later, and by then the other runner has finished (or died).
    if (!ok) throw new Error(`billing close ${jobId} is being run by another worker`);
    try {
      await runClose(ctx, jobId);
    } finally {
      await runner.query(`SELECT pg_advisory_unlock(hashtext($1))`, [runnerLockKey(jobId)]).catch(() => undefined);
    }
  } finally {
    await runner.release();
  }
}

async function runnerLockFree(ctx: AppContext, jobId: string): Promise<boolean> {
  const [{ free }] = await ctx.db.query(
    `SELECT CASE WHEN pg_try_advisory_lock(hashtext($1)) THEN pg_advisory_unlock(hashtext($1)) ELSE false END AS free`, [runnerLockKey(jobId)]);
  return free;
}

/**
 * Accounts billed at once. Each account is idempotent and row-locked on its own, so the bound is only about load: it
 * overlaps the Stripe round trips of a few accounts (29 calls for 25 lines) without flooding Stripe or the pool.
 */
export const CLOSE_CONCURRENCY = 4;

/** One run of the close: the pending accounts, a few at a time; an account that fails is reported and left for the next run. */
async function runClose(ctx: AppContext, jobId: string): Promise<void> {
  const jobs = ctx.db.getRepository(BillingJob);
  const accounts = ctx.db.getRepository(BillingPeriodAccount);
  const job = await jobs.findOneBy({ id: jobId });
  if (!job || job.status === 'completed') return;
  await jobs.update({ id: jobId }, { status: 'running', startedAt: new Date(), errors: [] });
  const period = await ctx.db.getRepository(BillingPeriod).findOneByOrFail({ id: job.periodId });
  const facility = await ctx.db.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
  // Counted once; each account this run finishes adds one.
  let done = await accounts.countBy({ periodId: period.id, status: 'done' });
  const rows = await accounts.find({ where: { periodId: period.id, status: 'pending' }, order: { accountId: 'ASC' } });
  // Name, kind, cost centre and billing contact only; the Stripe customer is read under its own row lock.
  const byId = new Map((rows.length ? await ctx.db.getRepository(Account).findBy({ id: In(rows.map((r) => r.accountId)) }) : []).map((a) => [a.id, a]));
  const run: CloseRun = { ctx, period, billedBy: period.closeRequestedBy ?? job.requestedBy!, facility, accounts: byId };
  const errors: BillingJobError[] = [];
  const reportProgress = latestWins(() => jobs.update({ id: jobId }, { done, errors: [...errors] }).then(() => undefined));
  await eachBounded(rows, CLOSE_CONCURRENCY, async (row) => {
    try {
      await billAccount(run, row);
      done++;
    } catch (err) {
      // Report and go on: the account stays pending, and the next run resumes it with the same idempotency keys.
      const message = String((err as Error).message ?? err).slice(0, 500);
      errors.push({ accountId: row.accountId, message, at: new Date().toISOString() });
      await accounts.update({ periodId: period.id, accountId: row.accountId }, { lastError: message });
      ctx.logger.warn({ periodId: period.id, accountId: row.accountId, err: message }, 'billing close: account failed; it will be resumed');
    }
    await reportProgress();
  });
  const pending = await accounts.countBy({ periodId: period.id, status: 'pending' });
  if (pending === 0) await ctx.db.getRepository(BillingPeriod).update({ id: period.id }, { status: 'closed', closedAt: new Date() });
  await jobs.update({ id: jobId }, { status: pending === 0 ? 'completed' : 'failed', finishedAt: new Date(), done: await accounts.countBy({ periodId: period.id, status: 'done' }), errors });
}

/** Works the close queue; at start-up, a job left queued or running by a crash is queued again. */
export async function startBillingJobs(ctx: AppContext): Promise<void> {
  await ctx.outbox.work<{ jobId: string }>(BILLING_CLOSE_QUEUE, (data) => runCloseJob(ctx, data.jobId));
  const stranded: { id: string; active: boolean }[] = await ctx.db.query(
    `SELECT b.id, EXISTS (SELECT 1 FROM pgboss.job j WHERE j.name = $1 AND j.data->>'jobId' = b.id::text AND j.state = 'active') AS active
       FROM billing_jobs b WHERE b.status IN ('queued','running') AND NOT EXISTS (
       SELECT 1 FROM pgboss.job j WHERE j.name = $1 AND j.data->>'jobId' = b.id::text AND j.state IN ('created','retry'))`, [BILLING_CLOSE_QUEUE]);
  for (const s of stranded) {
    // "active" in pg-boss but nobody holds the runner lock: its worker was killed (kill -9, OOM, power), so run it again.
    if (s.active && !(await runnerLockFree(ctx, s.id))) continue;
    await ctx.outbox.sendJob(BILLING_CLOSE_QUEUE, { jobId: s.id });
  }
}
