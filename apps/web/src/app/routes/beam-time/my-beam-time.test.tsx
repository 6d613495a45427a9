import { describe, expect, test } from 'vitest';
import { mockFetch, renderApp, tick } from '../../../test/render-app';

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const org = { id: id(90), name: 'Kestrel Group', kind: 'internal' };
const person = (role: string) => ({ id: id(80), email: 'p@x.test', name: 'Ida', role, active: true, organisation: org, createdAt: '2026-01-01T00:00:00Z', invitationPending: false });
const facility = { facility: { name: 'Core', timeZone: 'America/New_York', currency: 'USD' } };
const booking = (n: number, status: string, startsAt: string) => ({
  id: id(200 + n), instrumentId: id(10), configurationId: id(20), configurationKey: 'opa_signal', outputKind: 'opa_signal', status, startsAt,
  endsAt: new Date(Date.parse(startsAt) + 2 * 3_600_000).toISOString(), own: true, instrumentName: 'Aurora line', configurationName: 'OPA signal',
  detail: { userId: id(80), userName: 'Ida', organisationId: org.id, organisationName: org.name, accountId: id(50), accountName: 'Kestrel CC', purpose: 'Gain dynamics', targetMinNm: 1310, targetMaxNm: 1310, declineReason: status === 'declined' ? 'Source down' : null, cancellationFeePercent: null, alternatives: [], rebookedAs: null, changeoverBeforeMinutes: null },
});
const amounts = (billed: number, unbilled: number) => ({
  billedMinor: billed, unbilledMinor: unbilled, totalMinor: billed + unbilled,
  billedFormatted: `$${(billed / 100).toFixed(2)}`, unbilledFormatted: `$${(unbilled / 100).toFixed(2)}`, totalFormatted: `$${((billed + unbilled) / 100).toFixed(2)}`,
});
const spend = (scope: 'organisation' | 'own') => ({
  scope, organisation: { id: org.id, name: org.name }, currency: 'USD', from: null, ...amounts(22_500, 13_500),
  accounts: [{ accountId: id(50), accountName: 'Kestrel CC', ...amounts(7_500, 6_000) }, { accountId: id(51), accountName: 'Second CC', ...amounts(15_000, 7_500) }],
  unbilledLines: [{ key: 'usage-1', bookingId: id(201), accountName: 'Kestrel CC', label: 'Beam time 2026-04-07 09:00–09:50, SHG', explanation: '1 h (rounded up from 50 min) × $60.00/h', amountMinor: 6_000, amountFormatted: '$60.00' }],
});

function api(role: string) {
  return mockFetch((_method, url) => {
    if (url === '/api/auth/me') return { status: 200, body: { user: person(role) } };
    if (url === '/api/facility') return { status: 200, body: facility };
    // 14:00 UTC on 8 Jan 2030 is 09:00 in New York (EST, UTC−5; IANA tz database).
    if (url === '/api/me/beam-time') return { status: 200, body: { bookings: [booking(1, 'approved', '2030-01-08T14:00:00.000Z'), booking(2, 'declined', '2030-01-09T14:00:00.000Z')] } };
    if (url === '/api/groups/spend') return { status: 200, body: spend(role === 'pi' ? 'organisation' : 'own') };
    return undefined;
  });
}

async function until(el: HTMLElement, selector: string) {
  for (let i = 0; i < 150 && !el.querySelector(selector); i += 1) await tick(1, 30);
  return el.querySelector<HTMLElement>(selector);
}

describe('my beam time page', () => {
  test('when a member opens it, then each booking shows its status, the facility time and a details link, and their own spend', async () => {
    const calls = api('member');
    const { el } = await renderApp('/beam-time');
    await until(el, '[data-testid="group-spend"]');
    const rows = [...el.querySelectorAll<HTMLElement>('[data-testid="my-booking-row"]')];
    expect(rows.map((r) => r.dataset.status)).toEqual(['approved', 'declined']);
    expect(rows[0]!.querySelector('[data-testid="my-booking-when"]')?.textContent).toBe("Tue, 8 Jan 2030, 09:00 GMT-5");
    expect(rows[1]!.textContent).toContain('Reason: Source down');
    expect(rows[0]!.querySelector('[data-testid="my-booking-details"]')?.getAttribute('href')).toBe(`/beam-time?booking=${id(201)}`);
    expect(el.querySelector('[data-testid="group-spend"]')?.getAttribute('data-scope')).toBe('own');
    expect(el.querySelector('[data-testid="spend-accounts"]')).toBeNull();
    expect(calls).toContain('GET /api/groups/spend');
  });

  test('when a PI opens it, then the group spend shows billed, not yet billed and total, by account', async () => {
    api('pi');
    const { el } = await renderApp('/beam-time');
    await until(el, '[data-testid="spend-accounts"]');
    expect(el.querySelector('[data-testid="spend-total"]')?.textContent).toBe('$360.00');
    expect([...el.querySelectorAll('[data-testid="spend-account-row"]')].map((r) => r.textContent)).toEqual(['Kestrel CC$75.00$60.00$135.00', 'Second CC$150.00$75.00$225.00']);
  });

  test('when finance opens it, then no spend is asked for (finance names a group elsewhere)', async () => {
    const calls = api('finance');
    const { el } = await renderApp('/beam-time');
    await until(el, '[data-testid="my-bookings"]');
    expect(calls.some((c) => c.includes('/api/groups/spend'))).toBe(false);
  });
});
