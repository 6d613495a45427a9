import { act } from 'react';
import { describe, expect, test } from 'vitest';
import { mockFetch, renderApp, setField, tick } from '../../../test/render-app';

globalThis.ResizeObserver ??= class {
  observe() {}
  unobserve() {}
  disconnect() {}
} as unknown as typeof ResizeObserver;

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const org = { id: id(90), name: 'Kestrel Group', kind: 'internal' };
const person = (role: string) => ({ id: id(91), email: 'p@x.test', name: 'Ida', role, active: true, organisation: org, createdAt: '2026-01-01T00:00:00Z', invitationPending: false });
const source = id(1);
const signal = { id: id(12), instrumentId: source, key: 'opa_signal', name: 'OPA signal', outputKind: 'opa_signal', minNm: 1150, maxNm: 1600, defaultNm: 1300, rateClass: 'standard', requiredOdBands: [{ minNm: 700, maxNm: 3000, od: 5 }], retuneMinutesPerNm: 0.1, active: true };
const detail = { userId: id(91), userName: 'Ida', organisationId: org.id, organisationName: org.name, accountId: id(50), accountName: 'CC-1', purpose: 'Carrier lifetime',
  targetMinNm: 1300, targetMaxNm: 1300, declineReason: null, cancellationFeePercent: null, alternatives: [], rebookedAs: null, changeoverBeforeMinutes: 10 };
const booking = (n: number) => ({ id: id(100 + n), instrumentId: source, configurationId: signal.id, configurationKey: 'opa_signal', outputKind: 'opa_signal', status: 'approved',
  startsAt: '2026-03-03T14:00:00.000Z', endsAt: '2026-03-03T18:00:00.000Z', own: true, detail });
const log = (n: number, status: string, extra: Record<string, unknown> = {}) => ({
  id: id(200 + n), bookingId: id(100 + n), status, actualStartsAt: '2026-03-03T14:00:00.000Z', actualEndsAt: '2026-03-03T18:00:00.000Z', outsideGrace: false, notes: '',
  segments: [{ id: id(300 + n), configurationId: signal.id, configurationKey: 'opa_signal', startsAt: '2026-03-03T14:00:00.000Z', endsAt: '2026-03-03T18:00:00.000Z',
    minNm: 1290, maxNm: 1310, averagePowerMw: 250, pulseFwhmFs: null, pulseShape: null, traceAttachmentId: null, notes: '' }],
  attachments: [], submittedBy: 'Ida', submittedAt: '2026-03-03T19:00:00.000Z', confirmedBy: null, confirmedAt: null, billedBy: null, billedAt: null, ...extra,
});

type Answer = { status: number; body?: unknown } | undefined;

function api(role: string, answers: { usage?: unknown; save?: Answer; confirm?: Answer; autocorrelation?: Answer } = {}) {
  return mockFetch((method, url) => {
    const ok = (body: unknown) => ({ status: 200, body });
    if (url === '/api/auth/me') return ok({ user: person(role) });
    if (url === '/api/facility') return ok({ facility: { name: 'Core', timeZone: 'America/New_York', currency: 'USD' } });
    if (url.startsWith('/api/configurations')) return ok({ configurations: [signal] });
    if (url === '/api/usage/sessions?scope=mine') return ok({ sessions: [{ booking: booking(1), log: null }, { booking: booking(2), log: log(2, 'submitted', { outsideGrace: true }) }, { booking: booking(3), log: log(3, 'billed') }] });
    if (url === '/api/usage/sessions?scope=to_confirm') return ok({ sessions: [{ booking: booking(2), log: log(2, 'submitted', { outsideGrace: true }) }] });
    if (url === `/api/bookings/${id(101)}/usage` && method === 'GET') return ok(answers.usage ?? { booking: booking(1), log: null, graceMinutes: 15 });
    if (url === `/api/bookings/${id(101)}/usage` && method === 'POST') return answers.save;
    if (url === `/api/bookings/${id(101)}/attachments`) return { status: 201, body: { attachment: { id: id(400), originalName: 'ac.csv', contentType: 'text/csv', sizeBytes: 900, createdAt: '2026-03-03T19:00:00Z', url: `/api/attachments/${id(400)}` } } };
    if (url === '/api/optics/autocorrelation') return answers.autocorrelation;
    if (url === `/api/usage/${id(202)}/confirm`) return answers.confirm;
    return undefined;
  });
}

async function until(el: HTMLElement, selector: string) {
  for (let i = 0; i < 150 && !el.querySelector(selector); i += 1) await tick(1, 30);
  return el.querySelector(selector);
}

const field = (el: HTMLElement, name: string) => el.querySelector<HTMLInputElement>(`[name="${name}"]`)!;

async function dropFile(zone: Element, file: File) {
  const input = zone.querySelector<HTMLInputElement>('input[type=file]')!;
  Object.defineProperty(input, 'files', { value: [file], configurable: true });
  await act(async () => input.dispatchEvent(new Event('change', { bubbles: true })));
  await tick(15);
}

