import type { ReactNode } from 'react';
import { Wordmark } from '../ui/wordmark';

/** The quiet frame around sign-in, password and invitation pages. */
export function AuthLayout({ title, lead, children }: { title: string; lead?: ReactNode; children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center bg-canvas px-4 py-12 sm:py-20">
      <Wordmark className="mb-8" />
      <main className="w-full max-w-sm rounded-2xl border border-line bg-panel p-6 shadow-sm sm:p-8">
        <h1 className="text-xl font-bold tracking-tight">{title}</h1>
        {lead && <p className="mt-1.5 text-sm text-ink-muted">{lead}</p>}
        <div className="mt-6">{children}</div>
      </main>
      <p className="mt-8 max-w-sm text-center text-xs text-ink-muted">
        Beam time, session logs and billing for the shared femtosecond source.
      </p>
    </div>
  );
}
