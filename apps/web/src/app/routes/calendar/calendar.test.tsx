import { localDate, zonedToUtc } from '@femtoslot/shared';
import { act } from 'react';
import { describe, expect, test } from 'vitest';
import { mockFetch, renderApp, setField, tick } from '../../../test/render-app';

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const org = { id: id(90), name: 'Kestrel Group', kind: 'internal' };
const staff = { id: id(91), email: 's@x.test', name: 'Sam', role: 'staff', active: true, organisation: org, createdAt: '2026-01-01T00:00:00Z', invitationPending: false };
const source = id(1);
const signal = { id: id(12), instrumentId: source, key: 'opa_signal', name: 'OPA signal', outputKind: 'opa_signal', minNm: 1150, maxNm: 1600, defaultNm: 1300, rateClass: 'standard', requiredOdBands: [{ minNm: 700, maxNm: 3000, od: 5 }], retuneMinutesPerNm: 0.1 };
const dfg = { ...signal, id: id(14), key: 'dfg', name: 'DFG mid-IR', outputKind: 'dfg', minNm: 2600, maxNm: 11000, defaultNm: 4300 };
const soon = (hours: number) => new Date(Math.ceil(Date.now() / 3_600_000) * 3_600_000 + hours * 3_600_000).toISOString();
const detail = { userId: id(92), userName: 'Ida', organisationId: org.id, organisationName: org.name, accountId: id(50), accountName: 'CC-1', purpose: 'Carrier lifetime',
  targetMinNm: 1300, targetMaxNm: 1300, declineReason: null, cancellationFeePercent: null, alternatives: [], rebookedAs: null, changeoverBeforeMinutes: 10 };
// Anchored at 08:00 today in the facility's zone, so every test booking falls inside today's column of the visible week
// whatever the hour the suite runs (a booking crossing midnight would be drawn as two pieces).
const today = localDate(new Date(), 'America/New_York').split('-').map(Number) as [number, number, number];
const todayAt = (hours: number) => new Date(zonedToUtc({ year: today[0], month: today[1], day: today[2], hour: 8, minute: 0 }, 'America/New_York').getTime() + hours * 3_600_000).toISOString();
const booking = (n: number, conf: typeof signal, status: string, withDetail: boolean, from: number) => ({
  id: id(100 + n), instrumentId: source, configurationId: conf.id, configurationKey: conf.key, outputKind: conf.outputKind, status,
  startsAt: todayAt(from), endsAt: todayAt(from + 2), own: withDetail, detail: withDetail ? detail : null,
});

const checkAnswer = (eyewear: { id: string; label: string }[]) => ({
  ok: true, problems: [], derived: {}, eyewear, status: 'approved', cancellationPolicy: 'Free until 72 h before.',
  onTable: [{ role: 'pump_residual', minNm: 800, maxNm: 800 }, { role: 'signal', minNm: 1300, maxNm: 1300 }, { role: 'idler', minNm: 2080, maxNm: 2080 }],
  odByWavelength: [
    { role: 'pump_residual', minNm: 800, maxNm: 800, requiredOd: 7, eyewear },
    { role: 'signal', minNm: 1300, maxNm: 1300, requiredOd: 5, eyewear },
    { role: 'idler', minNm: 2080, maxNm: 2080, requiredOd: 5, eyewear },
  ],
  timeline: { before: null, after: null, overlaps: [], earliestStart: null },
});

function api(options: { eyewear: { id: string; label: string }[]; create?: { status: number; body: unknown } }) {
  return mockFetch((method, url) => {
    const ok = (body: unknown) => ({ status: 200, body });
    if (url === '/api/auth/me') return ok({ user: staff });
    if (url === '/api/facility') return ok({ facility: { name: 'Core', timeZone: 'America/New_York', currency: 'USD', policies: { minBookingHours: 1, maxBookingHours: 12, horizonDays: 60, externalLeadHours: 12, cancellationFreeHours: 72, cancellationHalfFeeHours: 24 } } });
    if (url === '/api/instruments') return ok({ instruments: [{ id: source, name: 'Aurora line', kind: 'source', description: '', pumpNm: 800 }] });
    if (url.startsWith('/api/configurations')) return ok({ configurations: [signal, dfg] });
    if (url === '/api/accounts') return ok({ accounts: [{ id: id(50), name: 'CC-1', kind: 'cost_centre', status: 'approved', usable: true, reason: null }] });
    if (url.startsWith('/api/bookings?')) {
      return ok({ bookings: [booking(1, signal, 'approved', true, 1), booking(2, dfg, 'requested', false, 4), booking(3, signal, 'displaced', true, 8)], maintenance: [], changeovers: [] });
    }
    if (url === '/api/bookings/check') return ok(checkAnswer(options.eyewear));
    if (url === '/api/bookings' && method === 'POST') return options.create;
    if (url === '/api/bookings/needs-rebooking' || url === '/api/bookings/pending') return ok({ bookings: [] });
    if (url === '/api/calendar/feed') return ok({ url: '/api/calendar/abc.ics' });
    return undefined;
  });
}

