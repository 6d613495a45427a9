import { PDFParse } from 'pdf-parse';
import type { Agent } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeBooker, makeInstrument } from '../../../test-support/booking-fixture';
import { pastSession } from '../../../test-support/past-session';
import { Account } from '../../accounts/account.entity';
import { confirmedSession, financeAgent, monthRateCard, startBillingWorld, until, type BillingWorld } from '../../billing/__tests__/billing-fixture';

let w: BillingWorld;
beforeAll(async () => { w = await startBillingWorld(); }, 60_000);
afterAll(async () => { await w?.close(); });

const binary = (res: { on: (e: string, f: (c?: Buffer) => void) => void }, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c) => chunks.push(c!));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

/** A summer month of its own (EDT throughout), a rate card with a 50 % changeover share, an internal OPA-signal session 13:00–15:00Z on the 15th. */
async function monthWorld(month: string) {
  const { t } = w;
  const people = await financeAgent(t);
  await monthRateCard(people.finance, month, { changeoverSharePercent: 50 });
  const { instrument, configs } = await makeInstrument(t);
  const academic = await makeBooker(t, { kind: 'external_academic' });
  const internal = await makeBooker(t, { kind: 'internal' });
  await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.opa_signal, who: internal, startsAt: `${month}-15T13:00:00Z`, bookedHours: 2, actualEnd: `${month}-15T15:00:00Z`, confirmedBy: people.financeUser.id });
  // 16:00–19:00Z is 12:00–15:00 EDT (UTC−4 from March to November; IANA tz America/New_York).
  const body = {
    instrumentId: instrument.id, configurationId: configs.dfg.id, startsAt: `${month}-15T16:00:00Z`, endsAt: `${month}-15T19:00:00Z`,
    targetNm: configs.dfg.defaultNm, accountId: academic.account.id,
  };
  return { ...people, instrument, configs, academic, internal, body };
}

