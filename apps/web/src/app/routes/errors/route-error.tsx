import { isRouteErrorResponse, useRouteError } from 'react-router-dom';

/** Shown instead of a blank screen when a page fails to load or throws while rendering. */
export function RouteErrorPage() {
  const error = useRouteError();
  const detail = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : error instanceof Error
      ? error.message
      : undefined;
  return (
    <main role="alert" data-testid="route-error" className="mx-auto max-w-xl px-6 py-24">
      <h1 className="text-2xl font-bold">Something went wrong on this page</h1>
      <p className="mt-3 text-ink-muted">Reload to try again. If it keeps happening, tell the facility's administrator.</p>
      {detail && <pre className="mt-4 overflow-x-auto rounded-lg bg-sunk p-3 text-xs text-ink-muted">{detail}</pre>}
      <button
        type="button"
        onClick={() => window.location.reload()}
        className="mt-6 rounded-lg bg-accent px-4 py-2 text-sm font-semibold text-accent-ink hover:bg-accent-hover"
      >
        Reload
      </button>
    </main>
  );
}
