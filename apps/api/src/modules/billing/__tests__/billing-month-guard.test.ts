import { localDate } from '@femtoslot/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeBooker, makeInstrument } from '../../../test-support/booking-fixture';
import { pastSession } from '../../../test-support/past-session';
import { UsageLog } from '../../usage/usage-log.entity';
import { confirmedSession, financeAgent, monthRateCard, startBillingWorld, type BillingWorld } from './billing-fixture';

let w: BillingWorld;
beforeAll(async () => { w = await startBillingWorld(); }, 60_000);
afterAll(async () => { await w?.close(); });

const NY = 'America/New_York';

describe('billing months and what a close leaves out', () => {
  it('when finance opens year 0000, 2031-06, the month in progress or a month before the first booking year, then year 0000 is refused as no month (400) and the others (422) with the range that works', async () => {
    const { t } = w;
    const { finance } = await financeAgent(t);
    const { instrument, configs } = await makeInstrument(t);
    const who = await makeBooker(t, { kind: 'external_academic' });
    // The facility's first booking: January 2026, so 2026-01 is the earliest month a period may cover.
    await pastSession(t, { instrumentId: instrument.id, configuration: configs.fundamental, accountId: who.account.id, userId: who.user.id, organisationId: who.org.id, startsAt: new Date('2026-01-20T14:00:00Z'), hours: 2, nm: 800 });
    const current = localDate(new Date(), NY).slice(0, 7);

    // Year 0000 is no calendar month at all: the shared month schema refuses it before the billing rules run.
    const yearZero = await finance.post('/api/billing/periods').send({ month: '0000-01' });
    expect(yearZero.status).toBe(400);
    for (const month of ['2031-06', '2025-12']) {
      const r = await finance.post('/api/billing/periods').send({ month });
      expect(r.status, month).toBe(422);
      expect(r.body.error.code).toBe('month_out_of_range');
      expect(r.body.error.details).toMatchObject({ month, earliestMonth: '2026-01', timeZone: NY });
    }
    const running = await finance.post('/api/billing/periods').send({ month: current });
    expect(running.status).toBe(422);
    expect(running.body.error.code).toBe('month_not_ended');
    expect(running.body.error.details.endsAt).toMatch(/Z$/);
    expect(running.body.error.details.endsAtLocal).toMatch(/-01 00:00$/);
    expect((await finance.get('/api/billing/periods')).body.periods).toEqual([]);
  });

  it('when a period for the month in progress exists from before the check, then its close is refused (422) too', async () => {
    const { t } = w;
    const { finance, financeUser } = await financeAgent(t);
    const current = localDate(new Date(), NY).slice(0, 7);
    const [row] = await t.api.ctx.db.query(
      `INSERT INTO billing_periods (month, starts_at, ends_at, time_zone, created_by) VALUES ($1, now() - interval '3 days', now() + interval '20 days', $2, $3) RETURNING id`, [current, NY, financeUser.id]);
    const r = await finance.post(`/api/billing/periods/${row.id}/close`).send({});
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('month_not_ended');
  });

  it('when a month holds an unlogged session and an unconfirmed log, then the preview lists both and the close waits for the count to be confirmed', async () => {
    const { t } = w;
    const { finance, financeUser } = await financeAgent(t);
    await monthRateCard(finance, '2026-02');
    const { instrument, configs } = await makeInstrument(t);
    const who = await makeBooker(t, { kind: 'external_academic' });
    const billed = await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.fundamental, who, startsAt: '2026-02-03T14:00:00Z', bookedHours: 2, actualEnd: '2026-02-03T16:00:00Z', confirmedBy: financeUser.id });
    const session = (startsAt: string) => pastSession(t, { instrumentId: instrument.id, configuration: configs.opa_signal, accountId: who.account.id, userId: who.user.id, organisationId: who.org.id, startsAt: new Date(startsAt), hours: 3, nm: configs.opa_signal.defaultNm });
    const unlogged = await session('2026-02-11T14:00:00Z');
    const submitted = await session('2026-02-12T14:00:00Z');
    await t.api.ctx.db.getRepository(UsageLog).save({
      bookingId: submitted.id, status: 'submitted', actualStartsAt: submitted.startsAt, actualEndsAt: submitted.endsAt, outsideGrace: false, notes: '', attachmentIds: [],
      submittedBy: who.user.id, submittedAt: submitted.endsAt, confirmedBy: null, confirmedAt: null, billedBy: null, billedAt: null,
    } as Omit<UsageLog, 'id'>);

    const opened = await finance.post('/api/billing/periods').send({ month: '2026-02' });
    expect(opened.status).toBe(200);
    const leftOut = opened.body.leftOut as { bookingId: string; reason: string; userName: string; accountName: string; startsAt: string; endsAt: string; usageLogId: string | null }[];
    expect(leftOut.map((l) => [l.bookingId, l.reason])).toEqual([[unlogged.id, 'unlogged'], [submitted.id, 'log_not_confirmed']]);
    expect(leftOut[0]).toMatchObject({ userName: who.user.name, accountName: who.account.name, startsAt: '2026-02-11T14:00:00.000Z', endsAt: '2026-02-11T17:00:00.000Z', usageLogId: null });
    expect(leftOut.some((l) => l.bookingId === billed.booking.id)).toBe(false);
    const periodId = opened.body.period.id;

    const unconfirmed = await finance.post(`/api/billing/periods/${periodId}/close`).send({});
    expect(unconfirmed.status).toBe(422);
    expect(unconfirmed.body.error.code).toBe('left_out_not_confirmed');
    expect(unconfirmed.body.error.details.leftOutCount).toBe(2);
    const stale = await finance.post(`/api/billing/periods/${periodId}/close`).send({ leftOutCount: 1 });
    expect(stale.status).toBe(422);
    expect((await finance.get(`/api/billing/periods/${periodId}`)).body.period.status).toBe('open');

    const confirmed = await finance.post(`/api/billing/periods/${periodId}/close`).send({ leftOutCount: 2 });
    expect(confirmed.status).toBe(202);
  });
});
