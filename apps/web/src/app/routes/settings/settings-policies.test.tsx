import { describe, expect, test } from 'vitest';
import { mockFetch, renderApp, setField, tick } from '../../../test/render-app';

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;
const org = { id: id(90), name: 'Core', kind: 'internal' };
const person = (role: string) => ({ id: id(91), email: `${role}@x.test`, name: 'Tam', role, active: true, organisation: org, createdAt: '2026-01-01T00:00:00Z', invitationPending: false });
const policies = { minBookingHours: 1, maxBookingHours: 12, horizonDays: 60, externalLeadHours: 12, cancellationFreeHours: 72, cancellationHalfFeeHours: 24, usageGraceMinutes: 30, pumpPulseSpecFs: 45, workingHours: { start: '08:00', end: '18:00', weekdays: [1, 2, 3, 4, 5] } };
const facility = { name: 'Core', timeZone: 'America/New_York', currency: 'USD', policies, usageWindowMinutes: 60 };

function api(role: string) {
  return mockFetch((method, url, body) => {
    const ok = (b: unknown) => ({ status: 200, body: b });
    if (url === '/api/auth/me') return ok({ user: person(role) });
    if (url === '/api/facility') return ok({ facility });
    if (url === '/api/eyewear') return ok({ eyewear: [] });
    if (url === '/api/calendar/feed') return ok({ url: 'http://localhost/feed.ics' });
    if (method === 'PATCH' && url === '/api/facility/policies') return ok({ facility: { ...facility, policies: { ...policies, ...(body as object) } } });
    return undefined;
  });
}

async function until(el: HTMLElement, selector: string) {
  for (let i = 0; i < 150 && !el.querySelector(selector); i += 1) await tick(1, 30);
  return el.querySelector(selector);
}
const input = (el: HTMLElement, name: string) => el.querySelector<HTMLInputElement>(`[data-testid="policy-${name}"]`)!;
const submit = async (el: HTMLElement) => { el.querySelector<HTMLButtonElement>('[data-testid="save-policies"]')!.click(); await tick(10, 30); };

describe('settings: facility policies', () => {
  test('when an admin sets the longest booking below the shortest, then the field shows why and nothing is sent; a valid change is sent as numbers', async () => {
    const calls = api('admin');
    const { el } = await renderApp('/settings');
    await until(el, '[data-testid="policy-horizonDays"]');
    expect(input(el, 'horizonDays').value).toBe('60');
    expect(input(el, 'usageWindowMinutes').value).toBe('60');
    expect(el.querySelector('[data-testid="policy-zone-note"]')!.textContent).toContain('America/New_York');
    await setField(input(el, 'minBookingHours'), '6');
    await setField(input(el, 'maxBookingHours'), '4');
    await submit(el);
    expect(el.querySelector('[data-testid="facility-policies"]')!.textContent).toContain('The longest booking cannot be shorter than the shortest');
    expect(calls.some((c) => c.startsWith('PATCH'))).toBe(false);
    await setField(input(el, 'maxBookingHours'), '8');
    await setField(input(el, 'horizonDays'), '90');
    await submit(el);
    const sent = calls.find((c) => c.startsWith('PATCH /api/facility/policies'));
    expect(sent).toBeDefined();
    expect(JSON.parse(sent!.slice('PATCH /api/facility/policies '.length))).toMatchObject({ minBookingHours: 6, maxBookingHours: 8, horizonDays: 90, usageWindowMinutes: 60, workingHours: { weekdays: [1, 2, 3, 4, 5] } });
  });

  test('when staff open Settings, then the policies are shown read-only with no save button', async () => {
    api('staff');
    const { el } = await renderApp('/settings');
    await until(el, '[data-testid="policy-horizonDays"]');
    expect(input(el, 'horizonDays').closest('fieldset')!.disabled).toBe(true);
    expect(el.querySelector('[data-testid="save-policies"]')).toBeNull();
    expect(el.querySelector('[data-testid="facility-policies"]')!.textContent).toContain('Only an administrator can change them');
  });
});
