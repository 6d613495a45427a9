import { useQueryClient } from '@tanstack/react-query';
import { type ReactNode, useEffect, useRef, useState } from 'react';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { PageLoading } from '../../../components/ui/spinner';
import { StatusPill } from '../../../components/ui/status-pill';
import { isApiError } from '../../../lib/api-client';
import { billingKeys, invoiceKeys } from '../../../lib/query-keys';
import { formatInstant } from '../../../lib/wall-time';
import { useClosePeriod } from '../api/close-period';
import { useBillingJob } from '../api/get-billing-job';
import { usePeriod } from '../api/get-period';
import { monthLabel } from '../../../lib/months';
import { type PeriodStatus, isJobActive } from '../types';
import { CloseProgress } from './close-progress';
import { LeftOutList } from './left-out-list';
import { PeriodPreview } from './period-preview';

export const periodStatusPill: Record<PeriodStatus, ReactNode> = {
  open: <StatusPill tone="accent">Open</StatusPill>,
  closing: <StatusPill tone="caution">Closing</StatusPill>,
  closed: <StatusPill tone="success">Closed</StatusPill>,
};

export interface PeriodViewProps {
  periodId: string;
  canClose: boolean;
  timeZone: string;
  /** the period's invoices and journals, composed by the page from the invoices feature */
  closedInvoices: (periodId: string) => ReactNode;
}

export function PeriodView({ periodId, canClose, timeZone, closedInvoices }: PeriodViewProps) {
  const queryClient = useQueryClient();
  const detail = usePeriod(periodId);
  const close = useClosePeriod();
  const [closeJobId, setCloseJobId] = useState<string | null>(null);
  const [acceptedLeftOut, setAcceptedLeftOut] = useState(false);
  const jobId = closeJobId ?? detail.data?.job?.id ?? null;
  const job = useBillingJob(jobId);
  const lastStatus = useRef<string | undefined>(undefined);

  // When a job we watched running stops, the period, its invoices and the list have all moved on.
  useEffect(() => {
    const status = job.data?.status;
    const was = lastStatus.current;
    lastStatus.current = status;
    if (!status || !was || was === status || isJobActive(job.data)) return;
    void Promise.all([
      queryClient.invalidateQueries({ queryKey: billingKeys.period(periodId) }),
      queryClient.invalidateQueries({ queryKey: billingKeys.periods() }),
      queryClient.invalidateQueries({ queryKey: invoiceKeys.all }),
    ]);
    if (status === 'completed') toast.success('Billing period closed');
    else toast.error('The close stopped with errors; see the list below');
  }, [job.data, periodId, queryClient]);

  if (detail.isPending) return <PageLoading label="Loading the period" />;
  if (detail.isError) return <Notice tone="danger" title="The period could not be loaded">{detail.error.message}</Notice>;

  const { period, preview } = detail.data;
  const current = job.data ?? detail.data.job;
  const running = isJobActive(current);
  const resumable = period.status === 'closing' && current?.status === 'failed';
  const names = new Map(preview.accounts.map((a) => [a.accountId, a.accountName]));
  const leftOut = period.status === 'open' ? (detail.data.leftOut ?? []) : [];
  const mustConfirm = leftOut.length > 0 && !resumable;

  const onClose = () =>
    close.mutate({ periodId: period.id, leftOutCount: mustConfirm ? leftOut.length : undefined }, {
      onSuccess: (answer) => {
        if (answer.job) setCloseJobId(answer.job.id);
        if (!answer.started) toast.info(answer.period.status === 'closed' ? 'This period is already closed' : 'A close is already running');
      },
      onError: (error) => {
        toast.error(error.message);
        // The list changed since it was read (a log confirmed, a booking added): read it again and ask again.
        if (isApiError(error) && error.code === 'left_out_not_confirmed') {
          setAcceptedLeftOut(false);
          void queryClient.invalidateQueries({ queryKey: billingKeys.period(periodId) });
        }
      },
    });

  return (
    <div className="space-y-4" data-period-id={period.id} data-status={period.status}>
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h3 className="flex items-center gap-2 text-lg font-bold">
          {monthLabel(period.month)} {periodStatusPill[period.status]}
        </h3>
        <p className="text-xs text-ink-muted">
          {formatInstant(period.startsAt, timeZone)} to {formatInstant(period.endsAt, timeZone)} ({period.timeZone})
        </p>
      </div>
      {period.status !== 'open' && (
        <p className="text-sm text-ink-muted">The statement below was frozen when the close started.</p>
      )}
      <PeriodPreview preview={preview} />
      {leftOut.length > 0 && <LeftOutList leftOut={leftOut} timeZone={timeZone} />}
      {canClose && (period.status === 'open' || resumable) && !running && (
        <div className="flex flex-wrap items-center justify-between gap-3 rounded-xl border border-line bg-sunk/60 px-4 py-3">
          <div className="max-w-prose space-y-2 text-sm">
            <p className="text-ink-muted">
              Closing freezes this statement, marks its session logs billed, sends each external invoice to Stripe and e-mails the billing contact, and
              writes a journal for each cost centre. It cannot be undone.
            </p>
            {mustConfirm && (
              <label className="flex items-start gap-2 font-semibold">
                <input
                  type="checkbox"
                  data-testid="confirm-left-out"
                  className="mt-1"
                  checked={acceptedLeftOut}
                  onChange={(event) => setAcceptedLeftOut(event.target.checked)}
                />
                <span>
                  Close without the {leftOut.length} booking{leftOut.length === 1 ? '' : 's'} listed above; they will not be billed in this period.
                </span>
              </label>
            )}
          </div>
          <Button data-testid="close-period" busy={close.isPending} disabled={mustConfirm && !acceptedLeftOut} onClick={onClose}>
            {resumable ? 'Resume closing' : 'Close period'}
          </Button>
        </div>
      )}
      {current && <CloseProgress job={current} accountName={(id) => names.get(id) ?? 'An account'} />}
      {job.isError && <Notice tone="danger" title="Progress could not be read">{job.error.message}</Notice>}
      {period.status === 'closed' && (
        <section data-testid="period-closed" className="space-y-2">
          <h4 className="font-semibold">
            Closed {period.closedAt ? formatInstant(period.closedAt, timeZone) : ''}: invoices and journals
          </h4>
          {closedInvoices(period.id)}
        </section>
      )}
    </div>
  );
}
