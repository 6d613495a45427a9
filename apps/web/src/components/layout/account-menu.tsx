import type { User } from '@femtoslot/shared';
import { roleLabels } from '../../config/roles';
import { Button } from '../ui/button';

function ThemeIcon({ dark }: { dark: boolean }) {
  return dark ? (
    <svg viewBox="0 0 20 20" aria-hidden="true" className="size-4">
      <circle cx="10" cy="10" r="3.6" fill="currentColor" />
      <g stroke="currentColor" strokeWidth="1.5" strokeLinecap="round">
        <path d="M10 2v2M10 16v2M2 10h2M16 10h2M4.3 4.3l1.4 1.4M14.3 14.3l1.4 1.4M4.3 15.7l1.4-1.4M14.3 5.7l1.4-1.4" />
      </g>
    </svg>
  ) : (
    <svg viewBox="0 0 20 20" aria-hidden="true" className="size-4">
      <path d="M15.5 12.6A6.5 6.5 0 0 1 7.4 4.5a6.5 6.5 0 1 0 8.1 8.1Z" fill="currentColor" />
    </svg>
  );
}

export interface AccountMenuProps {
  user: User;
  theme: 'light' | 'dark';
  onToggleTheme: () => void;
  onSignOut: () => void;
  signingOut: boolean;
}

/** The signed-in person, the theme switch and sign-out, at the right of the header. */
export function AccountMenu({ user, theme, onToggleTheme, onSignOut, signingOut }: AccountMenuProps) {
  return (
    <>
      <div className="text-right leading-tight" data-testid="current-user">
        <p className="text-sm font-semibold" data-testid="current-user-name">
          {user.name}
        </p>
        <p className="text-xs text-ink-muted">
          <span data-testid="current-user-role" data-role={user.role}>
            {roleLabels[user.role]}
          </span>
          {' · '}
          <span data-testid="current-user-organisation">{user.organisation.name}</span>
        </p>
      </div>
      <button
        type="button"
        onClick={onToggleTheme}
        aria-pressed={theme === 'dark'}
        aria-label="Dark mode"
        title={theme === 'dark' ? 'Switch to the light theme' : 'Switch to the dark theme'}
        data-testid="theme-toggle"
        className="rounded-lg border border-line p-2 text-ink-muted hover:bg-sunk hover:text-ink"
      >
        <ThemeIcon dark={theme === 'dark'} />
      </button>
      <Button variant="secondary" size="sm" onClick={onSignOut} busy={signingOut} data-testid="sign-out">
        Sign out
      </Button>
    </>
  );
}
