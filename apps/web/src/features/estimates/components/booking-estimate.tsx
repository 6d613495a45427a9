import type { BookingEstimateInput } from '@femtoslot/shared';
import type { BookingEstimateDto } from '@femtoslot/shared/billing/estimate.types';
import { toast } from 'sonner';
import { Button } from '../../../components/ui/button';
import { isApiError } from '../../../lib/api-client';
import { formatMinor } from '../../../lib/money';
import { formatInstant } from '../../../lib/wall-time';
import { useDownloadQuote } from '../api/download-quote';
import { useEstimate } from '../api/get-estimate';

const windowLabel = (w: BookingEstimateDto['cancellation']['windows'][number], timeZone: string) =>
  w.percent === 0 ? `Free until ${formatInstant(w.until, timeZone)}` : `${w.percent} % from ${formatInstant(w.from!, timeZone)}`;

/**
 * The live price of the request being filled in: the charge for the booked time (and the changeover share, when the
 * rate card charges one) and what cancelling would cost in each window, with a quote PDF for a purchase order.
 */
export function BookingEstimate({ body, timeZone }: { body: BookingEstimateInput | null; timeZone: string }) {
  const estimate = useEstimate(body);
  const download = useDownloadQuote();
  if (!body) return null;
  if (estimate.isError) {
    const error = estimate.error;
    const text = isApiError(error) && error.code === 'no_rate_card' ? `No price yet: ${error.message}.` : `The estimate is not available: ${error.message}`;
    return (
      <p data-testid="booking-estimate" data-state="error" className="rounded-lg border border-line px-3 py-2 text-sm text-ink-muted">
        {text}
      </p>
    );
  }
  const e = estimate.data;
  if (!e) {
    return (
      <p data-testid="booking-estimate" data-state="loading" className="rounded-lg border border-line px-3 py-2 text-sm text-ink-muted">
        Pricing the request…
      </p>
    );
  }
  const changeover = e.lines.find((l) => l.kind === 'changeover');
  return (
    <section data-testid="booking-estimate" data-state="ready" data-total-minor={e.totalMinor} aria-live="polite" className="space-y-2 rounded-lg border border-accent/40 bg-accent-soft px-3 py-2.5 text-sm">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p className="font-semibold">
          Estimated charge{' '}
          <span data-testid="estimate-total" className="ml-1 text-lg font-bold tabular-nums">
            {formatMinor(e.totalMinor, e.currency)}
          </span>
        </p>
        <Button
          size="sm"
          variant="secondary"
          data-testid="download-quote"
          busy={download.isPending}
          onClick={() => download.mutate(body, { onSuccess: (name) => toast.success(`Quote saved as ${name}`), onError: (error) => toast.error(error.message) })}
        >
          Quote (PDF)
        </Button>
      </div>
      <ul className="space-y-0.5 text-xs text-ink-muted">
        {e.lines.map((l) => (
          <li key={l.key} data-testid="estimate-line" data-kind={l.kind}>
            {l.explanation} = <span className="font-semibold text-ink tabular-nums">{formatMinor(l.amountMinor, e.currency)}</span>
          </li>
        ))}
        {!changeover && e.changeoverMinutes > 0 && <li>Changeover before it: {e.changeoverMinutes} min, absorbed by the facility under this rate card.</li>}
      </ul>
      <div>
        <p className="text-xs font-semibold">If you cancel</p>
        <ul data-testid="estimate-cancellation" className="grid gap-x-4 text-xs sm:grid-cols-3">
          {e.cancellation.windows.map((w) => (
            <li key={w.percent} data-testid="estimate-window" data-percent={w.percent} data-amount-minor={w.amountMinor}>
              {windowLabel(w, timeZone)}: <span className="font-semibold tabular-nums">{formatMinor(w.amountMinor, e.currency)}</span>
            </li>
          ))}
        </ul>
      </div>
      <p className="text-xs text-ink-muted">
        Rate card “{e.rateCard.name}”. The invoice bills the confirmed session log, rounded up to {e.rateCard.billingIncrementMinutes} min.
      </p>
    </section>
  );
}
