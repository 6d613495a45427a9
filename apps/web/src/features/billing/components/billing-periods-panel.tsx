import { billingPeriodInputSchema } from '@femtoslot/shared';
import { type FormEvent, type ReactNode, useState } from 'react';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { isApiError } from '../../../lib/api-client';
import { cx } from '../../../lib/cx';
import { usePeriods } from '../api/get-periods';
import { useOpenPeriod } from '../api/open-period';
import { monthLabel, previousMonth } from '../../../lib/months';
import { PeriodView, periodStatusPill } from './period-view';

export interface BillingPeriodsPanelProps {
  timeZone: string;
  /** finance opens and closes periods; admin reads them */
  canClose: boolean;
  closedInvoices: (periodId: string) => ReactNode;
}

/** Close a billing period: pick the month, read the statement, close it and watch the invoices go out. */
export function BillingPeriodsPanel({ timeZone, canClose, closedInvoices }: BillingPeriodsPanelProps) {
  const periods = usePeriods();
  const open = useOpenPeriod();
  const [month, setMonth] = useState(() => previousMonth(new Date(), timeZone));
  const [monthError, setMonthError] = useState<string | null>(null);
  const [selected, setSelected] = useState<string | null>(null);

  const onOpen = (event: FormEvent) => {
    event.preventDefault();
    const parsed = billingPeriodInputSchema.safeParse({ month });
    if (!parsed.success) {
      setMonthError(parsed.error.issues[0]?.message ?? 'Pick a month');
      return;
    }
    setMonthError(null);
    open.mutate(parsed.data, {
      onSuccess: (detail) => setSelected(detail.period.id),
      // A month that cannot be billed (not ended, out of range) is the field's fault: say so beside it.
      onError: (error) => (isApiError(error) && error.status === 422 ? setMonthError(error.message) : toast.error(error.message)),
    });
  };

  return (
    <div className="grid gap-5 lg:grid-cols-[16rem_minmax(0,1fr)]">
      <div className="space-y-4">
        {canClose && (
          <form onSubmit={onOpen} noValidate className="space-y-3 rounded-xl border border-line bg-panel p-4">
            <TextField
              label="Month"
              type="month"
              data-testid="period-month"
              value={month}
              onChange={(event) => setMonth(event.target.value)}
              error={monthError ?? undefined}
              hint={`Calendar month in facility time (${timeZone}).`}
            />
            <Button type="submit" data-testid="open-period" busy={open.isPending} className="w-full">
              Preview the period
            </Button>
          </form>
        )}
        <nav aria-label="Billing periods" className="rounded-xl border border-line bg-panel">
          <h3 className="border-b border-line px-4 py-2.5 text-sm font-semibold">Billing periods</h3>
          {periods.isPending ? (
            <p className="px-4 py-3 text-sm text-ink-muted">Loading…</p>
          ) : periods.isError ? (
            <div className="p-3">
              <Notice tone="danger" title="Periods could not be loaded">{periods.error.message}</Notice>
            </div>
          ) : periods.data.length === 0 ? (
            <p className="px-4 py-3 text-sm text-ink-muted">No billing period yet.</p>
          ) : (
            <ul data-testid="periods-list" className="divide-y divide-line">
              {periods.data.map((period) => (
                <li key={period.id}>
                  <button
                    type="button"
                    data-testid="period-row"
                    data-status={period.status}
                    aria-current={selected === period.id || undefined}
                    onClick={() => setSelected(period.id)}
                    className={cx('flex w-full items-center justify-between gap-2 px-4 py-2 text-left text-sm hover:bg-sunk', selected === period.id && 'bg-accent-soft')}
                  >
                    <span className="font-semibold">{monthLabel(period.month)}</span>
                    {periodStatusPill[period.status]}
                  </button>
                </li>
              ))}
            </ul>
          )}
        </nav>
      </div>
      <div className="min-w-0">
        {selected ? (
          <PeriodView key={selected} periodId={selected} canClose={canClose} timeZone={timeZone} closedInvoices={closedInvoices} />
        ) : (
          <p className="rounded-xl border border-dashed border-line px-4 py-10 text-center text-sm text-ink-muted">
            {canClose ? 'Pick a month and preview it, or choose a period from the list.' : 'Choose a period from the list to read its statement.'}
          </p>
        )}
      </div>
    </div>
  );
}
