import type { ReactNode } from 'react';

/** An honest placeholder for an area whose first version is still being built. */
export function ComingSoon({ children }: { children: ReactNode }) {
  return (
    <div data-testid="coming-soon" className="rounded-xl border border-dashed border-line bg-panel px-5 py-5">
      <p className="text-xs font-bold tracking-wider text-accent uppercase">In progress</p>
      <div className="mt-2 max-w-prose space-y-2 text-ink-muted">{children}</div>
    </div>
  );
}
