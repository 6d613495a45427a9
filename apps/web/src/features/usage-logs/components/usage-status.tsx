import type { UsageLogDto } from '@femtoslot/shared';
import { cx } from '../../../lib/cx';
import { type LogStatus, logStatusLabels } from '../lib/log-status';

const tones: Record<LogStatus, string> = {
  needs_log: 'border-caution-line/60 bg-caution-bg text-caution-ink',
  submitted: 'border-accent/40 bg-accent-soft text-ink',
  confirmed: 'border-success/40 bg-success-soft text-ink',
  billed: 'border-line bg-sunk text-ink-muted',
};

/** The log's state; `withTestId` marks the one on a log view (rows carry data-log-status instead). */
export function UsageStatusBadge({ status, withTestId = false }: { status: LogStatus; withTestId?: boolean }) {
  return (
    <span
      data-testid={withTestId ? 'usage-status' : undefined}
      data-status={status}
      className={cx('inline-flex items-center rounded-full border px-2.5 py-0.5 text-xs font-semibold', tones[status])}
    >
      {logStatusLabels[status]}
    </span>
  );
}

export function OutsideGraceBadge({ log }: { log: Pick<UsageLogDto, 'outsideGrace'> | null }) {
  if (!log?.outsideGrace) return null;
  return (
    <span
      data-testid="outside-grace"
      title="The logged times leave the booking by more than the facility's grace; staff review them before billing."
      className="inline-flex items-center rounded-full border border-danger/40 bg-danger-soft px-2.5 py-0.5 text-xs font-semibold text-danger"
    >
      Flagged: outside the grace
    </span>
  );
}
