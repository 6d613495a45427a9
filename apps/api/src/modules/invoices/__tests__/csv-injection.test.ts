import { parse } from 'csv-parse/sync';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Account } from '../../accounts/account.entity';
import { Configuration } from '../../instruments/configuration.entity';
import { Instrument } from '../../instruments/instrument.entity';
import { OutboxMessage } from '../../../lib/mail/outbox-message.entity';
import { makeBooker, makeInstrument, plusHours } from '../../../test-support/booking-fixture';
import { pastSession } from '../../../test-support/past-session';
import { confirmedSession, financeAgent, monthRateCard, startBillingWorld, until, type BillingWorld } from '../../billing/__tests__/billing-fixture';

let w: BillingWorld;
beforeAll(async () => { w = await startBillingWorld(); }, 60_000);
afterAll(async () => { await w?.close(); });

// OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection): cells that begin with = + - @ TAB or CR are
// run as formulas by spreadsheet programs; the guidance is to prefix such a cell with a single quote (and quote the
// field). RFC 4180: read back with csv-parse, an independent reader, so quoting and CRLF must be right too.
const HYPERLINK = '=HYPERLINK("http://x","y")';
const DDE = "-2+3+cmd|' /C calc'!A0";
const AT = '@SUM(1+1)*cmd';
const neutral = (s: string) => `'${s}`;
const rowsOf = (text: string) => parse(text, { columns: true }) as Record<string, string>[];

type Agent = Awaited<ReturnType<typeof financeAgent>>['finance'];
const binary = (res: NodeJS.ReadableStream, cb: (err: Error | null, body: unknown) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

describe('CSV exports neutralise formula cells', () => {
  it('when account names and a cost-centre code start with = - @, then the invoices and journal CSVs carry them quote-prefixed, amounts stay numbers, and Stripe, the PDF and the mail get the name unchanged', async () => {
    const { t, fake } = w;
    const month = '2026-04';
    const people = await financeAgent(t);
    await monthRateCard(people.finance, month);
    const { instrument, configs } = await makeInstrument(t);
    const industry = await makeBooker(t, { kind: 'industry' });
    const internal = await makeBooker(t, { kind: 'internal' });
    const db = t.api.ctx.db;
    await db.getRepository(Account).update({ id: industry.account.id }, { name: HYPERLINK });
    await db.getRepository(Account).update({ id: internal.account.id }, { name: AT, costCentreCode: DDE });
    const by = people.financeUser.id;
    await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.opa_signal, who: industry, startsAt: `${month}-09T13:00:00Z`, bookedHours: 2, actualEnd: `${month}-09T15:00:00Z`, confirmedBy: by });
    await confirmedSession(t, { instrumentId: instrument.id, configuration: configs.shg, who: internal, startsAt: `${month}-10T13:00:00Z`, bookedHours: 1, actualEnd: `${month}-10T13:50:00Z`, confirmedBy: by });
    const opened = await people.finance.post('/api/billing/periods').send({ month });
    const job = (await people.finance.post(`/api/billing/periods/${opened.body.period.id}/close`).send({})).body.job;
    const finished = await until(async () => {
      const r = await people.finance.get(`/api/billing/jobs/${job.id}`);
      return ['completed', 'failed'].includes(r.body.job.status) ? r.body.job : null;
    }, 30_000);
    expect(finished).toMatchObject({ status: 'completed', errors: [] });

    const invoicesCsv = await people.finance.get('/api/invoices/export.csv');
    expect(invoicesCsv.status).toBe(200);
    const invoices = rowsOf(invoicesCsv.text);
    const industryRow = invoices.find((r) => r.account === neutral(HYPERLINK));
    // By hand: 2 h × $260.00 (industry, standard class) = $520.00.
    expect(industryRow).toMatchObject({ total: '520.00', amount_paid: '0.00', currency: 'USD' });
    expect(invoices.some((r) => r.account === neutral(AT))).toBe(true);
    expect(invoicesCsv.text).not.toMatch(/(^|,|\r\n)"?=HYPERLINK/);

    const journals = rowsOf((await people.finance.get('/api/journals/export.csv')).text);
    const line = journals.find((r) => r.cost_centre === neutral(DDE));
    // By hand: 50 min rounds up to 1 h × $60.00 (internal, standard class) = $60.00.
    expect(line).toMatchObject({ amount: '60.00', amount_minor: '6000', currency: 'USD' });

    // Not spreadsheets: Stripe, the PDF and the invoice mail carry the name as it is.
    expect(Object.values(fake.state.data.customers).find((c) => c.metadata.femtoslot_account === industry.account.id)?.name).toBe(HYPERLINK);
    const listed = (await people.finance.get('/api/invoices')).body.invoices.find((i: { accountId: string }) => i.accountId === industry.account.id);
    expect(listed.accountName).toBe(HYPERLINK);
    const pdf = await (people.finance as Agent).get(`/api/invoices/${listed.id}.pdf`).buffer(true).parse(binary as unknown as Parameters<ReturnType<Agent['get']>['parse']>[0]);
    expect(pdf.status).toBe(200);
    const parser = new PDFParse({ data: new Uint8Array(pdf.body as Buffer) });
    const text = (await parser.getText()).text;
    await parser.destroy();
    expect(text).toContain(`Account: ${HYPERLINK}`);
    const notices = await db.getRepository(OutboxMessage).findBy({ template: 'invoice-notice' });
    expect(notices.some((n) => n.textBody.includes(`Hello ${HYPERLINK},`))).toBe(true);
  });

  it('when an instrument and a configuration are named like formulas, then the reports CSVs quote-prefix them and keep hours as numbers', async () => {
    const { t } = w;
    const { instrument, configs } = await makeInstrument(t);
    const db = t.api.ctx.db;
    await db.getRepository(Instrument).update({ id: instrument.id }, { name: HYPERLINK });
    await db.getRepository(Configuration).update({ id: configs.opa_signal.id }, { name: DDE });
    const me = await makeBooker(t);
    const start = new Date('2026-11-10T14:00:00Z');
    const b = await pastSession(t, { instrumentId: instrument.id, configuration: configs.opa_signal, accountId: me.account.id, userId: me.user.id, organisationId: me.org.id, startsAt: start, hours: 2, nm: 1300 });
    const logged = await me.agent.post(`/api/bookings/${b.id}/usage`).send({
      actualStartsAt: start.toISOString(), actualEndsAt: plusHours(start, 2).toISOString(),
      segments: [{ configurationId: configs.opa_signal.id, startsAt: start.toISOString(), endsAt: plusHours(start, 2).toISOString(), minNm: 1250, maxNm: 1400 }],
    });
    expect(logged.status).toBe(200);
    const { finance } = await financeAgent(t);
    const q = { from: '2026-11-01T00:00:00Z', to: '2026-11-30T00:00:00Z', instrumentId: instrument.id };

    const utilisation = rowsOf((await finance.get('/api/reports/utilisation.csv').query({ ...q, groupBy: 'month' })).text);
    expect(utilisation).toHaveLength(1);
    expect(utilisation[0]).toMatchObject({ instrument: neutral(HYPERLINK), booked_hours: '2', logged_hours: '2' });

    const coverage = rowsOf((await finance.get('/api/reports/tuning-coverage.csv').query(q)).text);
    expect(coverage).toEqual([{ starts_at: start.toISOString(), configuration: neutral(DDE), min_nm: '1250', max_nm: '1400' }]);
  });
});
