import { act } from 'react';
import { describe, expect, test } from 'vitest';
import { formatInstant, viewerTimeZone } from '../../../lib/wall-time';
import { mockFetch, renderApp, setField, tick } from '../../../test/render-app';

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const org = { id: id(90), name: 'Kestrel Group', kind: 'internal' };
const member = { id: id(91), email: 'm@x.test', name: 'Mo', role: 'member', active: true, organisation: org, createdAt: '2026-01-01T00:00:00Z', invitationPending: false };
const source = id(1);
const signal = { id: id(12), instrumentId: source, key: 'opa_signal', name: 'OPA signal', outputKind: 'opa_signal', minNm: 1150, maxNm: 1600, defaultNm: 1300, rateClass: 'standard', requiredOdBands: [{ minNm: 1150, maxNm: 1600, od: 5 }], retuneMinutesPerNm: 0.1 };
const facilityZone = 'America/New_York';
const earliest = new Date(Math.ceil(Date.now() / 3_600_000) * 3_600_000 + 50 * 3_600_000).toISOString();
const isoInstant = /\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/;
const neighbour = (neededMinutes: number, availableMinutes: number) => ({ neighbourId: id(200), neededMinutes, availableMinutes, shortfallMinutes: Math.max(0, neededMinutes - availableMinutes) });

type Timeline = { before: ReturnType<typeof neighbour> | null; after: ReturnType<typeof neighbour> | null; overlaps: string[]; earliestStart: string | null; overlapsMaintenance?: boolean };

function api(timeline: Timeline, problems: { code: string; message: string }[], create?: { status: number; body: unknown }) {
  return mockFetch((method, url) => {
    const ok = (body: unknown) => ({ status: 200, body });
    if (url === '/api/auth/me') return ok({ user: member });
    if (url === '/api/facility') return ok({ facility: { name: 'Core', timeZone: facilityZone, currency: 'USD', policies: { minBookingHours: 1, maxBookingHours: 12, horizonDays: 60, externalLeadHours: 12, cancellationFreeHours: 72, cancellationHalfFeeHours: 24 } } });
    if (url === '/api/instruments') return ok({ instruments: [{ id: source, name: 'Aurora line', kind: 'source', description: '', pumpNm: 800 }] });
    if (url.startsWith('/api/configurations')) return ok({ configurations: [signal] });
    if (url === '/api/accounts') return ok({ accounts: [{ id: id(50), name: 'CC-1', kind: 'cost_centre', status: 'approved', usable: true, reason: null }] });
    if (url.startsWith('/api/bookings?')) return ok({ bookings: [], maintenance: [], changeovers: [] });
    if (url === '/api/bookings/check') {
      return ok({
        ok: problems.length === 0, problems, derived: {}, eyewear: [{ id: id(300), label: 'NIR goggles' }], status: 'approved', cancellationPolicy: 'Free until 72 h before.',
        onTable: [{ role: 'signal', minNm: 1300, maxNm: 1300 }], odByWavelength: [{ role: 'signal', minNm: 1300, maxNm: 1300, requiredOd: 5, eyewear: [{ id: id(300), label: 'NIR goggles' }] }], timeline,
      });
    }
    if (url === '/api/bookings' && method === 'POST') return create;
    if (url === '/api/bookings/needs-rebooking' || url === '/api/bookings/pending') return ok({ bookings: [] });
    if (url === '/api/calendar/feed') return ok({ url: '/api/calendar/abc.ics' });
    return undefined;
  });
}

async function until(el: HTMLElement, selector: string) {
  for (let i = 0; i < 150 && !el.querySelector(selector); i += 1) await tick(1, 30);
  return el.querySelector(selector);
}

async function openForm() {
  const { el } = await renderApp('/calendar');
  await until(el, '[data-testid="new-request-button"]');
  await act(async () => (el.querySelector('[data-testid="new-request-button"]') as HTMLButtonElement).click());
  const form = (await until(el, '[data-testid="request-form"]')) as HTMLFormElement;
  await setField(form.querySelector('[name="purpose"]')!, 'Carrier lifetime in InGaAs');
  await until(form, '[data-testid="request-verdict"]');
  await tick(5);
  return form;
}

const submit = (form: HTMLElement) => form.querySelector('[data-testid="submit-request"]') as HTMLButtonElement;
const verdicts = (form: HTMLElement) => [...form.querySelectorAll<HTMLElement>('[data-testid="request-verdict"]')];

describe('request verdict', () => {
  test('when the time overlaps another booking while both neighbours have room, then one verdict says overlap, nothing says fits, Send is off and the earliest start is in both zones', async () => {
    const overlapMessage = `That time overlaps another booking or a maintenance window. The earliest start that works is ${earliest}.`;
    api({ before: neighbour(10, 120), after: neighbour(0, 90), overlaps: [id(201)], earliestStart: earliest }, [{ code: 'overlap', message: overlapMessage }]);
    const form = await openForm();
    expect(verdicts(form)).toHaveLength(1);
    expect(verdicts(form)[0]!.dataset.verdict).toBe('overlap');
    expect(verdicts(form)[0]!.textContent).toMatch(/overlaps another booking/);
    const check = form.querySelector('[data-testid="request-check"]')!;
    expect(check.textContent).not.toMatch(/fits/i);
    expect(submit(form).disabled).toBe(true);
    expect(form.textContent).not.toMatch(isoInstant);
    const shown = form.querySelector('[data-testid="earliest-start"]')!.textContent!;
    expect(shown).toContain(formatInstant(earliest, facilityZone));
    if (viewerTimeZone() !== facilityZone) expect(shown).toContain(formatInstant(earliest, viewerTimeZone()));
  });

  test('when the changeover after is too short and the one before fits, then the verdict is the short changeover and Send is off', async () => {
    api({ before: neighbour(10, 120), after: neighbour(55, 20), overlaps: [], earliestStart: earliest }, [{ code: 'changeover_gap', message: `The changeover needs 55 min but only 20 min are free. The earliest start that works is ${earliest}.` }]);
    const form = await openForm();
    expect(verdicts(form)).toHaveLength(1);
    expect(verdicts(form)[0]!.dataset.verdict).toBe('changeover_short');
    expect(verdicts(form)[0]!.textContent).toContain('55 min');
    expect(form.querySelector('[data-testid="request-check"]')!.textContent).not.toMatch(/fits/i);
    expect(submit(form).disabled).toBe(true);
  });

  test('when everything fits, then the single verdict says so and Send is on', async () => {
    api({ before: neighbour(10, 120), after: null, overlaps: [], earliestStart: null }, []);
    const form = await openForm();
    expect(verdicts(form).map((v) => v.dataset.verdict)).toEqual(['fits']);
    expect(submit(form).disabled).toBe(false);
  });

  test('when the server refuses with an ISO instant in its message, then the refusal shows it formatted in the facility zone', async () => {
    const message = `That time overlaps another booking or a maintenance window. The earliest start that works is ${earliest}.`;
    api({ before: null, after: null, overlaps: [], earliestStart: null }, [], { status: 409, body: { error: { code: 'overlap', message, details: { earliestStart: earliest, overlaps: [id(201)] } } } });
    const form = await openForm();
    await act(async () => submit(form).click());
    await tick(10);
    const refusal = form.querySelector('[data-testid="request-refused"]')!;
    expect(refusal.textContent).not.toMatch(isoInstant);
    expect(refusal.textContent).toContain(formatInstant(earliest, facilityZone));
  });
});
