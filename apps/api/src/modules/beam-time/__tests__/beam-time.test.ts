import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { hashPassword } from '../../../lib/auth/passwords';
import { makeBooker, makeInstrument } from '../../../test-support/booking-fixture';
import { pastSession } from '../../../test-support/past-session';
import { uniqueTag } from '../../../test-support/test-api';
import { Account } from '../../accounts/account.entity';
import { TimelineBlock } from '../../bookings/timeline-block.entity';
import { UsageLog } from '../../usage/usage-log.entity';
import { User } from '../../users/user.entity';
import { confirmedSession, endedBooking, financeAgent, monthRateCard, startBillingWorld, until, type BillingWorld } from '../../billing/__tests__/billing-fixture';

let w: BillingWorld;
beforeAll(async () => { w = await startBillingWorld(); }, 60_000);
afterAll(async () => { await w?.close(); });

/** Another person in an existing organisation, signed in. */
async function colleague(orgId: string, role: 'pi' | 'member') {
  const tag = uniqueTag();
  const user = await w.t.api.ctx.db.getRepository(User).save({ email: `${role}.${tag}@example.test`, name: `${role} ${tag}`, role, organisationId: orgId, passwordHash: await hashPassword('correct horse battery'), active: true });
  return { user, agent: await w.t.signIn(user.email) };
}

/**
 * An internal group with a PI, two members on two cost centres, a March closed into a journal and an April still open,
 * and an industry company next door. Months are facility-wide (rate cards, periods), so each test takes its own year. Test rate card (billing-fixture): internal $60.00/h standard, $75.00/h DFG class.
 */
async function groupWithSpend(year: number) {
  const { t } = w;
  const db = t.api.ctx.db;
  const people = await financeAgent(t);
  await monthRateCard(people.finance, `${year}-03`);
  await monthRateCard(people.finance, `${year}-04`);
  const { instrument, configs } = await makeInstrument(t);
  const first = await makeBooker(t, { kind: 'internal' });
  const second = await colleague(first.org.id, 'member');
  const secondAccount = await db.getRepository(Account).save({ organisationId: first.org.id, kind: 'cost_centre', name: `Second CC ${uniqueTag()}`, costCentreCode: `CC-${uniqueTag()}`, status: 'approved' } as Account);
  const pi = await colleague(first.org.id, 'pi');
  const industry = await makeBooker(t, { kind: 'industry' });
  const by = people.financeUser.id;
  const member2 = { user: second.user, org: first.org, account: secondAccount };
  // March, closed below: 64 min → 1 h 15 min × $60.00 = $75.00; 2 h DFG × $75.00 = $150.00.
  await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.opa_signal, who: first, startsAt: `${year}-03-03T14:00:00Z`, bookedHours: 2, actualEnd: `${year}-03-03T15:04:00Z`, confirmedBy: by });
  await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.dfg, who: member2, startsAt: `${year}-03-04T14:00:00Z`, bookedHours: 2, actualEnd: `${year}-03-04T16:00:00Z`, confirmedBy: by });
  const opened = await people.finance.post('/api/billing/periods').send({ month: `${year}-03` });
  const job = (await people.finance.post(`/api/billing/periods/${opened.body.period.id}/close`).send({})).body.job;
  await until(async () => ((await people.finance.get(`/api/billing/jobs/${job.id}`)).body.job.status === 'completed' ? true : null), 30_000);
  // April, not billed: 50 min → 1 h × $60.00 = $60.00 (confirmed); a 2 h DFG booking cancelled at a 50 % fee:
  // 2 h × $75.00 × 50 % = $75.00; a session only submitted (not confirmed) counts for nothing yet.
  await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.shg, who: first, startsAt: `${year}-04-07T13:00:00Z`, bookedHours: 1, actualEnd: `${year}-04-07T13:50:00Z`, confirmedBy: by });
  await endedBooking(t, { instrumentId: instrument.id, configuration: configs.dfg, who: member2, startsAt: `${year}-04-12T13:00:00Z`, hours: 2, status: 'cancelled', feePercent: 50, cancelledAt: `${year}-04-10T13:00:00Z` });
  const submitted = await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.opa_signal, who: first, startsAt: `${year}-04-08T13:00:00Z`, bookedHours: 2, actualEnd: `${year}-04-08T15:00:00Z`, confirmedBy: by });
  await db.getRepository(UsageLog).update({ id: submitted.log.id }, { status: 'submitted', confirmedBy: null, confirmedAt: null });
  // The company next door: 2 h × $260.00 = $520.00, never in the group's figures.
  await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.opa_signal, who: industry, startsAt: `${year}-04-09T13:00:00Z`, bookedHours: 2, actualEnd: `${year}-04-09T15:00:00Z`, confirmedBy: by });
  return { ...people, first, second, secondAccount, pi, industry, instrument, configs };
}

