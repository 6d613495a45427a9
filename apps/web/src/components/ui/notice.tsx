import type { ReactNode } from 'react';
import { cx } from '../../lib/cx';

type Tone = 'info' | 'danger' | 'success';

const tones: Record<Tone, string> = {
  info: 'border-line bg-sunk text-ink',
  danger: 'border-danger/40 bg-danger-soft text-ink',
  success: 'border-success/40 bg-success-soft text-ink',
};

/** A block message inside a page or form; errors are announced to screen readers. */
export function Notice({ tone = 'info', title, children, testId }: { tone?: Tone; title?: string; children?: ReactNode; testId?: string }) {
  return (
    <div
      role={tone === 'danger' ? 'alert' : 'status'}
      data-testid={testId}
      className={cx('rounded-lg border px-3.5 py-3 text-sm', tones[tone])}
    >
      {title && <p className="font-semibold">{title}</p>}
      {children && <div className={cx(title && 'mt-1', 'text-ink-muted')}>{children}</div>}
    </div>
  );
}