async function until(el: HTMLElement, selector: string) {
  for (let i = 0; i < 150 && !el.querySelector(selector); i += 1) await tick(1, 30);
  return el.querySelector(selector);
}

async function openRequestForm(el: HTMLElement) {
  await until(el, '[data-testid="new-request-button"]');
  await act(async () => (el.querySelector('[data-testid="new-request-button"]') as HTMLButtonElement).click());
  const form = (await until(el, '[data-testid="request-form"]')) as HTMLFormElement;
  await setField(form.querySelector('[name="configurationId"]')!, signal.id);
  await setField(form.querySelector('[name="targetValue"]')!, '1.3');
  await setField(form.querySelector('[name="unit"]')!, 'um');
  await setField(form.querySelector('[name="purpose"]')!, 'Carrier lifetime in InGaAs');
  await tick(25);
  return form;
}

describe('beam-time calendar page', () => {
  test("when the week loads, then bookings carry their status and id, others' read Busy, and displaced ones stay off the grid", async () => {
    api({ eyewear: [] });
    const { el } = await renderApp('/calendar');
    await until(el, '[data-testid="booking-event"]');
    const events = [...el.querySelectorAll<HTMLElement>('[data-testid="booking-event"]')];
    expect(events.map((e) => e.dataset.status).sort()).toEqual(['approved', 'requested']);
    expect(events.find((e) => e.dataset.bookingId === id(102))?.textContent).toContain('Busy · DFG mid-IR');
    expect(el.querySelector('[data-testid="not-on-grid"]')?.textContent).toContain('Displaced by maintenance');
    expect(el.querySelector('[data-testid="calendar"]')?.getAttribute('data-time-zone')).toBe('America/New_York');
  });

  test('when no eyewear covers the table, then the request cannot be sent and the officer is named', async () => {
    const calls = api({ eyewear: [] });
    const { el } = await renderApp('/calendar');
    const form = await openRequestForm(el);
    expect(form.querySelector('[data-testid="no-eyewear"]')?.textContent).toContain('No eyewear on the list is rated at the required OD for every wavelength on the table');
    expect((form.querySelector('[data-testid="submit-request"]') as HTMLButtonElement).disabled).toBe(true);
    // 1.3 µm = 1300 nm (1 µm = 1000 nm); the check goes out in nm
    expect(calls.some((c) => c.startsWith('POST /api/bookings/check') && c.includes('"targetNm":1300'))).toBe(true);
  });

  test('when the API refuses for the changeover, then needed and available show and one click moves the start keeping the length', async () => {
    const earliest = soon(30);
    api({
      eyewear: [{ id: id(300), label: 'NIR goggles' }],
      create: { status: 409, body: { error: { code: 'changeover_gap', message: 'Not enough changeover', details: { neededMinutes: 45, availableMinutes: 20, earliestStart: earliest } } } },
    });
    const { el } = await renderApp('/calendar');
    const form = await openRequestForm(el);
    expect(form.querySelector('[data-testid="eyewear-covering"]')?.textContent).toContain('NIR goggles');
    const pumpRow = form.querySelector<HTMLElement>('[data-testid="od-row"][data-role="pump_residual"]')!;
    expect(pumpRow.dataset.requiredOd).toBe('7');
    expect(pumpRow.textContent).toContain('NIR goggles');
    const length = form.querySelector<HTMLElement>('[data-testid="booking-length"]')!.dataset.minutes;
    await act(async () => (form.querySelector('[data-testid="submit-request"]') as HTMLButtonElement).click());
    await tick(10);
    const gap = form.querySelector('[data-testid="changeover-gap-error"]')!;
    expect(gap.textContent).toContain('Needed 45 min, available 20 min');
    await act(async () => (gap.querySelector('[data-testid="use-earliest-start"]') as HTMLButtonElement).click());
    await tick(3);
    const startTime = (form.querySelector('[name="startTime"]') as HTMLInputElement).value;
    const expected = new Intl.DateTimeFormat('en-GB', { timeZone: 'America/New_York', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(new Date(earliest));
    expect(startTime).toBe(expected);
    expect(form.querySelector<HTMLElement>('[data-testid="booking-length"]')!.dataset.minutes).toBe(length);
  });
});
