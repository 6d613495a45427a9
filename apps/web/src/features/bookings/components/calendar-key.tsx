/** Key to the marks on the grid that are not configuration colours. */
export function CalendarKey() {
  return (
    <figure className="rounded-xl border border-line bg-panel px-4 py-3.5" data-testid="calendar-key">
      <figcaption className="text-sm font-semibold">On the grid</figcaption>
      <ul className="mt-2.5 space-y-2 text-sm text-ink-muted">
        <li className="flex items-center gap-2.5">
          <span aria-hidden="true" className="fs-key-swatch fs-maintenance" /> Maintenance window (no beam)
        </li>
        <li className="flex items-center gap-2.5">
          <span aria-hidden="true" className="fs-key-swatch fs-changeover" /> Changeover, labelled ⟳ minutes
        </li>
        <li className="flex items-center gap-2.5">
          <span aria-hidden="true" className="fs-key-swatch fs-key-tentative" /> Requested, awaiting staff
        </li>
        <li className="flex items-center gap-2.5">
          <span aria-hidden="true" className="fs-key-swatch fs-key-busy" /> Busy · another organisation
        </li>
      </ul>
    </figure>
  );
}