describe('session log pages', () => {
  test('when a member opens the session log, then each row carries its log status with the matching action and the Class 4 caution shows', async () => {
    api('member');
    const { el } = await renderApp('/sessions');
    await until(el, '[data-testid="session-row"]');
    const rows = [...el.querySelectorAll<HTMLElement>('[data-testid="session-row"]')];
    expect(rows.map((r) => r.dataset.logStatus)).toEqual(['needs_log', 'submitted', 'billed']);
    expect(rows.map((r) => r.querySelector('[data-testid="log-session"]')?.textContent)).toEqual(['Log this session', 'Edit log', 'View log']);
    expect(rows[0]!.textContent).toContain('OPA signal');
    // 14:00 UTC is 09:00 in New York on 3 Mar 2026 (UTC−5; IANA tz database)
    expect(rows[0]!.textContent).toContain('09:00');
    expect(rows[1]!.querySelector('[data-testid="outside-grace"]')).not.toBeNull();
    expect(el.querySelector('[data-testid="laser-caution"]')).not.toBeNull();
    expect(el.querySelector('[data-testid="to-confirm-tab"]')).toBeNull();
  });

  test('when a range is typed in µm and saved, then the body goes out in nm and an outside-grace answer shows the review notice', async () => {
    const calls = api('member', { save: { status: 200, body: { log: { ...log(1, 'submitted'), outsideGrace: true } } } });
    const { el } = await renderApp(`/sessions/${id(101)}`);
    const form = (await until(el, '[data-testid="usage-form"]')) as HTMLFormElement;
    expect(field(form, 'actualStartTime').value).toBe('09:00');
    expect(field(form, 'actualEndTime').value).toBe('13:00');
    await setField(field(form, 'segments.0.unit') as unknown as HTMLSelectElement, 'um');
    expect(field(form, 'segments.0.minValue').value).toBe('1.3');
    await setField(field(form, 'segments.0.maxValue'), '1.45');
    await setField(field(form, 'segments.0.averagePowerMw'), '320');
    await setField(field(form, 'actualEndTime'), '13:40');
    await act(async () => (form.querySelector('[data-testid="save-usage"]') as HTMLButtonElement).click());
    await tick(10);
    const post = calls.find((c) => c.startsWith(`POST /api/bookings/${id(101)}/usage`))!;
    const body = JSON.parse(post.slice(post.indexOf('{')));
    expect(body.actualEndsAt).toBe('2026-03-03T18:40:00.000Z');
    // Source: SI prefixes, 1 µm = 1000 nm
    expect(body.segments[0]).toMatchObject({ minNm: 1300, maxNm: 1450, averagePowerMw: 320, startsAt: '2026-03-03T14:00:00.000Z', endsAt: '2026-03-03T18:40:00.000Z' });
    expect([...el.querySelectorAll('[data-testid="outside-grace"]')].map((e) => e.textContent).join(' ')).toContain('Staff will review');
    expect(el.querySelector('[data-testid="usage-status"]')?.getAttribute('data-status')).toBe('submitted');
  });

  test('when the API refuses a range outside the tuning range, then its message shows as a banner and beside the segment', async () => {
    const message = 'OPA signal tunes 1150–1600 nm; 1700 nm is outside';
    api('member', { save: { status: 422, body: { error: { code: 'out_of_range', message, details: { segmentIndex: 0 } } } } });
    const { el } = await renderApp(`/sessions/${id(101)}`);
    const form = (await until(el, '[data-testid="usage-form"]')) as HTMLFormElement;
    await setField(field(form, 'segments.0.maxValue'), '1700');
    expect(form.textContent).toContain("leaves OPA signal's tuning range");
    await act(async () => (form.querySelector('[data-testid="save-usage"]') as HTMLButtonElement).click());
    await tick(10);
    expect(form.querySelector('[data-testid="usage-error"]')?.textContent).toContain(message);
    expect([...form.querySelectorAll('[data-testid="field-error"]')].some((e) => e.textContent === message)).toBe(true);
  });

  test('when saving meets 409 log_locked, then the banner names who billed it and when, and editing stops', async () => {
    api('member', { save: { status: 409, body: { error: { code: 'log_locked', message: 'Billed', details: { billedBy: 'Fran Okafor', billedAt: '2026-04-01T15:00:00.000Z' } } } } });
    const { el } = await renderApp(`/sessions/${id(101)}`);
    const form = (await until(el, '[data-testid="usage-form"]')) as HTMLFormElement;
    await act(async () => (form.querySelector('[data-testid="save-usage"]') as HTMLButtonElement).click());
    await tick(10);
    const banner = form.querySelector('[data-testid="usage-error"]')!;
    // 15:00 UTC on 1 Apr 2026 is 11:00 in New York (UTC−4; IANA tz database)
    expect(banner.textContent).toMatch(/Billed by Fran Okafor on Wed,? 1 Apr 2026, 11:00/);
    expect(form.querySelector('fieldset')!.disabled).toBe(true);
    expect(form.querySelector('[data-testid="save-usage"]')).toBeNull();
  });

  test('when the log is billed, then the form is read-only and says who billed it', async () => {
    api('member', { usage: { booking: booking(1), log: log(1, 'billed', { billedBy: 'Fran Okafor', billedAt: '2026-04-01T15:00:00.000Z' }), graceMinutes: 15 } });
    const { el } = await renderApp(`/sessions/${id(101)}`);
    const form = (await until(el, '[data-testid="usage-form"]')) as HTMLFormElement;
    expect(el.querySelector('[data-testid="usage-status"]')?.getAttribute('data-status')).toBe('billed');
    expect(form.querySelector('[data-testid="save-usage"]')).toBeNull();
    expect(form.querySelector('fieldset')!.disabled).toBe(true);
    expect(el.querySelector('[data-testid="log-billed"]')?.textContent).toContain('Fran Okafor');
  });

  test('when an autocorrelation trace is dropped, then it is plotted, stored, analysed and fills the pulse duration', async () => {
    const calls = api('member', { autocorrelation: { status: 200, body: { acFwhmFs: 141.4, pulseFwhmFs: 100.0, shape: 'gaussian', baseline: 0, peakDelayFs: 0 } } });
    const { el } = await renderApp(`/sessions/${id(101)}`);
    const form = (await until(el, '[data-testid="usage-form"]')) as HTMLFormElement;
    // Gaussian AC of 141.4 fs FWHM: FWHM = 2√(2 ln 2)·σ (standard result)
    const sigma = 141.4 / (2 * Math.sqrt(2 * Math.LN2));
    const lines = ['delay_fs,signal', ...Array.from({ length: 201 }, (_, i) => { const t = -500 + i * 5; return `${t},${Math.exp(-(t * t) / (2 * sigma * sigma)).toFixed(6)}`; })];
    await dropFile(form.querySelector('[data-testid="trace-drop"]')!, new File([lines.join('\n')], 'ac.csv', { type: 'text/csv' }));
    await until(form, '[data-testid="trace-result"]');
    // the plot's script loads on the drop, so it may land just after the analysis
    await until(form, '[data-testid="trace-plot"]');
    expect(form.querySelector('[data-testid="trace-plot"]')).not.toBeNull();
    expect(form.querySelector('[data-testid="trace-result"]')?.getAttribute('data-pulse-fs')).toBe('100');
    expect(field(form, 'segments.0.pulseFwhmFs').value).toBe('100');
    expect(calls.some((c) => c === `POST /api/bookings/${id(101)}/attachments`)).toBe(true);
    expect(calls.some((c) => c === 'POST /api/optics/autocorrelation')).toBe(true);
  });

  test('when a trace has a word where a number should be, then the line is named and nothing is uploaded', async () => {
    const calls = api('member');
    const { el } = await renderApp(`/sessions/${id(101)}`);
    const form = (await until(el, '[data-testid="usage-form"]')) as HTMLFormElement;
    const text = ['delay,signal', '-20,0.1', '-10,0.5', '0,1', '10,0.5', '20,0.1', 'oops,0.05'].join('\n');
    await dropFile(form.querySelector('[data-testid="trace-drop"]')!, new File([text], 'bad.csv', { type: 'text/csv' }));
    await until(form, '[data-testid="trace-error"]');
    expect(form.querySelector('[data-testid="trace-error"]')?.textContent).toMatch(/Line 7.*"oops" is not a number/);
    expect(calls.some((c) => c.includes('/attachments') || c.includes('/autocorrelation'))).toBe(false);
  });

  test('when staff review a flagged log on the To-confirm tab and adjust the end, then the confirm call carries only the change', async () => {
    const calls = api('staff', { confirm: { status: 200, body: { log: log(2, 'confirmed') } } });
    const { el } = await renderApp('/sessions');
    await act(async () => ((await until(el, '[data-testid="to-confirm-tab"]')) as HTMLButtonElement).click());
    await tick(10);
    const row = (await until(el, '[data-testid="session-row"]')) as HTMLElement;
    expect(row.dataset.bookingId).toBe(id(102));
    expect(row.querySelector('[data-testid="outside-grace"]')).not.toBeNull();
    await act(async () => (row.querySelector('[data-testid="log-session"]') as HTMLButtonElement).click());
    await setField(field(el, 'confirmEndTime'), '12:30');
    await setField(field(el, 'confirmNote'), 'Interlock log shows beam off at 12:30');
    await act(async () => (el.querySelector('[data-testid="confirm-usage"]') as HTMLButtonElement).click());
    await tick(5);
    expect(calls).toContain(`POST /api/usage/${id(202)}/confirm {"actualEndsAt":"2026-03-03T17:30:00.000Z","note":"Interlock log shows beam off at 12:30"}`);
  });
});