describe('price estimate before booking', () => {
  it('when a collaborator asks what a DFG booking after an OPA-signal session costs, then the lines and the cancellation fees equal the hand calculation, with window dates in the facility zone', async () => {
    const { academic, body } = await monthWorld('2026-09');
    const r = await academic.agent.post('/api/bookings/estimate').send(body);
    expect(r.status).toBe(200);
    const e = r.body.estimate;
    // By hand: 3 h × $137.50 (DFG class, external academic) = $412.50 → 41 250 ¢.
    // Changeover OPA signal → DFG: 45 min base + 5 min pulse check = 50 min (the changeover model makeInstrument stores,
    // common practice figures); 50 % share × 50/60 h × $137.50 = $57.2917 → 5 729 ¢ (half-up).
    expect(e.lines.map((l: { kind: string; minutes: number; amountMinor: number }) => [l.kind, l.minutes, l.amountMinor])).toEqual([['usage', 180, 41_250], ['changeover', 50, 5_729]]);
    expect(e.totalMinor).toBe(46_979);
    expect(e.changeoverMinutes).toBe(50);
    expect(e).toMatchObject({ currency: 'USD', startsAtLocal: '2026-09-15 12:00', endsAtLocal: '2026-09-15 15:00', timeZone: 'America/New_York', wavelength: `${body.targetNm} nm` });
    // Facility policy 72 h / 24 h: free until 2026-09-12 12:00 EDT; 50 % = 3 h × $137.50 × 0.5 = $206.25; 100 % = $412.50 (by hand).
    expect(e.cancellation.windows.map((x: { percent: number; fromLocal: string | null; untilLocal: string; amountMinor: number }) => [x.percent, x.fromLocal, x.untilLocal, x.amountMinor])).toEqual([
      [0, null, '2026-09-12 12:00', 0],
      [50, '2026-09-12 12:00', '2026-09-14 12:00', 20_625],
      [100, '2026-09-14 12:00', '2026-09-15 12:00', 41_250],
    ]);
    expect(e.quoteNumber).toMatch(/^FS-Q-\d{8}-[0-9A-F]{6}$/);
  });

  it('when the booking is made, logged for exactly the booked time, confirmed and the month closed, then the invoice lines equal the estimate', async () => {
    const { t } = w;
    const { academic, body, configs, finance, staff } = await monthWorld('2026-08');
    const estimate = (await academic.agent.post('/api/bookings/estimate').send(body)).body.estimate;
    // Booked as the API would store it (the API cannot book the past), then logged and confirmed through the API.
    const booking = await pastSession(t, { instrumentId: body.instrumentId, configuration: configs.dfg, accountId: academic.account.id, userId: academic.user.id, organisationId: academic.org.id, startsAt: new Date(body.startsAt), hours: 3, nm: body.targetNm });
    const logged = await academic.agent.post(`/api/bookings/${booking.id}/usage`).send({
      actualStartsAt: body.startsAt, actualEndsAt: body.endsAt,
      segments: [{ configurationId: configs.dfg.id, startsAt: body.startsAt, endsAt: body.endsAt, minNm: body.targetNm, maxNm: body.targetNm }],
    });
    expect(logged.status, JSON.stringify(logged.body)).toBeLessThan(300);
    const logId = logged.body.log?.id ?? logged.body.id;
    expect((await staff.post(`/api/usage/${logId}/confirm`).send({})).status).toBeLessThan(300);

    const opened = await finance.post('/api/billing/periods').send({ month: '2026-08' });
    expect(opened.status).toBe(200);
    const close = await finance.post(`/api/billing/periods/${opened.body.period.id}/close`).send({ leftOutCount: opened.body.leftOut.length });
    expect(close.status).toBe(202);
    await until(async () => ((await finance.get(`/api/billing/jobs/${close.body.job.id}`)).body.job.status === 'completed'), 30_000);
    const invoice = (await finance.get('/api/invoices')).body.invoices.find((i: { accountId: string; month: string }) => i.accountId === academic.account.id && i.month === '2026-08');
    const pick = (lines: { kind: string; minutes: number; rateMinorPerHour: number; amountMinor: number; explanation: string }[]) =>
      lines.map((l) => ({ kind: l.kind, minutes: l.minutes, rate: l.rateMinorPerHour, amount: l.amountMinor, explanation: l.explanation }));
    expect(pick(invoice.lines)).toEqual(pick(estimate.lines));
    expect(invoice.totalMinor).toBe(estimate.totalMinor);
  });

  it('when the quote PDF is asked for, then it carries the quote number, account, times, lines, total and cancellation terms, names intact', async () => {
    const { t } = w;
    const { academic, body } = await monthWorld('2026-07');
    await t.api.ctx.db.getRepository(Account).update({ id: academic.account.id }, { name: 'ΔΦ Labs Łódź' });
    const r = await (academic.agent as Agent).post('/api/bookings/estimate.pdf').send(body).buffer(true).parse(binary as never);
    expect(r.status).toBe(200);
    expect(r.headers['content-type']).toBe('application/pdf');
    const parser = new PDFParse({ data: new Uint8Array(r.body as Buffer) });
    const text = (await parser.getText()).text.replace(/\s+/g, ' ');
    await parser.destroy();
    for (const part of ['Quote FS-Q-', 'Valid until', 'ΔΦ Labs Łódź', '2026-07-15 12:00 to 2026-07-15 15:00 (America/New_York)', 'Estimated total $469.79', '50 % — $206.25', '100 % — $412.50']) {
      expect(text, part).toContain(part);
    }
  });

  it('when the account is another organisation’s, the body is malformed or no rate card covers the date, then it is refused with the reason', async () => {
    const { academic, body } = await monthWorld('2026-06');
    const other = await makeBooker(w.t, { kind: 'industry' });
    const foreign = await academic.agent.post('/api/bookings/estimate').send({ ...body, accountId: other.account.id });
    expect(foreign.status).toBe(422);
    expect(foreign.body.error.code).toBe('account_unusable');
    const bad = await academic.agent.post('/api/bookings/estimate').send({ ...body, endsAt: body.startsAt });
    expect(bad.status).toBe(400);
    const noCard = await academic.agent.post('/api/bookings/estimate').send({ ...body, startsAt: '2031-06-02T14:00:00Z', endsAt: '2031-06-02T16:00:00Z' });
    expect(noCard.status).toBe(422);
    expect(noCard.body.error.code).toBe('no_rate_card');
    expect((await w.t.http().post('/api/bookings/estimate').send(body)).status).toBe(401);
  });
});
