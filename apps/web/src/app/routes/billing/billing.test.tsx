import { focusManager } from '@tanstack/react-query';
import { act } from 'react';
import { type Mock, describe, expect, test } from 'vitest';
import { mockFetch, renderApp, setField, tick } from '../../../test/render-app';

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const orgs = {
  internal: { id: id(90), name: 'Kestrel Group', kind: 'internal' },
  external: { id: id(91), name: 'Larchmont Sensors', kind: 'industry' },
};
const person = (role: string, org: keyof typeof orgs) => ({ id: id(80), email: 'p@x.test', name: 'Ida', role, active: true, organisation: orgs[org], createdAt: '2026-01-01T00:00:00Z', invitationPending: false });
const facility = { facility: { name: 'Core', timeZone: 'America/New_York', currency: 'USD' } };

const period = (status: string) => ({ id: id(1), month: '2026-03', startsAt: '2026-03-01T05:00:00.000Z', endsAt: '2026-04-01T04:00:00.000Z', timeZone: 'America/New_York', status, closedAt: status === 'closed' ? '2026-04-02T14:00:00.000Z' : null });
const line = (n: number, minutes: number, rate: number, amount: number, category: string) => ({
  key: `usage-${id(300 + n)}`, kind: 'usage', bookingId: id(200 + n), usageLogId: id(300 + n), label: `Beam time 2026-03-0${n} 09:00–13:00, OPA signal`,
  explanation: `${minutes / 60} h rounded up to the 15 min increment at ${rate / 100}/h`, minutes, rateMinorPerHour: rate, amountMinor: amount, category, rateClass: 'standard',
});
const preview = {
  currency: 'USD',
  accounts: [
    { accountId: id(50), accountName: 'Kestrel cost centre', accountKind: 'cost_centre', organisationId: orgs.internal.id, organisationName: orgs.internal.name, costCentreCode: 'CC-1234-567', currency: 'USD', lines: [line(1, 240, 6000, 24000, 'internal')], totalMinor: 24000 },
    { accountId: id(51), accountName: 'Larchmont PO 7781', accountKind: 'external', organisationId: orgs.external.id, organisationName: orgs.external.name, costCentreCode: null, currency: 'USD', lines: [line(2, 90, 26000, 39000, 'industry'), line(3, 15, 26000, 6500, 'industry')], totalMinor: 45500 },
  ],
  totalMinor: 69500,
};
const job = (status: string, done: number, errors: unknown[] = []) => ({ id: id(2), periodId: id(1), status, done, total: 2, errors, startedAt: null, finishedAt: null });
const invoice = (n: number, over: Record<string, unknown>) => ({
  id: id(400 + n), number: `FS-INV-202603-0000${n}`, periodId: id(1), month: '2026-03', accountId: id(51), accountName: 'Larchmont PO 7781', organisationId: orgs.external.id,
  kind: 'external', status: 'open', currency: 'USD', totalMinor: 45500, amountPaidMinor: 0, paidAt: null, dueDate: '2026-05-02', stripeInvoiceNumber: null,
  hostedInvoiceUrl: 'https://pay.stripe-fake.test/i/1', lines: [], pdfUrl: `/api/invoices/${id(400 + n)}.pdf`, ...over,
});

async function until(el: HTMLElement, selector: string, tries = 150) {
  for (let i = 0; i < tries && !el.querySelector(selector); i += 1) await tick(1, 30);
  return el.querySelector<HTMLElement>(selector);
}
const click = (el: Element | null) => act(async () => (el as HTMLElement).click());
const all = (el: HTMLElement, testId: string) => [...el.querySelectorAll<HTMLElement>(`[data-testid="${testId}"]`)];

