import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths';

export function NotFoundPage() {
  return (
    <main data-testid="not-found" className="mx-auto max-w-xl px-6 py-24">
      <p className="text-sm font-semibold tracking-wide text-ink-muted uppercase">404</p>
      <h1 className="mt-2 text-2xl font-bold">There is no page at this address</h1>
      <p className="mt-3 text-ink-muted">The link may be old, or the address mistyped.</p>
      <Link to={paths.home} className="mt-6 inline-block font-semibold text-accent underline-offset-4 hover:underline">
        Go to Femtoslot
      </Link>
    </main>
  );
}
