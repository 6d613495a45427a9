import { describe, expect, test } from 'vitest';
import { mockFetch, renderApp, setField, tick } from '../../../test/render-app';

globalThis.ResizeObserver ??= class {
  observe() {}
  unobserve() {}
  disconnect() {}
} as unknown as typeof ResizeObserver;

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const org = { id: id(90), name: 'Kestrel Group', kind: 'internal' };
const staff = { id: id(91), email: 's@x.test', name: 'Sam', role: 'staff', active: true, organisation: org, createdAt: '2026-01-01T00:00:00Z', invitationPending: false };
const source = id(1);
const signal = { id: id(12), instrumentId: source, key: 'opa_signal', name: 'OPA signal', outputKind: 'opa_signal', minNm: 1150, maxNm: 1600, defaultNm: 1300, rateClass: 'standard', requiredOdBands: [{ minNm: 700, maxNm: 3000, od: 5 }], retuneMinutesPerNm: 0.1, active: true };

const utilisation = {
  rows: [
    { period: '2026-03-02', instrumentId: source, instrumentName: 'Aurora line', bookedHours: 31.5, loggedHours: 28.25, maintenanceHours: 4, changeoverHours: 1.75 },
    { period: '2026-03-09', instrumentId: source, instrumentName: 'Aurora line', bookedHours: 20, loggedHours: 19, maintenanceHours: 0, changeoverHours: 0.5 },
  ],
  byConfiguration: [{ key: 'opa_signal', label: 'OPA signal', loggedHours: 47.25 }],
  byOrganisation: [{ key: org.id, label: 'Kestrel Group', loggedHours: 47.25 }],
};
const coverage = {
  segments: [{ configurationKey: 'opa_signal', configurationName: 'OPA signal', startsAt: '2026-03-03T14:00:00.000Z', minNm: 1290, maxNm: 1480 }],
  pulseTrend: [{ startsAt: '2026-03-03T14:00:00.000Z', pulseFwhmFs: 96.4, configurationKey: 'fundamental', pulseShape: 'gaussian', autocorrelationFwhmFs: 96.4 * 1.41421 }],
  pumpPulseSpecFs: 110,
};

function api() {
  return mockFetch((_method, url) => {
    const ok = (body: unknown) => ({ status: 200, body });
    if (url === '/api/auth/me') return ok({ user: staff });
    if (url === '/api/facility') return ok({ facility: { name: 'Core', timeZone: 'America/New_York', currency: 'USD' } });
    if (url === '/api/instruments') return ok({ instruments: [{ id: source, name: 'Aurora line', kind: 'source', description: '', pumpNm: 800 }] });
    if (url.startsWith('/api/configurations')) return ok({ configurations: [signal] });
    if (url.startsWith('/api/reports/utilisation?')) return ok(utilisation);
    if (url.startsWith('/api/reports/tuning-coverage?')) return ok(coverage);
    return undefined;
  });
}

async function until(el: HTMLElement, selector: string) {
  for (let i = 0; i < 150 && !el.querySelector(selector); i += 1) await tick(1, 30);
  return el.querySelector(selector);
}

const cells = (el: Element | null) => [...(el?.querySelectorAll('tbody tr') ?? [])].map((tr) => [...tr.querySelectorAll('td')].map((td) => td.textContent?.trim()));

describe('reports page', () => {
  test('when the reports load, then every chart has a table with the same numbers and an Export CSV link with the same query', async () => {
    const calls = api();
    const { el } = await renderApp('/reports');
    await until(el, '[data-testid="pulse-table"]');
    const query = calls.find((c) => c.startsWith('GET /api/reports/utilisation?'))!.slice('GET /api/reports/utilisation?'.length);
    expect(query).toMatch(/^from=.+&to=.+&groupBy=week$/);
    expect(cells(el.querySelector('[data-testid="utilisation-table"]'))[0]).toEqual(['2 Mar (2026-03-02)', 'Aurora line', '31.5', '28.25', '4.0', '1.75']);
    expect(cells(el.querySelector('[data-testid="by-configuration-table"]'))).toEqual([['OPA signal', '47.25']]);
    expect(cells(el.querySelector('[data-testid="by-organisation-table"]'))).toEqual([['Kestrel Group', '47.25']]);
    expect(cells(el.querySelector('[data-testid="tuning-table"]'))[0]?.slice(1)).toEqual(['OPA signal', '1,290', '1,480']);
    // AC FWHM = 96.4 fs × 1.414 = 136.3 fs (Gaussian, Diels & Rudolph)
    expect(cells(el.querySelector('[data-testid="pulse-table"]'))[0]?.slice(2)).toEqual(['Gaussian', '96.4', '136.3', 'within']);
    for (const chart of ['utilisation-chart', 'tuning-chart', 'pulse-chart']) expect(el.querySelector(`[data-testid="${chart}"]`)).not.toBeNull();
    const links = [...el.querySelectorAll<HTMLAnchorElement>('[data-testid="export-csv"]')].map((a) => a.getAttribute('href'));
    expect(links).toHaveLength(5);
    expect(links.filter((h) => h === `/api/reports/utilisation.csv?${query}`)).toHaveLength(3);
    expect(links.filter((h) => h === `/api/reports/tuning-coverage.csv?${query.replace('&groupBy=week', '')}`)).toHaveLength(1);
    expect(links.filter((h) => h === `/api/reports/pulse-trend.csv?${query.replace('&groupBy=week', '')}`)).toHaveLength(1);
  });

  test('when the instrument and grouping change, then the reports and their CSV links ask again with them', async () => {
    const calls = api();
    const { el } = await renderApp('/reports');
    await until(el, '[data-testid="utilisation-table"]');
    await setField(el.querySelector<HTMLSelectElement>('[data-testid="report-group-by"]')!, 'month');
    await setField(el.querySelector<HTMLSelectElement>('[data-testid="report-instrument"]')!, source);
    await tick(10);
    expect(calls.some((c) => c.startsWith('GET /api/reports/utilisation?') && c.endsWith(`&groupBy=month&instrumentId=${source}`))).toBe(true);
    expect(calls.some((c) => c.startsWith('GET /api/reports/tuning-coverage?') && c.endsWith(`&instrumentId=${source}`))).toBe(true);
    expect(el.querySelector('[data-testid="export-csv"]')!.getAttribute('href')).toContain(`groupBy=month&instrumentId=${source}`);
  });
});