describe('billing page', () => {
  test('when finance previews March, closes it and the job finishes, then lines, totals, progress and the issued invoices show', async () => {
    let closed = false;
    const jobAnswers = [job('running', 1), job('completed', 2)];
    const calls = mockFetch((method, url) => {
      const ok = (body: unknown, status = 200) => ({ status, body });
      if (url === '/api/auth/me') return ok({ user: person('finance', 'internal') });
      if (url === '/api/facility') return ok(facility);
      if (url === '/api/billing/periods' && method === 'GET') return ok({ periods: closed ? [period('closed')] : [] });
      if (url === '/api/billing/periods' && method === 'POST') return ok({ period: period('open'), preview, job: null });
      if (url === `/api/billing/periods/${id(1)}/close`) return ok({ period: period('closing'), job: job('queued', 0), started: true }, 202);
      if (url === `/api/billing/jobs/${id(2)}`) {
        const answer = jobAnswers.shift() ?? job('completed', 2);
        if (answer.status === 'completed') closed = true;
        return ok({ job: answer });
      }
      if (url === `/api/billing/periods/${id(1)}`) return ok({ period: period(closed ? 'closed' : 'closing'), preview, job: closed ? job('completed', 2) : job('queued', 0) });
      if (url === '/api/invoices') return ok({ invoices: closed ? [invoice(1, {}), invoice(2, { kind: 'internal', status: 'journal', accountId: id(50), accountName: 'Kestrel cost centre', hostedInvoiceUrl: null, dueDate: null, totalMinor: 24000, number: 'FS-JNL-202603-00002' })] : [] });
      if (url === '/api/rate-cards') return ok({ rateCards: [] });
      if (url === '/api/accounts') return ok({ accounts: [] });
      return undefined;
    });
    const { el } = await renderApp('/billing');
    const month = (await until(el, '[data-testid="period-month"]')) as HTMLInputElement;
    expect(el.querySelector('[data-testid="billing-page"]')).not.toBeNull();
    expect(el.querySelector('[data-testid="export-journal-csv"]')?.getAttribute('href')).toBe('/api/journals/export.csv');
    expect(el.querySelector('[data-testid="export-invoices-csv"]')?.getAttribute('href')).toBe('/api/invoices/export.csv');
    await setField(month, '2026-03');
    await click(el.querySelector('[data-testid="open-period"]'));
    await until(el, '[data-testid="period-preview"]');
    expect(calls).toContain('POST /api/billing/periods {"month":"2026-03"}');

    const accounts = all(el, 'preview-account');
    expect(accounts.map((a) => a.querySelectorAll('[data-testid="preview-line"]').length)).toEqual([1, 2]);
    expect(accounts[0]!.textContent).toContain('CC-1234-567');
    expect(accounts[1]!.textContent).toContain('1 h 30 min');
    expect(accounts[1]!.textContent).toContain('$260.00/h');
    expect(accounts[1]!.querySelector('[data-testid="preview-account-total"]')?.textContent).toBe('$455.00');
    const total = el.querySelector('[data-testid="preview-total"]')!;
    expect(total.getAttribute('data-amount-minor')).toBe('69500');
    expect(total.textContent).toBe('$695.00');

    await click(el.querySelector('[data-testid="close-period"]'));
    const bar = (await until(el, '[data-testid="close-progress"]'))!;
    expect(bar.getAttribute('role')).toBe('progressbar');
    await until(el, '[data-testid="close-progress"][data-status="completed"]', 200);
    expect(el.querySelector('[data-testid="close-progress"]')?.getAttribute('aria-valuenow')).toBe('100');
    const closedPart = (await until(el, '[data-testid="period-closed"] [data-testid="period-invoice"]', 200))?.closest('[data-testid="period-closed"]') as HTMLElement;
    expect(all(closedPart, 'period-invoice').map((r) => r.dataset.status)).toEqual(['open', 'journal']);
    expect(calls.filter((c) => c === `GET /api/billing/jobs/${id(2)}`).length).toBeGreaterThanOrEqual(2);
    expect(el.querySelector('[data-testid="close-period"]')).toBeNull();
    expect(all(el, 'invoice-row').length).toBe(2);
  }, 15_000);

  test('when a collaborator opens billing, then only their invoices and accounts show, an open invoice can be paid online, and it reads paid after returning', async () => {
    let paid = false;
    mockFetch((method, url) => {
      const ok = (body: unknown) => ({ status: 200, body });
      if (url === '/api/auth/me') return ok({ user: person('collaborator', 'external') });
      if (url === '/api/facility') return ok(facility);
      if (url === '/api/invoices') return ok({ invoices: [invoice(1, paid ? { status: 'paid', amountPaidMinor: 45500 } : {}), invoice(3, { status: 'void', number: 'FS-INV-202602-00003', month: '2026-02' })] });
      if (url === '/api/accounts') return ok({ accounts: [{ id: id(51), name: 'Larchmont PO 7781', kind: 'external', status: 'approved', poNumber: '7781', poExpiresOn: '2026-01-31', costCentreCode: null, usable: false, reason: 'PO 7781 expired on 2026-01-31' }] });
      return undefined;
    });
    const { el } = await renderApp('/billing');
    await until(el, '[data-testid="invoice-row"]');
    expect(el.querySelector('[data-testid="period-month"]')).toBeNull();
    expect(el.querySelector('[data-testid="rate-cards"]')).toBeNull();
    expect(el.querySelector('[data-testid="export-journal-csv"]')).toBeNull();
    const rows = all(el, 'invoice-row');
    expect(rows.map((r) => r.dataset.status)).toEqual(['open', 'void']);
    const pay = rows[0]!.querySelector<HTMLAnchorElement>('[data-testid="pay-invoice"]')!;
    expect(pay.href).toBe('https://pay.stripe-fake.test/i/1');
    expect(pay.target).toBe('_blank');
    expect(rows[1]!.querySelector('[data-testid="pay-invoice"]')).toBeNull();
    expect(rows[1]!.querySelector('[data-testid="invoice-pdf"]')?.getAttribute('href')).toBe(`/api/invoices/${id(403)}.pdf`);
    const account = (await until(el, '[data-testid="account-row"]'))!;
    expect(account.textContent).toContain('PO 7781 expired on 2026-01-31');
    expect(el.querySelector('[data-testid="account-form"]')?.getAttribute('data-kind')).toBe('external');
    expect(el.querySelector('[data-testid="approve-account"]')).toBeNull();

    paid = true;
    await act(async () => {
      focusManager.setFocused(false);
      focusManager.setFocused(true);
    });
    await until(el, '[data-testid="invoice-row"][data-status="paid"]');
    expect(el.querySelector('[data-testid="invoice-row"]')?.getAttribute('data-status')).toBe('paid');
    expect(el.querySelector('[data-testid="pay-invoice"]')).toBeNull();
    focusManager.setFocused(undefined);
  });

  test('when a PI approves a pending account and requests a cost centre, then the calls carry the id and only the cost-centre fields', async () => {
    let approved = false;
    const calls = mockFetch((method, url) => {
      const ok = (body: unknown, status = 200) => ({ status, body });
      if (url === '/api/auth/me') return ok({ user: person('pi', 'internal') });
      if (url === '/api/facility') return ok(facility);
      if (url === '/api/invoices') return ok({ invoices: [] });
      if (url === '/api/accounts' && method === 'GET') return ok({ accounts: [{ id: id(52), name: 'Kestrel lasers', kind: 'cost_centre', status: approved ? 'approved' : 'pending', poNumber: null, poExpiresOn: null, costCentreCode: 'CC-1111-222', usable: approved, reason: approved ? null : 'Waiting for approval by a PI' }] });
      if (url === `/api/accounts/${id(52)}/approve`) { approved = true; return ok({ account: { id: id(52), status: 'approved' } }); }
      if (url === '/api/accounts' && method === 'POST') return ok({ account: { id: id(53), name: 'Kestrel optics', kind: 'cost_centre', status: 'pending', poFile: null } }, 201);
      return undefined;
    });
    const { el } = await renderApp('/billing');
    const row = (await until(el, '[data-testid="account-row"]'))!;
    expect(row.dataset.status).toBe('pending');
    await click(row.querySelector('[data-testid="approve-account"]'));
    await until(el, '[data-testid="account-row"][data-status="approved"]');
    expect(calls).toContain(`POST /api/accounts/${id(52)}/approve`);
    expect(el.querySelector('[data-testid="approve-account"]')).toBeNull();

    const form = el.querySelector<HTMLFormElement>('[data-testid="account-form"]')!;
    expect(form.dataset.kind).toBe('cost_centre');
    await setField(form.querySelector('[name="name"]')!, 'Kestrel optics');
    await setField(form.querySelector('[name="costCentreCode"]')!, 'CC-12-3');
    await click(form.querySelector('[data-testid="save-account"]'));
    await tick(5);
    expect(form.querySelector('[data-testid="field-error"]')?.textContent).toContain('CC-1234-567');
    await setField(form.querySelector('[name="costCentreCode"]')!, 'cc-2222-333');
    await click(form.querySelector('[data-testid="save-account"]'));
    await tick(10);
    const post = calls.find((c) => c.startsWith('POST /api/accounts {'))!;
    expect(JSON.parse(post.slice(post.indexOf('{')))).toEqual({ kind: 'cost_centre', name: 'Kestrel optics', costCentreCode: 'CC-2222-333' });
    expect(form.querySelector<HTMLInputElement>('[name="name"]')!.value).toBe('');
  });

  test('when finance adds a rate card typed in dollars, then the body carries exact cents per hour', async () => {
    const card = { id: id(60), name: 'From January', effectiveFrom: '2026-01-01', effectiveTo: null, currency: 'USD', billingIncrementMinutes: 15, changeoverSharePercent: 0, minimumChargeMinutes: 0,
      rates: { internal: { standard: 6000, dfg: 7500 }, external_academic: { standard: 11000, dfg: 13750 }, industry: { standard: 26000, dfg: 32500 } } };
    const calls = mockFetch((method, url, body) => {
      const ok = (b: unknown, status = 200) => ({ status, body: b });
      if (url === '/api/auth/me') return ok({ user: person('finance', 'internal') });
      if (url === '/api/facility') return ok(facility);
      if (url === '/api/billing/periods') return ok({ periods: [] });
      if (url === '/api/invoices' || url === '/api/accounts') return ok({ invoices: [], accounts: [] });
      if (url === '/api/rate-cards' && method === 'GET') return ok({ rateCards: [card], cancellationPolicy: { cancellationFreeHours: 72, cancellationHalfFeeHours: 24, description: 'Free until 72 h before; 50 % until 24 h; 100 % after.' } });
      if (url === '/api/rate-cards' && method === 'POST') return ok({ rateCard: { ...card, ...(body as object), id: id(61) } }, 201);
      return undefined;
    });
    const { el } = await renderApp('/billing');
    const list = (await until(el, '[data-testid="rate-card"]'))!;
    expect(list.textContent).toContain('$137.50/h');
    expect(el.querySelector('[data-testid="cancellation-policy"]')?.textContent).toContain('Free until 72 h');
    await click(el.querySelector('[data-testid="add-rate-card"]'));
    const form = (await until(el, '[data-testid="rate-card-form"]'))!;
    await setField(form.querySelector('[name="name"]')!, 'From October');
    await setField(form.querySelector('[name="effectiveFrom"]')!, '2026-10-01');
    await setField(form.querySelector('[name="rates.external_academic.standard"]')!, '137.50');
    await setField(form.querySelector('[name="rates.external_academic.dfg"]')!, '171.88');
    await setField(form.querySelector('[name="rates.industry.standard"]')!, '0.3');
    await click(form.querySelector('[data-testid="save-rate-card"]'));
    await tick(10);
    const post = calls.find((c) => c.startsWith('POST /api/rate-cards'))!;
    const sent = JSON.parse(post.slice(post.indexOf('{')));
    expect(sent).toMatchObject({ name: 'From October', effectiveFrom: '2026-10-01', effectiveTo: null, currency: 'USD', billingIncrementMinutes: 15 });
    expect(sent.rates).toEqual({ internal: { standard: 6000, dfg: 7500 }, external_academic: { standard: 13750, dfg: 17188 }, industry: { standard: 30, dfg: 32500 } });
  });
  test('when a collaborator requests an external account with a PO file, then it goes as multipart with the fields and the PDF', async () => {
    mockFetch((method, url) => {
      const ok = (body: unknown, status = 200) => ({ status, body });
      if (url === '/api/auth/me') return ok({ user: person('collaborator', 'external') });
      if (url === '/api/facility') return ok(facility);
      if (url === '/api/invoices') return ok({ invoices: [] });
      if (url === '/api/accounts' && method === 'GET') return ok({ accounts: [] });
      if (url === '/api/accounts' && method === 'POST') return ok({ account: { id: id(54), name: 'Larchmont 2027', kind: 'external', status: 'pending', poFile: { name: 'po.pdf', sizeBytes: 9 } } }, 201);
      return undefined;
    });
    const { el } = await renderApp('/billing');
    const form = (await until(el, '[data-testid="account-form"]')) as HTMLFormElement;
    await setField(form.querySelector('[name="name"]')!, 'Larchmont 2027');
    await setField(form.querySelector('[name="billingContactEmail"]')!, 'ap@larchmont.test');
    await setField(form.querySelector('[name="poNumber"]')!, 'PO-2027-01');
    await setField(form.querySelector('[name="poExpiresOn"]')!, '2027-06-30');
    const input = form.querySelector<HTMLInputElement>('[data-testid="po-file"] input[type=file]')!;
    Object.defineProperty(input, 'files', { value: [new File(['%PDF-1.4\n'], 'po.pdf', { type: 'application/pdf' })], configurable: true });
    await act(async () => input.dispatchEvent(new Event('change', { bubbles: true })));
    await click(form.querySelector('[data-testid="save-account"]'));
    await tick(10);
    const call = (globalThis.fetch as Mock).mock.calls.find(([url, init]) => url === '/api/accounts' && init?.method === 'POST')!;
    const body = call[1].body as FormData;
    expect(body).toBeInstanceOf(FormData);
    expect(Object.fromEntries([...body.entries()].filter(([k]) => k !== 'poFile'))).toEqual({ kind: 'external', name: 'Larchmont 2027', billingContactEmail: 'ap@larchmont.test', poNumber: 'PO-2027-01', poExpiresOn: '2027-06-30' });
    expect((body.get('poFile') as File).name).toBe('po.pdf');
  });
});
