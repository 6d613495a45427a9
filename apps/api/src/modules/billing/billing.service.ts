import { localDate, type BillingCloseInput, type LeftOutSession } from '@femtoslot/shared';
import type { EntityManager } from 'typeorm';
import { In } from 'typeorm';
import { checkBillableMonth } from '@femtoslot/shared/billing/billing-month';
import { formatMoney } from '@femtoslot/shared/billing/money';
import type { SessionUser } from '../../lib/auth/session';
import type { AppContext } from '../../lib/context';
import { AppError, notFound } from '../../lib/errors/app-error';
import { recordAudit } from '../audit/audit.service';
import { FacilitySettings } from '../facility/facility-settings.entity';
import { BillingJob, BillingPeriod, BillingPeriodAccount } from './billing.entities';
import { leftOutSessions } from './left-out';
import { computeStatement, type AccountStatement } from './statement';

export const BILLING_CLOSE_QUEUE = 'billing-close';
const FREEZE_CHUNK = 50;

export const toPeriodDto = (p: BillingPeriod) => ({
  id: p.id, month: p.month, startsAt: p.startsAt.toISOString(), endsAt: p.endsAt.toISOString(), timeZone: p.timeZone, status: p.status,
  closedAt: p.closedAt?.toISOString() ?? null,
});

export const toJobDto = (j: BillingJob) => ({
  id: j.id, periodId: j.periodId, status: j.status, done: j.done, total: j.total, errors: j.errors,
  startedAt: j.startedAt?.toISOString() ?? null, finishedAt: j.finishedAt?.toISOString() ?? null,
});

function previewDto(accounts: AccountStatement[], currency: string) {
  const totalMinor = accounts.reduce((s, a) => s + a.totalMinor, 0);
  return {
    currency,
    accounts: accounts.map((a) => ({ ...a, totalFormatted: formatMoney(a.totalMinor, a.currency) })),
    totalMinor,
    totalFormatted: formatMoney(totalMinor, currency),
  };
}

const notEnded = (period: BillingPeriod) => new AppError('month_not_ended',
  `${period.month} has not ended yet in ${period.timeZone}; a period can be closed once its last day is over`, 422,
  { month: period.month, endsAt: period.endsAt.toISOString(), timeZone: period.timeZone });

