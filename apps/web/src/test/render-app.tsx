import { act } from 'react';
import { createRoot } from 'react-dom/client';
import { RouterProvider, createMemoryRouter } from 'react-router-dom';
import { vi } from 'vitest';
import { AppProvider, createQueryClient } from '../app/provider';
import { createRoutes } from '../app/router';

(globalThis as { IS_REACT_ACT_ENVIRONMENT?: boolean }).IS_REACT_ACT_ENVIRONMENT = true;
HTMLDialogElement.prototype.showModal = function showModal(this: HTMLDialogElement) {
  this.open = true;
};
HTMLDialogElement.prototype.close = function close(this: HTMLDialogElement) {
  this.open = false;
};

export type Handler = (method: string, url: string, body: unknown) => { status: number; body?: unknown } | undefined;

/** Replaces fetch with canned answers; returns the log of "METHOD url body" calls. */
export function mockFetch(handler: Handler): string[] {
  const calls: string[] = [];
  globalThis.fetch = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = String(input);
    const method = init?.method ?? 'GET';
    const body = typeof init?.body === 'string' ? JSON.parse(init.body) : undefined;
    calls.push(`${method} ${url}${body === undefined ? '' : ` ${JSON.stringify(body)}`}`);
    const answer = handler(method, url, body) ?? { status: 404, body: { error: { code: 'not_found', message: `no mock for ${method} ${url}` } } };
    if (answer.status === 204) return new Response(null, { status: 204 });
    return new Response(JSON.stringify(answer.body), { status: answer.status, headers: { 'content-type': 'application/json' } });
  }) as typeof fetch;
  return calls;
}

export async function tick(times = 10, ms = 20) {
  for (let i = 0; i < times; i += 1) await act(async () => new Promise((resolve) => setTimeout(resolve, ms)));
}

export async function renderApp(path: string) {
  const queryClient = createQueryClient();
  const router = createMemoryRouter(createRoutes(queryClient), { initialEntries: [path] });
  const el = document.createElement('div');
  document.body.innerHTML = '';
  document.body.append(el);
  await act(async () => {
    createRoot(el).render(
      <AppProvider queryClient={queryClient}>
        <RouterProvider router={router} />
      </AppProvider>,
    );
  });
  await tick(30);
  return { el, router };
}

const valueSetter = (el: HTMLElement) =>
  Object.getOwnPropertyDescriptor(el instanceof HTMLSelectElement ? HTMLSelectElement.prototype : HTMLInputElement.prototype, 'value')!.set!;

/** Types into an input or picks in a select the way React listens for it. */
export async function setField(el: HTMLInputElement | HTMLSelectElement, value: string) {
  await act(async () => {
    valueSetter(el).call(el, value);
    el.dispatchEvent(new Event(el instanceof HTMLSelectElement ? 'change' : 'input', { bubbles: true }));
  });
}
