import type { Role } from '@femtoslot/shared';
import { Link } from 'react-router-dom';
import { type Area, navigationAreas } from '../../config/navigation';
import { defaultSignedInPath } from '../../config/paths';
import { roleLabels } from '../../config/roles';

/** The 403-style page a signed-in person sees when their role does not reach an area. */
export function NotAvailable({ area, role }: { area: Area; role: Role }) {
  const label = navigationAreas.find((entry) => entry.area === area)?.label ?? area;
  return (
    <section data-testid="not-available" aria-labelledby="not-available-title" className="max-w-xl py-10">
      <p className="text-sm font-semibold tracking-wide text-ink-muted uppercase">403 · {label}</p>
      <h1 id="not-available-title" className="mt-2 text-2xl font-bold">
        Not available for your role
      </h1>
      <p className="mt-3 text-ink-muted">
        {label} is not open to your role ({roleLabels[role]}). If you think you need it, ask the facility's
        administrator to review your role.
      </p>
      <Link
        to={defaultSignedInPath}
        className="mt-6 inline-block font-semibold text-accent underline-offset-4 hover:underline"
      >
        Back to the calendar
      </Link>
    </section>
  );
}