export function billingService(ctx: AppContext) {
  const db = ctx.db;

  /** Year (facility zone) of the first booking ever made; null before the first one. */
  async function firstBookingYear(timeZone: string): Promise<number | null> {
    const [{ first }] = await db.query(`SELECT min(starts_at) AS first FROM timeline_blocks WHERE kind = 'booking'`);
    return first ? Number(localDate(new Date(first), timeZone).slice(0, 4)) : null;
  }

  /** What the statement leaves out; only while the period is open (a closing or closed one is frozen). */
  async function leftOutOf(m: EntityManager, period: BillingPeriod): Promise<LeftOutSession[] | null> {
    return period.status === 'open' ? leftOutSessions(m, period) : null;
  }

  /** The statement of a period: live while open, the frozen one once a close has started. */
  async function statementOf(m: EntityManager, period: BillingPeriod, facility: FacilitySettings): Promise<AccountStatement[]> {
    if (period.status === 'open') return computeStatement(m, facility, period);
    const rows = await m.getRepository(BillingPeriodAccount).findBy({ periodId: period.id });
    const live = await m.query(`SELECT a.id, a.name, a.kind, a.organisation_id, a.cost_centre_code, o.name AS org_name FROM accounts a JOIN organisations o ON o.id = a.organisation_id WHERE a.id = ANY($1)`, [rows.map((r) => r.accountId)]);
    const byId = new Map<string, { name: string; kind: 'cost_centre' | 'external'; organisation_id: string; cost_centre_code: string | null; org_name: string }>(live.map((r: { id: string }) => [r.id, r]));
    return rows.map((r) => {
      const a = byId.get(r.accountId)!;
      return { accountId: r.accountId, accountName: a.name, accountKind: a.kind, organisationId: a.organisation_id, organisationName: a.org_name, costCentreCode: a.cost_centre_code, currency: r.currency.trim(), lines: r.lines, totalMinor: r.totalMinor };
    }).sort((x, y) => x.accountName.localeCompare(y.accountName));
  }

  /** Creates the month's period (or returns the one there is) with its preview. */
  async function openPeriod(user: SessionUser, month: string) {
    const facility = await db.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
    const verdict = checkBillableMonth({ month, timeZone: facility.timeZone, now: new Date(), firstBookingYear: await firstBookingYear(facility.timeZone) });
    if (!verdict.ok) throw new AppError(verdict.code, verdict.message, 422, verdict.details);
    const bounds = verdict;
    await db.query(`INSERT INTO billing_periods (month, starts_at, ends_at, time_zone, created_by) VALUES ($1, $2, $3, $4, $5) ON CONFLICT (month) DO NOTHING`,
      [month, bounds.startsAt, bounds.endsAt, facility.timeZone, user.id]);
    const period = await db.getRepository(BillingPeriod).findOneByOrFail({ month });
    return detailOf(period, facility);
  }

  async function getPeriod(id: string) {
    const period = await db.getRepository(BillingPeriod).findOneBy({ id });
    if (!period) throw notFound('Billing period');
    return detailOf(period, await db.getRepository(FacilitySettings).findOneByOrFail({ id: 1 }));
  }

  async function detailOf(period: BillingPeriod, facility: FacilitySettings) {
    return {
      period: toPeriodDto(period), preview: previewDto(await statementOf(db.manager, period, facility), facility.currency.trim()),
      leftOut: await leftOutOf(db.manager, period), job: await latestJob(period.id),
    };
  }

  async function listPeriods() {
    const rows = await db.getRepository(BillingPeriod).find({ order: { month: 'DESC' } });
    return rows.map(toPeriodDto);
  }

  async function latestJob(periodId: string) {
    const job = await db.getRepository(BillingJob).findOne({ where: { periodId }, order: { createdAt: 'DESC' } });
    return job ? toJobDto(job) : null;
  }

  /**
   * Freezes the statement and queues the close job, in one transaction. A closed period is returned as it is; a
   * close already queued or running is returned instead of a second one; a failed one is started again, and
   * skips every account it already finished.
   */
  async function requestClose(user: SessionUser, periodId: string, input: BillingCloseInput, requestId?: string) {
    const out = await db.transaction(async (m) => {
      const period = await m.getRepository(BillingPeriod).findOne({ where: { id: periodId }, lock: { mode: 'pessimistic_write' } });
      if (!period) throw notFound('Billing period');
      const jobs = m.getRepository(BillingJob);
      if (period.status === 'closed') return { period, job: await jobs.findOne({ where: { periodId }, order: { createdAt: 'DESC' } }), started: false };
      const active = await jobs.findOne({ where: { periodId, status: In(['queued', 'running']) } });
      if (active) return { period, job: active, started: false };
      if (period.status === 'open') {
        if (period.endsAt.getTime() > Date.now()) throw notEnded(period);
        const leftOut = (await leftOutOf(m, period))!;
        if (leftOut.length > 0 && input.leftOutCount !== leftOut.length) {
          throw new AppError('left_out_not_confirmed',
            `${leftOut.length} booking${leftOut.length === 1 ? '' : 's'} in ${period.month} will not be billed (no log, an unconfirmed log, or never approved); confirm by sending leftOutCount: ${leftOut.length}`,
            422, { leftOutCount: leftOut.length, confirmedCount: input.leftOutCount ?? null, leftOut });
        }
        const facility = await m.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
        const statement = await computeStatement(m, facility, period);
        // In chunks: one statement per chunk keeps the round trips few and each query's text bounded.
        for (let i = 0; i < statement.length; i += FREEZE_CHUNK) {
          await m.getRepository(BillingPeriodAccount).insert(statement.slice(i, i + FREEZE_CHUNK).map((a) => (
            { periodId, accountId: a.accountId, currency: a.currency, lines: a.lines, totalMinor: a.totalMinor, status: 'pending' as const })));
        }
        period.status = 'closing';
        period.closeRequestedBy = user.id;
        await m.getRepository(BillingPeriod).save(period);
        await recordAudit(m, {
          actorUserId: user.id, action: 'billing_period.close_requested', entityType: 'billing_period', entityId: period.id, requestId,
          after: { leftOutCount: leftOut.length, leftOutBookingIds: leftOut.map((l) => l.bookingId) },
        });
      }
      const total = await m.getRepository(BillingPeriodAccount).countBy({ periodId });
      const done = await m.getRepository(BillingPeriodAccount).countBy({ periodId, status: 'done' });
      const job = await jobs.save(jobs.create({ periodId, status: 'queued', total, done, errors: [], requestedBy: user.id }));
      await ctx.outbox.sendJob(BILLING_CLOSE_QUEUE, { jobId: job.id }, {}, m);
      return { period, job, started: true };
    });
    return { period: toPeriodDto(out.period), job: out.job ? toJobDto(out.job) : null, started: out.started };
  }

  async function job(id: string) {
    const row = await db.getRepository(BillingJob).findOneBy({ id });
    if (!row) throw notFound('Billing job');
    return toJobDto(row);
  }

  return { openPeriod, getPeriod, listPeriods, requestClose, job };
}
