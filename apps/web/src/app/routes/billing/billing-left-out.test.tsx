import { act } from 'react';
import { describe, expect, test } from 'vitest';
import { mockFetch, renderApp, setField, tick } from '../../../test/render-app';

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const finance = { id: id(80), email: 'f@x.test', name: 'Ida', role: 'finance', active: true, organisation: { id: id(90), name: 'Core', kind: 'internal' }, createdAt: '2026-01-01T00:00:00Z', invitationPending: false };
const period = { id: id(1), month: '2026-11', startsAt: '2026-11-01T04:00:00.000Z', endsAt: '2026-12-01T05:00:00.000Z', timeZone: 'America/New_York', status: 'open', closedAt: null };
const leftOut = (n: number, reason: string) => ({
  bookingId: id(200 + n), reason, bookingStatus: 'approved', usageLogId: reason === 'unlogged' ? null : id(300 + n),
  startsAt: `2026-11-0${n}T14:00:00.000Z`, endsAt: `2026-11-0${n}T17:00:00.000Z`, instrumentName: 'Aurora line', configurationName: 'OPA signal',
  userId: id(81), userName: 'Wren Okafor', userEmail: 'wren@x.test', accountId: id(50), accountName: 'Kestrel cost centre', organisationName: 'Kestrel Group',
});

async function until(el: HTMLElement, selector: string, tries = 150) {
  for (let i = 0; i < tries && !el.querySelector(selector); i += 1) await tick(1, 30);
  return el.querySelector<HTMLElement>(selector);
}
const click = (el: Element | null) => act(async () => (el as HTMLElement).click());

describe('billing page: months that cannot be billed and bookings left out', () => {
  test('when the month has not ended, then the API’s reason shows beside the month field', async () => {
    mockFetch((method, url) => {
      if (url === '/api/auth/me') return { status: 200, body: { user: finance } };
      if (url === '/api/facility') return { status: 200, body: { facility: { name: 'Core', timeZone: 'America/New_York', currency: 'USD' } } };
      if (url === '/api/billing/periods' && method === 'GET') return { status: 200, body: { periods: [] } };
      if (url === '/api/billing/periods' && method === 'POST') {
        return { status: 422, body: { error: { code: 'month_not_ended', message: '2026-12 has not ended yet: it ends at 2027-01-01 00:00 America/New_York', details: {} } } };
      }
      if (url === '/api/invoices' || url === '/api/accounts' || url === '/api/rate-cards') return { status: 200, body: { invoices: [], accounts: [], rateCards: [] } };
      return undefined;
    });
    const { el } = await renderApp('/billing');
    await setField((await until(el, '[data-testid="period-month"]')) as HTMLInputElement, '2026-12');
    await click(el.querySelector('[data-testid="open-period"]'));
    const error = await until(el, '[data-testid="field-error"]');
    expect(error?.textContent).toContain('ends at 2027-01-01 00:00 America/New_York');
  });

  test('when closing leaves two bookings out, then they are listed and Close waits for the tick, then sends their count', async () => {
    const calls = mockFetch((method, url) => {
      const ok = (body: unknown, status = 200) => ({ status, body });
      if (url === '/api/auth/me') return ok({ user: finance });
      if (url === '/api/facility') return ok({ facility: { name: 'Core', timeZone: 'America/New_York', currency: 'USD' } });
      if (url === '/api/billing/periods' && method === 'GET') return ok({ periods: [] });
      const detail = { period, preview: { currency: 'USD', accounts: [], totalMinor: 0 }, leftOut: [leftOut(3, 'unlogged'), leftOut(4, 'log_not_confirmed')], job: null };
      if (url === '/api/billing/periods' && method === 'POST') return ok(detail);
      if (url === `/api/billing/periods/${id(1)}`) return ok(detail);
      if (url === `/api/billing/periods/${id(1)}/close`) return ok({ period: { ...period, status: 'closing' }, job: null, started: true }, 202);
      if (url === '/api/invoices' || url === '/api/accounts' || url === '/api/rate-cards') return ok({ invoices: [], accounts: [], rateCards: [] });
      return undefined;
    });
    const { el } = await renderApp('/billing');
    await setField((await until(el, '[data-testid="period-month"]')) as HTMLInputElement, '2026-11');
    await click(el.querySelector('[data-testid="open-period"]'));
    const list = (await until(el, '[data-testid="left-out"]'))!;
    const rows = [...list.querySelectorAll<HTMLElement>('[data-testid="left-out-row"]')];
    expect(rows.map((r) => r.dataset.reason)).toEqual(['unlogged', 'log_not_confirmed']);
    // 14:00Z on 3 November 2026 is 09:00 EST (UTC−5, after the 1 November fall-back; IANA tz America/New_York).
    expect(rows[0]!.textContent).toContain('3 Nov 2026, 09:00–12:00');
    expect(rows[0]!.textContent).toContain('Wren Okafor');
    const closeButton = el.querySelector<HTMLButtonElement>('[data-testid="close-period"]')!;
    expect(closeButton.disabled).toBe(true);
    await click(el.querySelector('[data-testid="confirm-left-out"]'));
    expect(closeButton.disabled).toBe(false);
    await click(closeButton);
    await tick(5);
    expect(calls).toContain(`POST /api/billing/periods/${id(1)}/close {"leftOutCount":2}`);
  });
});
