import { act } from 'react';
import { createRoot } from 'react-dom/client';
import { RouterProvider, createMemoryRouter } from 'react-router-dom';
import { expect, test, vi } from 'vitest';
import { AppProvider, createQueryClient } from './provider';
import { createRoutes } from './router';

(globalThis as any).IS_REACT_ACT_ENVIRONMENT = true;
HTMLDialogElement.prototype.showModal = function () { this.open = true; };
HTMLDialogElement.prototype.close = function () { this.open = false; };

const org = { id: '11111111-1111-4111-8111-111111111111', name: 'Harrow Optics Group', kind: 'internal' };
const admin = { id: '22222222-2222-4222-8222-222222222222', email: 'ada@example.test', name: 'Ada Admin', role: 'admin', active: true, organisation: org, createdAt: '2025-01-02T10:00:00Z', invitationPending: false };
const other = { ...admin, id: '33333333-3333-4333-8333-333333333333', email: 'bo@example.test', name: 'Bo Member', role: 'member', invitationPending: true };

function mockApi(me: unknown) {
  const calls: string[] = [];
  globalThis.fetch = vi.fn(async (input: any, init?: any) => {
    const url = String(input); calls.push(`${init?.method ?? 'GET'} ${url}`);
    const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
    if (url === '/api/auth/me') return me ? json(200, { user: me }) : json(401, { error: { code: 'unauthenticated', message: 'Sign in first' } });
    if (url === '/api/facility') return json(200, { facility: { name: 'Test Core', timeZone: 'America/New_York', currency: 'USD' } });
    if (url === '/api/users') return json(200, { users: [admin, other] });
    if (url === '/api/organisations') return json(200, { organisations: [org] });
    if (url === '/api/instruments') return json(200, { instruments: [] });
    if (url.startsWith('/api/bookings') || url === '/api/calendar/feed' || url === '/api/accounts') return json(200, { bookings: [], maintenance: [], changeovers: [], accounts: [], url: '/api/calendar/x.ics' });
    if (url === '/api/auth/login') return json(401, { error: { code: 'invalid_credentials', message: 'E-mail or password is wrong' } });
    return json(404, { error: { code: 'not_found', message: 'nope' } });
  }) as any;
  return calls;
}

async function render(path: string) {
  const queryClient = createQueryClient();
  const router = createMemoryRouter(createRoutes(queryClient), { initialEntries: [path] });
  const el = document.createElement('div'); document.body.innerHTML = ''; document.body.append(el);
  await act(async () => { createRoot(el).render(<AppProvider queryClient={queryClient}><RouterProvider router={router} /></AppProvider>); });
  for (let i = 0; i < 30; i++) await act(async () => { await new Promise((r) => setTimeout(r, 20)); });
  return { el, router };
}

test('when an admin opens people, then the users table and their navigation show', async () => {
  const calls = mockApi(admin);
  const { el } = await render('/people');
  for (let i = 0; i < 100 && !el.querySelector('[data-testid="user-row"]'); i++) await act(async () => { await new Promise((r) => setTimeout(r, 30)); });
  expect(el.querySelector('[data-testid="users-table"]')).toBeTruthy();
  expect(el.querySelectorAll('[data-testid="user-row"]').length).toBe(2);
  expect(el.querySelector('[data-testid="facility-name"]')?.textContent).toBe('Test Core');
  expect([...el.querySelectorAll('nav[aria-label="Main"] a')].map((a) => a.getAttribute('data-testid'))).toEqual(['nav-calendar','nav-billing','nav-settings','nav-people','nav-sources','nav-beam-time','nav-training']);
  expect(el.textContent).toContain('Invitation pending');
});

test('when a member opens people, then it is not available', async () => {
  mockApi({ ...other, invitationPending: false });
  const { el } = await render('/people');
  expect(el.querySelector('[data-testid="not-available"]')).toBeTruthy();
});

test('when signed out, then billing sends them to sign-in, which shows the API message', async () => {
  mockApi(null);
  const { el, router } = await render('/billing');
  // The guard redirects once the lazy route and the 401 from /api/auth/me have both arrived; wait for it rather than guess a delay.
  for (let i = 0; i < 150 && (router.state.location.pathname !== '/sign-in' || !el.querySelector('input[name="email"]')); i++) {
    await act(async () => { await new Promise((r) => setTimeout(r, 20)); });
  }
  expect(router.state.location.pathname).toBe('/sign-in');
  const email = el.querySelector('input[name="email"]') as HTMLInputElement;
  const pw = el.querySelector('input[name="password"]') as HTMLInputElement;
  expect(email && pw).toBeTruthy();
  const set = Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, 'value')!.set!;
  await act(async () => { set.call(email, 'x@example.test'); email.dispatchEvent(new Event('input', { bubbles: true })); set.call(pw, 'secret'); pw.dispatchEvent(new Event('input', { bubbles: true })); });
  const btn = [...el.querySelectorAll('button')].find((b) => b.textContent === 'Sign in')!;
  await act(async () => { btn.click(); });
  for (let i = 0; i < 10; i++) await act(async () => { await new Promise((r) => setTimeout(r, 20)); });
  expect(el.querySelector('[data-testid="sign-in-error"]')?.textContent).toContain('E-mail or password is wrong');
});

