import type { ReactNode } from 'react';
import { cx } from '../../lib/cx';

export type PillTone = 'neutral' | 'accent' | 'success' | 'caution' | 'danger';

const tones: Record<PillTone, string> = {
  neutral: 'border-line bg-sunk text-ink-muted',
  accent: 'border-accent/40 bg-accent-soft text-ink',
  success: 'border-success/40 bg-success-soft text-ink',
  caution: 'border-caution-line/60 bg-caution-bg text-caution-ink',
  danger: 'border-danger/40 bg-danger-soft text-danger',
};

/** A small rounded state label (invoice, account, billing period). */
export function StatusPill({ tone, children, title }: { tone: PillTone; children: ReactNode; title?: string }) {
  return (
    <span title={title} className={cx('inline-flex items-center whitespace-nowrap rounded-full border px-2.5 py-0.5 text-xs font-semibold', tones[tone])}>
      {children}
    </span>
  );
}
