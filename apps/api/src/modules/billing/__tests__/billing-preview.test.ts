import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeBooker, makeInstrument } from '../../../test-support/booking-fixture';
import { makePeople } from '../../../test-support/test-api';
import { confirmedSession, endedBooking, financeAgent, monthRateCard, startBillingWorld, type BillingWorld } from './billing-fixture';

let w: BillingWorld;
beforeAll(async () => { w = await startBillingWorld(); }, 60_000);
afterAll(async () => { await w?.close(); });

describe('billing period preview', () => {
  it('when finance previews a month, then each account’s lines and total equal the lines computed by hand', async () => {
    const { t } = w;
    const { finance, financeUser } = await financeAgent(t);
    await monthRateCard(finance, '2026-10');
    const { instrument, configs } = await makeInstrument(t);
    const academic = await makeBooker(t, { kind: 'external_academic' });
    const internal = await makeBooker(t, { kind: 'internal' });
    // 13:04 is 09:04 in New York (EDT): all in October 2026 in the facility's zone.
    await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.dfg, who: academic, startsAt: '2026-10-06T13:00:00Z', bookedHours: 3, actualEnd: '2026-10-06T16:04:00Z', confirmedBy: financeUser.id });
    await endedBooking(t, { instrumentId: instrument.id, configuration: configs.opa_signal, who: academic, startsAt: '2026-10-14T13:00:00Z', hours: 3, status: 'cancelled', feePercent: 50, cancelledAt: '2026-10-12T14:00:00Z' });
    await endedBooking(t, { instrumentId: instrument.id, configuration: configs.fundamental, who: academic, startsAt: '2026-10-20T13:00:00Z', hours: 2, status: 'displaced' });
    await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.fundamental, who: internal, startsAt: '2026-10-07T13:00:00Z', bookedHours: 2, actualEnd: '2026-10-07T15:10:00Z', confirmedBy: financeUser.id });

    const r = await finance.post('/api/billing/periods').send({ month: '2026-10' });
    expect(r.status).toBe(200);
    expect(r.body.period.status).toBe('open');
    const ext = r.body.preview.accounts.find((a: { accountId: string }) => a.accountId === academic.account.id);
    // By hand: 3 h 4 min → 3 h 15 min × $137.50 = $446.875 → $446.88; fee 50 % × 3 h × $110 = $165.00; displaced 2 h: $0.
    expect(ext.lines.map((l: { kind: string; amountMinor: number }) => [l.kind, l.amountMinor])).toEqual([['usage', 44_688], ['cancellation_fee', 16_500], ['displacement', 0]]);
    expect(ext.lines[0].explanation).toBe('3 h 15 min (rounded up from 3 h 4 min) × $137.50/h DFG class, external academic');
    expect(ext.lines[1].explanation).toMatch(/^Cancellation fee 50 % of 3 h booked \(cancelled 47 h before the start\)/);
    expect(ext.totalMinor).toBe(61_188);
    const int = r.body.preview.accounts.find((a: { accountId: string }) => a.accountId === internal.account.id);
    // By hand: 2 h 10 min → 2 h 15 min × $60 = $135.00
    expect(int.lines.map((l: { amountMinor: number }) => l.amountMinor)).toEqual([13_500]);
    expect(r.body.preview.totalMinor).toBe(61_188 + 13_500);

    const again = await finance.post('/api/billing/periods').send({ month: '2026-10' });
    expect(again.body.period.id).toBe(r.body.period.id);
  });

  it('when the rate card charges a share of the changeover, then each session carries the changeover from the session before it on its source', async () => {
    const { t } = w;
    const { finance, financeUser } = await financeAgent(t);
    await monthRateCard(finance, '2026-03', { changeoverSharePercent: 50 });
    const { instrument, configs } = await makeInstrument(t);
    const academic = await makeBooker(t, { kind: 'external_academic' });
    const by = financeUser.id;
    await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.opa_signal, who: academic, startsAt: '2026-03-10T13:00:00Z', bookedHours: 2, actualEnd: '2026-03-10T15:00:00Z', confirmedBy: by });
    const second = await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.dfg, who: academic, startsAt: '2026-03-10T16:00:00Z', bookedHours: 2, actualEnd: '2026-03-10T18:00:00Z', confirmedBy: by });

    const r = await finance.post('/api/billing/periods').send({ month: '2026-03' });
    expect(r.status).toBe(200);
    const lines = r.body.preview.accounts.find((a: { accountId: string }) => a.accountId === academic.account.id).lines as { kind: string; bookingId: string; minutes: number; amountMinor: number }[];
    // By hand, from the changeover model makeInstrument stores (common practice figures, not a published source):
    // OPA signal → DFG is 45 min base + 5 min pulse check = 50 min; 50 % × 50/60 h × $137.50 = $57.2917 → $57.29.
    // The first session has nothing before it on this source, so it carries no changeover line.
    expect(lines.map((l) => [l.kind, l.minutes, l.amountMinor])).toEqual([['usage', 120, 22_000], ['usage', 120, 27_500], ['changeover', 50, 5_729]]);
    expect(lines[2]!.bookingId).toBe(second.booking.id);
    // The single-booking price preview reads the same predecessor.
    const single = await finance.post('/api/rate-cards/preview').send({ bookingId: second.booking.id });
    expect(single.body.lines.map((l: { kind: string; amountMinor: number }) => [l.kind, l.amountMinor])).toEqual([['usage', 27_500], ['changeover', 5_729]]);
  });

  it('when finance asks what a booking would cost, then the rate-card preview explains its lines', async () => {
    const { t } = w;
    const { finance, financeUser } = await financeAgent(t);
    await monthRateCard(finance, '2026-06', { minimumChargeMinutes: 60 });
    const { instrument, configs } = await makeInstrument(t);
    const industry = await makeBooker(t, { kind: 'industry' });
    const { booking } = await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.opa_idler, who: industry, startsAt: '2026-06-03T14:00:00Z', bookedHours: 1, actualEnd: '2026-06-03T14:40:00Z', confirmedBy: financeUser.id });
    const r = await finance.post('/api/rate-cards/preview').send({ bookingId: booking.id });
    expect(r.status).toBe(200);
    expect(r.body.basis).toBe('confirmed_log');
    // By hand: 40 min used, 1 h minimum charge × $260 = $260.00
    expect(r.body.lines[0].amountMinor).toBe(26_000);
    expect(r.body.lines[0].explanation).toBe('1 h (minimum charge; 40 min used) × $260.00/h standard class, industry');
  });

  it('when a second rate card overlaps an existing one, then PostgreSQL refuses it (409)', async () => {
    const { finance } = await financeAgent(w.t);
    await monthRateCard(finance, '2026-05');
    const r = await finance.post('/api/rate-cards').send({ name: 'Overlap', effectiveFrom: '2026-05-15', effectiveTo: '2026-05-20', currency: 'USD', rates: { internal: { standard: 1, dfg: 1 }, external_academic: { standard: 1, dfg: 1 }, industry: { standard: 1, dfg: 1 } } });
    expect(r.status).toBe(409);
    expect(r.body.error.code).toBe('overlap');
  });

  it('when someone other than finance opens or closes a period, then it is refused (403)', async () => {
    const { t } = w;
    const { finance, staff } = await financeAgent(t);
    const { users } = await makePeople(t, ['pi', 'admin']);
    const period = await finance.post('/api/billing/periods').send({ month: '2026-04' });
    for (const agent of [staff, await t.signIn(users.pi!.email), await t.signIn(users.admin!.email)]) {
      expect((await agent.post('/api/billing/periods').send({ month: '2026-04' })).status).toBe(403);
      expect((await agent.post(`/api/billing/periods/${period.body.period.id}/close`).send({})).status).toBe(403);
    }
    expect((await t.http().post(`/api/billing/periods/${period.body.period.id}/close`).send({})).status).toBe(401);
  });

  it('when a collaborator requests an external account with a PO file, then only a PDF is kept and the account waits for a PI’s approval', async () => {
    const { t } = w;
    const ext = await makeBooker(t, { kind: 'external_academic' });
    const pi = await makePeople(t, ['pi']);
    const agent = ext.agent;
    const notPdf = await agent.post('/api/accounts').field('kind', 'external').field('name', 'Second grant').field('billingContactEmail', 'ap@example.test').field('poNumber', 'PO-77')
      .attach('poFile', Buffer.from('just text'), 'po.pdf');
    expect(notPdf.status).toBe(415);
    const pdf = Buffer.from('%PDF-1.4\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n');
    const ok = await agent.post('/api/accounts').field('kind', 'external').field('name', 'Second grant').field('billingContactEmail', 'ap@example.test').field('poNumber', 'PO-77').field('taxId', 'DE123456789')
      .attach('poFile', pdf, 'po.pdf');
    expect(ok.status).toBe(201);
    expect(ok.body.account.status).toBe('pending');
    expect(ok.body.account.poFile).toEqual({ name: 'po.pdf', sizeBytes: pdf.length });
    // A PI of another organisation may not approve it; the collaborator may not either.
    expect((await (await t.signIn(pi.users.pi!.email)).post(`/api/accounts/${ok.body.account.id}/approve`).send({})).status).toBe(403);
    expect((await agent.post(`/api/accounts/${ok.body.account.id}/approve`).send({})).status).toBe(403);
  });

  it('when a cost-centre code has the wrong shape, then the request is refused with the field', async () => {
    const internal = await makeBooker(w.t, { kind: 'internal', role: 'pi' });
    const bad = await internal.agent.post('/api/accounts').send({ kind: 'cost_centre', name: 'Lab fund', costCentreCode: 'CC-12-3' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toEqual(['costCentreCode']);
    const ok = await internal.agent.post('/api/accounts').send({ kind: 'cost_centre', name: 'Lab fund', costCentreCode: 'CC-1234-567' });
    expect(ok.status).toBe(201);
    const approved = await internal.agent.post(`/api/accounts/${ok.body.account.id}/approve`).send({});
    expect(approved.status).toBe(200);
    expect(approved.body.account.status).toBe('approved');
  });
});
