import { describeCancellationPolicy, localDate, rateCardInputSchema, type PriceLine } from '@femtoslot/shared';
import type { PricingRules } from '@femtoslot/shared/billing/pricing';
import type { z } from 'zod';
import { IsNull, LessThan } from 'typeorm';
import type { SessionUser } from '../../lib/auth/session';
import type { AppContext } from '../../lib/context';
import { AppError, notFound } from '../../lib/errors/app-error';
import { recordAudit } from '../audit/audit.service';
import { TimelineBlock } from '../bookings/timeline-block.entity';
import { FacilitySettings } from '../facility/facility-settings.entity';
import { UsageLog } from '../usage/usage-log.entity';
import { linesForBooking, loadStatementLookups } from '../billing/statement';
import { rateCardOn } from './rate-card-lookup';
import { RateCard } from './rate-card.entity';

export const toRateCardDto = (c: RateCard) => ({
  id: c.id, name: c.name, effectiveFrom: c.effectiveFrom, effectiveTo: c.effectiveTo, currency: c.currency.trim(),
  billingIncrementMinutes: c.billingIncrementMinutes, changeoverSharePercent: c.changeoverSharePercent, minimumChargeMinutes: c.minimumChargeMinutes, rates: c.rates,
});

export const rulesOf = (c: RateCard): PricingRules => ({
  currency: c.currency.trim(), billingIncrementMinutes: c.billingIncrementMinutes, changeoverSharePercent: c.changeoverSharePercent,
  minimumChargeMinutes: c.minimumChargeMinutes, rates: c.rates,
});

export function rateCardsService(ctx: AppContext) {
  const db = ctx.db;

  /** The cards, with the facility's cancellation windows (the policy the fees follow; kept in facility settings). */
  async function list() {
    const rows = await db.getRepository(RateCard).find({ order: { effectiveFrom: 'DESC' } });
    const { policies } = await db.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
    const windows = { cancellationFreeHours: policies.cancellationFreeHours, cancellationHalfFeeHours: policies.cancellationHalfFeeHours };
    return { rateCards: rows.map(toRateCardDto), cancellationPolicy: { ...windows, description: describeCancellationPolicy(windows) } };
  }

  /** A new card ends the open-ended card before it; any other overlap is refused by rate_cards_no_overlap (409). */
  async function create(user: SessionUser, input: z.output<typeof rateCardInputSchema>, requestId?: string) {
    return db.transaction(async (m) => {
      const facility = await m.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
      if (input.currency !== facility.currency.trim()) {
        throw new AppError('currency_mismatch', `Rate cards are in the facility currency (${facility.currency.trim()})`, 422, { currency: facility.currency.trim() });
      }
      await m.query('LOCK TABLE rate_cards IN SHARE ROW EXCLUSIVE MODE');
      await m.getRepository(RateCard).update({ effectiveTo: IsNull(), effectiveFrom: LessThan(input.effectiveFrom) }, { effectiveTo: input.effectiveFrom });
      const card = await m.getRepository(RateCard).save(m.getRepository(RateCard).create({
        name: input.name, effectiveFrom: input.effectiveFrom, effectiveTo: input.effectiveTo ?? null, currency: input.currency,
        billingIncrementMinutes: input.billingIncrementMinutes, changeoverSharePercent: input.changeoverSharePercent,
        minimumChargeMinutes: input.minimumChargeMinutes, rates: input.rates, createdBy: user.id,
      }));
      await recordAudit(m, { actorUserId: user.id, action: 'rate_card.created', entityType: 'rate_card', entityId: card.id, after: toRateCardDto(card), requestId });
      return toRateCardDto(card);
    });
  }

  /** What a booking (or its session log, when there is one) would cost under the card in force on its day. */
  async function preview(bookingId: string): Promise<{ lines: PriceLine[]; totalMinor: number; currency: string; basis: string }> {
    const m = db.manager;
    const b = await m.getRepository(TimelineBlock).findOneBy({ id: bookingId, kind: 'booking' });
    if (!b) throw notFound('Booking');
    const facility = await m.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
    const log = await m.getRepository(UsageLog).findOneBy({ bookingId });
    const card = await rateCardOn(m, localDate(log?.actualStartsAt ?? b.startsAt, facility.timeZone));
    const { lines, basis } = linesForBooking(await loadStatementLookups(m, [b], card.changeoverSharePercent > 0), facility, card, b, log);
    return { lines, totalMinor: lines.reduce((s, l) => s + l.amountMinor, 0), currency: card.currency.trim(), basis };
  }

  return { list, create, preview };
}
