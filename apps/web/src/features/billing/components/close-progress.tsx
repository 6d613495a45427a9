import type { BillingJob } from '../types';

const statusWords: Record<BillingJob['status'], string> = {
  queued: 'Waiting to start',
  running: 'Issuing invoices and journals',
  completed: 'Done',
  failed: 'Stopped with errors',
};

/** Progress of a close job, polled by the caller; each failed account is listed with the reason. */
export function CloseProgress({ job, accountName }: { job: BillingJob; accountName: (accountId: string) => string }) {
  const percent = job.total === 0 ? (job.status === 'completed' ? 100 : 0) : Math.round((job.done / job.total) * 100);
  const failed = job.status === 'failed';
  return (
    <div className="space-y-2 rounded-xl border border-line bg-panel px-4 py-3">
      <div className="flex flex-wrap items-baseline justify-between gap-2 text-sm">
        <span className="font-semibold">{statusWords[job.status]}</span>
        <span className="tabular-nums text-ink-muted">
          {job.done} of {job.total} account{job.total === 1 ? '' : 's'}
        </span>
      </div>
      <div
        role="progressbar"
        data-testid="close-progress"
        data-status={job.status}
        aria-label="Closing the billing period"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent}
        aria-valuetext={`${job.done} of ${job.total} accounts billed`}
        className="h-2.5 overflow-hidden rounded-full bg-sunk"
      >
        <div
          className={`h-full rounded-full transition-[width] duration-500 ${failed ? 'bg-danger' : job.status === 'completed' ? 'bg-success' : 'bg-accent'}`}
          style={{ width: `${percent}%` }}
        />
      </div>
      {job.errors.length > 0 && (
        <ul data-testid="close-errors" className="space-y-1 text-sm">
          {job.errors.map((error) => (
            <li key={`${error.accountId}-${error.at}`} className="rounded-md bg-danger-soft px-2.5 py-1.5">
              <span className="font-semibold">{accountName(error.accountId)}:</span> {error.message}
            </li>
          ))}
        </ul>
      )}
      {failed && <p className="text-xs text-ink-muted">Accounts already billed stay billed; closing again resumes with the ones left.</p>}
    </div>
  );
}