describe('group spend', () => {
  it('when a PI asks, then the group spend is billed journals plus unbilled confirmed usage and fees, per account, in minor units (sums by hand from the rate card)', async () => {
    const g = await groupWithSpend(2023);
    const r = await g.pi.agent.get('/api/groups/spend');
    expect(r.status).toBe(200);
    // Billed 7 500 + 15 000 = 22 500; unbilled 6 000 + 7 500 = 13 500; total 36 000 cents = $360.00.
    expect(r.body).toMatchObject({ scope: 'organisation', currency: 'USD', billedMinor: 22_500, unbilledMinor: 13_500, totalMinor: 36_000, totalFormatted: '$360.00', organisation: { id: g.first.org.id } });
    const byAccount = Object.fromEntries(r.body.accounts.map((a: { accountId: string; billedMinor: number; unbilledMinor: number; totalMinor: number }) => [a.accountId, [a.billedMinor, a.unbilledMinor, a.totalMinor]]));
    expect(byAccount).toEqual({ [g.first.account.id]: [7_500, 6_000, 13_500], [g.secondAccount.id]: [15_000, 7_500, 22_500] });
    expect(r.body.unbilledLines.map((l: { amountMinor: number }) => l.amountMinor).sort()).toEqual([6_000, 7_500]);

    // From April on, March's journal is left out.
    const april = await g.pi.agent.get('/api/groups/spend').query({ from: '2023-04' });
    expect(april.body).toMatchObject({ billedMinor: 0, unbilledMinor: 13_500, totalMinor: 13_500, from: '2023-04' });
  });

  it('when members ask, then each sees only the spend of their own bookings; another group is 403 for members and PIs', async () => {
    const g = await groupWithSpend(2024);
    const mine = await g.first.agent.get('/api/groups/spend');
    expect(mine.status).toBe(200);
    expect(mine.body).toMatchObject({ scope: 'own', billedMinor: 7_500, unbilledMinor: 6_000, totalMinor: 13_500 });
    const theirs = await g.second.agent.get('/api/groups/spend');
    expect(theirs.body).toMatchObject({ scope: 'own', billedMinor: 15_000, unbilledMinor: 7_500, totalMinor: 22_500 });
    expect((await g.first.agent.get('/api/groups/spend').query({ organisationId: g.industry.org.id })).status).toBe(403);
    expect((await g.pi.agent.get('/api/groups/spend').query({ organisationId: g.industry.org.id })).status).toBe(403);
    expect((await g.industry.agent.get('/api/groups/spend')).body).toMatchObject({ scope: 'own', unbilledMinor: 52_000, billedMinor: 0 });
  });

  it('when finance or staff ask, then they name any group (400 without one, 404 for an unknown one) and get its figures; bad queries are 400', async () => {
    const g = await groupWithSpend(2025);
    const other = await g.finance.get('/api/groups/spend').query({ organisationId: g.industry.org.id });
    expect(other.body).toMatchObject({ scope: 'organisation', billedMinor: 0, unbilledMinor: 52_000, totalFormatted: '$520.00' });
    expect((await g.staff.get('/api/groups/spend').query({ organisationId: g.first.org.id })).body.totalMinor).toBe(36_000);
    const missing = await g.finance.get('/api/groups/spend');
    expect(missing.status).toBe(400);
    expect(missing.body.error.code).toBe('validation_failed');
    expect((await g.finance.get('/api/groups/spend').query({ organisationId: '00000000-0000-4000-8000-000000000000' })).status).toBe(404);
    for (const bad of [{ from: 'April' }, { from: '2026-13' }, { organisationId: 'x' }, { surprise: '1' }]) {
      const r = await g.pi.agent.get('/api/groups/spend').query(bad);
      expect(r.status, JSON.stringify(bad)).toBe(400);
      expect(r.body.error.code).toBe('validation_failed');
    }
    expect((await w.t.http().get('/api/groups/spend')).status).toBe(401);
  });
});

describe('my beam time', () => {
  it('when a member opens it, then their own bookings that have not ended come soonest first with every status, and nobody else’s', async () => {
    const { t } = w;
    const { instrument, configs } = await makeInstrument(t);
    const me = await makeBooker(t);
    const neighbour = await colleague(me.org.id, 'member');
    const db = t.api.ctx.db;
    const at = (h: number) => new Date(Date.UTC(2030, 0, 7, 14) + h * 3_600_000);
    const mk = async (h: number, status: TimelineBlock['status'], userId = me.user.id) => {
      const b = await pastSession(t, { instrumentId: instrument.id, configuration: configs.opa_signal, accountId: me.account.id, userId, organisationId: me.org.id, startsAt: at(h), hours: 1, nm: 1300 });
      await db.getRepository(TimelineBlock).update({ id: b.id }, { status });
      return b.id;
    };
    const ids = [await mk(48, 'displaced'), await mk(0, 'approved'), await mk(24, 'requested'), await mk(72, 'cancelled'), await mk(96, 'declined')];
    await mk(120, 'approved', neighbour.user.id);
    const ended = await pastSession(t, { instrumentId: instrument.id, configuration: configs.opa_signal, accountId: me.account.id, userId: me.user.id, organisationId: me.org.id, startsAt: new Date('2026-01-05T14:00:00Z'), hours: 1, nm: 1300 });

    const r = await me.agent.get('/api/me/beam-time');
    expect(r.status).toBe(200);
    const list = r.body.bookings as { id: string; status: string; startsAt: string; instrumentName: string; configurationName: string; detail: { purpose: string } }[];
    expect(list.map((b) => b.id)).toEqual([ids[1], ids[2], ids[0], ids[3], ids[4]]);
    expect(list.map((b) => b.status)).toEqual(['approved', 'requested', 'displaced', 'cancelled', 'declined']);
    expect(list.map((b) => b.id)).not.toContain(ended.id);
    expect(list[0]).toMatchObject({ instrumentName: instrument.name, configurationName: configs.opa_signal.name, startsAt: at(0).toISOString(), detail: { purpose: 'past session' } });
    expect((await me.agent.get('/api/me/beam-time').query({ limit: 2 })).body.bookings).toHaveLength(2);
    expect((await me.agent.get('/api/me/beam-time').query({ limit: 0 })).status).toBe(400);
    expect((await t.http().get('/api/me/beam-time')).status).toBe(401);
  });
});
