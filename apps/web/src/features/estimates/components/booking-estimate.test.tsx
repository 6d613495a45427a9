import { act } from 'react';
import { createRoot } from 'react-dom/client';
import { describe, expect, test } from 'vitest';
import { AppProvider, createQueryClient } from '../../../app/provider';
import { mockFetch, tick } from '../../../test/render-app';
import { BookingEstimate } from './booking-estimate';

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const body = { instrumentId: id(1), configurationId: id(2), startsAt: '2026-12-12T15:00:00Z', endsAt: '2026-12-12T18:00:00Z', targetNm: 4500, accountId: id(3) };
const estimate = {
  quoteNumber: 'FS-Q-20261204-ABC123', issuedOn: '2026-12-04', validUntil: '2027-01-03', facilityName: 'Core', timeZone: 'America/New_York', currency: 'USD',
  account: { id: id(3), name: 'Callow Bay', kind: 'external', poNumber: 'PO-1', organisationName: 'Callow Bay College', category: 'external academic' },
  instrument: { id: id(1), name: 'Aurora line' }, configuration: { id: id(2), name: 'DFG mid-IR', rateClass: 'dfg' }, wavelength: '4500 nm',
  startsAt: body.startsAt, endsAt: body.endsAt, startsAtLocal: '2026-12-12 10:00', endsAtLocal: '2026-12-12 13:00',
  rateCard: { id: id(4), name: 'Demo', effectiveFrom: '2026-09-01', billingIncrementMinutes: 15, minimumChargeMinutes: 60, changeoverSharePercent: 0 },
  changeoverMinutes: 50,
  lines: [{ key: 'booking-x', kind: 'usage', bookingId: id(5), usageLogId: null, label: 'Beam time', explanation: '3 h × $137.50/h DFG class, external academic', minutes: 180, rateMinorPerHour: 13_750, amountMinor: 41_250, category: 'external_academic', rateClass: 'dfg' }],
  totalMinor: 41_250,
  cancellation: {
    description: 'Free until 72 h before.',
    windows: [
      { percent: 0, from: null, until: '2026-12-09T15:00:00.000Z', fromLocal: null, untilLocal: '2026-12-09 10:00', amountMinor: 0, explanation: 'No fee' },
      { percent: 50, from: '2026-12-09T15:00:00.000Z', until: '2026-12-11T15:00:00.000Z', fromLocal: '2026-12-09 10:00', untilLocal: '2026-12-11 10:00', amountMinor: 20_625, explanation: '' },
      { percent: 100, from: '2026-12-11T15:00:00.000Z', until: '2026-12-12T15:00:00.000Z', fromLocal: '2026-12-11 10:00', untilLocal: '2026-12-12 10:00', amountMinor: 41_250, explanation: '' },
    ],
  },
};

async function render(b: typeof body | null) {
  const el = document.createElement('div');
  document.body.innerHTML = '';
  document.body.append(el);
  await act(async () => {
    createRoot(el).render(
      <AppProvider queryClient={createQueryClient()}>
        <BookingEstimate body={b} timeZone="America/New_York" />
      </AppProvider>,
    );
  });
  await tick(20);
  return el;
}

describe('booking estimate panel', () => {
  test('when the API prices the request, then the total, the changeover note and each cancellation window show in the facility zone', async () => {
    const calls = mockFetch((method, url) => (url === '/api/bookings/estimate' ? { status: 200, body: { estimate } } : undefined));
    const el = await render(body);
    expect(calls).toContain(`POST /api/bookings/estimate ${JSON.stringify(body)}`);
    expect(el.querySelector('[data-testid="estimate-total"]')?.textContent).toBe('$412.50');
    expect(el.textContent).toContain('50 min, absorbed by the facility');
    const windows = [...el.querySelectorAll<HTMLElement>('[data-testid="estimate-window"]')];
    // 15:00Z on 9 December 2026 is 10:00 EST (UTC−5; IANA tz America/New_York).
    expect(windows.map((w) => w.textContent)).toEqual(['Free until Wed, 9 Dec 2026, 10:00: $0.00', '50 % from Wed, 9 Dec 2026, 10:00: $206.25', '100 % from Fri, 11 Dec 2026, 10:00: $412.50']);
  });

  test('when no rate card covers the date, then the panel says so instead of a price', async () => {
    mockFetch((method, url) => (url === '/api/bookings/estimate' ? { status: 422, body: { error: { code: 'no_rate_card', message: 'No rate card is in force on 2031-06-02; finance must add one first' } } } : undefined));
    const el = await render(body);
    expect(el.querySelector('[data-testid="booking-estimate"]')?.getAttribute('data-state')).toBe('error');
    expect(el.textContent).toContain('No price yet: No rate card is in force on 2031-06-02');
  });

  test('when the request is not complete yet, then nothing is asked and nothing shows', async () => {
    const calls = mockFetch(() => undefined);
    const el = await render(null);
    expect(calls).toEqual([]);
    expect(el.querySelector('[data-testid="booking-estimate"]')).toBeNull();
  });
});
