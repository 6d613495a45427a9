import { formatDuration } from '@femtoslot/shared/billing/pricing';
import type { ReactNode } from 'react';
import { StatusPill } from '../../../components/ui/status-pill';
import { formatRatePerHour } from '../../../lib/money';
import type { RateCard } from '../api/get-rate-cards';
import { categories, categoryLabels, rateClassLabels, rateClassesShown } from '../lib/rate-card-form-values';

const inForce = (card: RateCard, today: string) => card.effectiveFrom <= today && (!card.effectiveTo || today < card.effectiveTo);

function Term({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div>
      <dt className="text-xs text-ink-muted">{label}</dt>
      <dd className="font-semibold">{children}</dd>
    </div>
  );
}

function RateCardItem({ card, today }: { card: RateCard; today: string }) {
  const current = inForce(card, today);
  return (
    <article data-testid="rate-card" data-rate-card-id={card.id} data-in-force={current || undefined} className="overflow-hidden rounded-xl border border-line bg-panel">
      <header className="flex flex-wrap items-center justify-between gap-2 border-b border-line px-4 py-3">
        <h3 className="font-semibold">{card.name}</h3>
        <span className="flex items-center gap-2 text-sm">
          <span className="tabular-nums">
            {card.effectiveFrom} → {card.effectiveTo ? `${card.effectiveTo} (exclusive)` : 'open-ended'}
          </span>
          {current && <StatusPill tone="success">In force today</StatusPill>}
          {!current && card.effectiveFrom > today && <StatusPill tone="accent">Upcoming</StatusPill>}
        </span>
      </header>
      <dl className="grid grid-cols-2 gap-3 px-4 py-3 text-sm sm:grid-cols-4">
        <Term label="Billing increment">{formatDuration(card.billingIncrementMinutes)}, rounded up</Term>
        <Term label="Changeover charged">{card.changeoverSharePercent} % to the incoming booking</Term>
        <Term label="Minimum charge">{card.minimumChargeMinutes ? formatDuration(card.minimumChargeMinutes) : 'None'}</Term>
        <Term label="Currency">{card.currency}</Term>
      </dl>
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">Rates per hour of {card.name}, by user category and configuration rate class</caption>
        <thead className="border-t border-line bg-sunk/60 text-xs text-ink-muted">
          <tr>
            <th scope="col" className="px-4 py-2 font-semibold">User category</th>
            {rateClassesShown.map((k) => (
              <th key={k} scope="col" className="px-4 py-2 text-right font-semibold">{rateClassLabels[k]} rate class</th>
            ))}
          </tr>
        </thead>
        <tbody>
          {categories.map((c) => (
            <tr key={c} className="border-t border-line">
              <th scope="row" className="px-4 py-2 font-semibold">{categoryLabels[c]}</th>
              {rateClassesShown.map((k) => (
                <td key={k} data-rate-minor={card.rates[c][k]} className="px-4 py-2 text-right tabular-nums">
                  {formatRatePerHour(card.rates[c][k], card.currency)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </article>
  );
}

export function RateCardsList({ cards, today }: { cards: RateCard[]; today: string }) {
  if (cards.length === 0) return <p className="rounded-xl border border-dashed border-line px-4 py-8 text-center text-sm text-ink-muted">No rate card yet.</p>;
  return (
    <div className="space-y-4">
      {cards.map((card) => (
        <RateCardItem key={card.id} card={card} today={today} />
      ))}
    </div>
  );
}