test('when the calendar opens, then the Class 4 caution and the colour legend show', async () => {
  mockApi(admin);
  const { el } = await render('/');
  for (let i = 0; i < 100 && !el.querySelector('[data-testid="laser-caution"]'); i++) await act(async () => { await new Promise((r) => setTimeout(r, 30)); });
  expect(el.querySelector('[data-testid="laser-caution"]')?.textContent, el.textContent ?? '').toContain('Class 4');
  expect(el.querySelector('[data-testid="configuration-legend"]')).toBeTruthy();
});

test('when an invite is refused, then the server field error shows; a role change patches; sign out leaves', async () => {
  const calls = mockApi(admin);
  const base = globalThis.fetch as any;
  let loggedOut = false;
  globalThis.fetch = vi.fn(async (input: any, init?: any) => {
    const url = String(input);
    const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
    if (url === '/api/users/invitations') { calls.push('POST invite ' + init.body); return json(400, { error: { code: 'validation_failed', message: 'Invalid', details: [{ path: ['email'], message: 'Already has an account' }] } }); }
    if (url.startsWith('/api/users/') && init?.method === 'PATCH') { calls.push('PATCH ' + url + ' ' + init.body); return json(200, { user: { ...other, role: 'pi' } }); }
    if (url === '/api/auth/logout') { calls.push('POST logout'); loggedOut = true; return new Response(null, { status: 204 }); }
    if (url === '/api/auth/me' && loggedOut) return json(401, { error: { code: 'unauthenticated', message: 'Sign in first' } });
    return base(input, init);
  }) as any;
  const { el, router } = await render('/people');
  const tick = async (n = 10) => { for (let i = 0; i < n; i++) await act(async () => { await new Promise((r) => setTimeout(r, 20)); }); };
  await act(async () => { (el.querySelector('[data-testid="invite-user-button"]') as HTMLButtonElement).click(); });
  await tick();
  const dlg = el.querySelector('[data-testid="invite-dialog"]')!;
  const set = Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, 'value')!.set!;
  const setSel = Object.getOwnPropertyDescriptor(HTMLSelectElement.prototype, 'value')!.set!;
  await act(async () => {
    const inputs = dlg.querySelectorAll('input');
    set.call(inputs[0], 'Cy New'); inputs[0].dispatchEvent(new Event('input', { bubbles: true }));
    set.call(inputs[1], 'cy@example.test'); inputs[1].dispatchEvent(new Event('input', { bubbles: true }));
    const selects = dlg.querySelectorAll('select');
    setSel.call(selects[1], org.id); selects[1].dispatchEvent(new Event('change', { bubbles: true }));
  });
  await act(async () => { ([...dlg.querySelectorAll('button')].find((b) => b.textContent === 'Send invitation') as HTMLButtonElement).click(); });
  await tick();
  expect(dlg.textContent).toContain('Already has an account');
  const sel = el.querySelector('[data-testid="user-row"][data-email="bo@example.test"] [data-testid="user-role-select"]') as HTMLSelectElement;
  await act(async () => { setSel.call(sel, 'pi'); sel.dispatchEvent(new Event('change', { bubbles: true })); });
  await tick();
  await act(async () => { (el.querySelector('[data-testid="sign-out"]') as HTMLButtonElement).click(); });
  await tick();
  expect(router.state.location.pathname).toBe('/sign-in');
  expect(calls.some((c) => c.startsWith('PATCH /api/users/3333') && c.includes('"role":"pi"'))).toBe(true);
});

test('when an invitation is gone or a reset token is rejected, then the pages say so', async () => {
  mockApi(null);
  const base = globalThis.fetch as any;
  globalThis.fetch = vi.fn(async (input: any, init?: any) => {
    const url = String(input);
    const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
    if (url.startsWith('/api/auth/invitations/')) return json(410, { error: { code: 'invitation_expired', message: 'This invitation has expired' } });
    if (url === '/api/auth/reset-password') return json(400, { error: { code: 'invalid_token', message: 'bad' } });
    return base(input, init);
  }) as any;
  let { el } = await render('/accept-invitation?token=abcdefghijklmnopqrstuvwxyz');
  expect(el.querySelector('[data-testid="invitation-invalid"]')?.textContent).toContain('This invitation has expired');
  ({ el } = await render('/reset-password?token=abcdefghijklmnopqrstuvwxyz'));
  const set = Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, 'value')!.set!;
  const inputs = el.querySelectorAll('input');
  await act(async () => {
    set.call(inputs[0], 'longenough123'); inputs[0].dispatchEvent(new Event('input', { bubbles: true }));
    set.call(inputs[1], 'longenough124'); inputs[1].dispatchEvent(new Event('input', { bubbles: true }));
  });
  await act(async () => { (el.querySelector('button[type="submit"]') as HTMLButtonElement).click(); });
  for (let i = 0; i < 10; i++) await act(async () => { await new Promise((r) => setTimeout(r, 20)); });
  expect(el.textContent).toContain('The two passwords do not match');
  await act(async () => {
    set.call(inputs[1], 'longenough123'); inputs[1].dispatchEvent(new Event('input', { bubbles: true }));
  });
  await act(async () => { (el.querySelector('button[type="submit"]') as HTMLButtonElement).click(); });
  for (let i = 0; i < 10; i++) await act(async () => { await new Promise((r) => setTimeout(r, 20)); });
  expect(el.querySelector('[data-testid="reset-invalid-token"]')).toBeTruthy();
  expect(el.querySelector('a[href="/forgot-password"]')).toBeTruthy();
});
