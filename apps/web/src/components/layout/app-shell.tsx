import type { ReactNode } from 'react';
import { NavLink } from 'react-router-dom';
import type { NavigationArea } from '../../config/navigation';
import { cx } from '../../lib/cx';
import { Wordmark } from '../ui/wordmark';

export interface AppShellProps {
  facilityName?: string;
  navigation: readonly NavigationArea[];
  /** the signed-in person, theme toggle and sign-out, composed by the route */
  account: ReactNode;
  children: ReactNode;
}

export function AppShell({ facilityName, navigation, account, children }: AppShellProps) {
  return (
    <div className="min-h-screen bg-canvas">
      <a
        href="#main"
        className="sr-only rounded-md bg-accent px-3 py-2 text-accent-ink focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-50"
      >
        Skip to content
      </a>
      <header className="border-b border-line bg-panel">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-3 px-4 py-3 sm:px-6">
          <div className="flex min-w-0 items-center gap-4">
            <Wordmark />
            <span aria-hidden="true" className="hidden h-6 w-px bg-line sm:block" />
            <p className="truncate text-sm font-semibold text-ink-muted" data-testid="facility-name">
              {facilityName ?? '\u00a0'}
            </p>
          </div>
          <div className="ml-auto flex items-center gap-3">{account}</div>
        </div>
        <nav aria-label="Main" className="mx-auto max-w-7xl px-2 sm:px-4">
          <ul className="-mb-px flex gap-1 overflow-x-auto">
            {navigation.map((entry) => (
              <li key={entry.area}>
                <NavLink
                  to={entry.path}
                  data-testid={entry.testId}
                  className={({ isActive }) =>
                    cx(
                      'block border-b-2 px-3 py-2.5 text-sm font-semibold whitespace-nowrap transition-colors',
                      isActive ? 'border-accent text-ink' : 'border-transparent text-ink-muted hover:text-ink',
                    )
                  }
                >
                  {entry.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
      </header>
      <main id="main" className="mx-auto max-w-7xl px-4 py-8 sm:px-6">
        {children}
      </main>
    </div>
  );
}
