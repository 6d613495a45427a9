import { createHash } from 'node:crypto';
import { cancellationWindows, describeCancellationPolicy, localDate, wallTimeAt, type BookingEstimateRequest } from '@femtoslot/shared';
import type { BookingEstimateDto, EstimateCancellationWindow } from '@femtoslot/shared/billing/estimate.types';
import type { SessionUser } from '../../lib/auth/session';
import type { AppContext } from '../../lib/context';
import { AppError } from '../../lib/errors/app-error';
import { linesForBooking, loadStatementLookups, UNSAVED_BOOKING_ID } from '../billing/statement';
import { TimelineBlock } from '../bookings/timeline-block.entity';
import { FacilitySettings } from '../facility/facility-settings.entity';
import { Instrument } from '../instruments/instrument.entity';
import { rateCardOn } from '../rate-cards/rate-card-lookup';

/** How long a quote holds: 30 days (common practice for service quotes; the facility may tell otherwise). */
export const QUOTE_VALID_DAYS = 30;

const pad = (n: number) => String(n).padStart(2, '0');
const wall = (d: Date, tz: string) => {
  const w = wallTimeAt(d, tz);
  return `${localDate(d, tz)} ${pad(w.hour)}:${pad(w.minute)}`;
};
const addDays = (isoDate: string, days: number) => new Date(Date.parse(`${isoDate}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
const categoryWords: Record<string, string> = { internal: 'internal', external_academic: 'external academic', industry: 'industry' };

export function estimatesService(ctx: AppContext) {
  const db = ctx.db;

  /**
   * Prices a booking request before it is made, through the statement's own path (linesForBooking over the same
   * lookups, rate card and predecessor changeover): the session as booked is what the invoice bills when the log
   * records exactly the booked times. Cancellation fees come from the same path, as a booking cancelled in each window.
   */
  async function estimate(actor: SessionUser, input: BookingEstimateRequest, now = new Date()): Promise<BookingEstimateDto> {
    const m = db.manager;
    const facility = await m.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
    const tz = facility.timeZone;
    const startsAt = new Date(input.startsAt);
    const endsAt = new Date(input.endsAt);
    const instrument = await m.getRepository(Instrument).findOneBy({ id: input.instrumentId });
    if (!instrument) throw new AppError('unknown_instrument', 'That instrument does not exist', 422, { instrumentId: input.instrumentId });
    const target = 'targetNm' in input.target ? { min: input.target.targetNm, max: input.target.targetNm } : { min: input.target.minNm, max: input.target.maxNm };
    const booking = m.getRepository(TimelineBlock).create({
      id: UNSAVED_BOOKING_ID, instrumentId: instrument.id, kind: 'booking', status: 'approved', startsAt, endsAt, configurationId: input.configurationId,
      targetMinNm: target.min, targetMaxNm: target.max, accountId: input.accountId, userId: actor.id, organisationId: actor.organisationId,
    });
    const look = await loadStatementLookups(m, [booking], true);
    const account = look.accounts.get(input.accountId);
    if (!account || account.organisationId !== actor.organisationId) {
      throw new AppError('account_unusable', 'That account does not belong to your organisation', 422, { accountId: input.accountId });
    }
    const configuration = look.configurations.get(input.configurationId);
    if (!configuration || configuration.instrumentId !== instrument.id) {
      throw new AppError('unknown_configuration', `That configuration is not one of ${instrument.name}'s`, 422, { configurationId: input.configurationId });
    }
    const organisation = look.organisations.get(account.organisationId)!;
    const card = await rateCardOn(m, localDate(startsAt, tz));
    const { lines } = linesForBooking(look, facility, card, booking, null);

    const policy = { cancellationFreeHours: facility.policies.cancellationFreeHours, cancellationHalfFeeHours: facility.policies.cancellationHalfFeeHours };
    const windows: EstimateCancellationWindow[] = cancellationWindows(startsAt, policy).map((w) => {
      // Priced as the statement prices a booking cancelled at the window's last instant (its first, for the 100 % one).
      const cancelledAt = w.percent === 100 ? w.from! : w.until;
      const fee = linesForBooking(look, facility, card, Object.assign(new TimelineBlock(), booking, { status: 'cancelled', cancellationFeePercent: w.percent || null, cancelledAt }), null).lines[0];
      return {
        percent: w.percent, from: w.from?.toISOString() ?? null, until: w.until.toISOString(), fromLocal: w.from ? wall(w.from, tz) : null, untilLocal: wall(w.until, tz),
        amountMinor: fee?.amountMinor ?? 0, explanation: fee?.explanation ?? 'No fee',
      };
    });

    const issuedOn = localDate(now, tz);
    const digest = createHash('sha256').update(JSON.stringify([actor.id, account.id, input.instrumentId, input.configurationId, input.startsAt, input.endsAt, target, issuedOn])).digest('hex');
    return {
      quoteNumber: `FS-Q-${issuedOn.replaceAll('-', '')}-${digest.slice(0, 6).toUpperCase()}`,
      issuedOn, validUntil: addDays(issuedOn, QUOTE_VALID_DAYS), facilityName: facility.name, timeZone: tz, currency: card.currency.trim(),
      account: { id: account.id, name: account.name, kind: account.kind, poNumber: account.poNumber, organisationName: organisation.name, category: categoryWords[organisation.kind] ?? organisation.kind },
      instrument: { id: instrument.id, name: instrument.name },
      configuration: { id: configuration.id, name: configuration.name, rateClass: configuration.rateClass },
      wavelength: target.min === target.max ? `${target.min} nm` : `${target.min}–${target.max} nm`,
      startsAt: startsAt.toISOString(), endsAt: endsAt.toISOString(), startsAtLocal: wall(startsAt, tz), endsAtLocal: wall(endsAt, tz),
      rateCard: {
        id: card.id, name: card.name, effectiveFrom: card.effectiveFrom, billingIncrementMinutes: card.billingIncrementMinutes,
        minimumChargeMinutes: card.minimumChargeMinutes, changeoverSharePercent: card.changeoverSharePercent,
      },
      changeoverMinutes: look.changeoverBefore.get(UNSAVED_BOOKING_ID) ?? 0,
      lines, totalMinor: lines.reduce((s, l) => s + l.amountMinor, 0),
      cancellation: { description: describeCancellationPolicy(policy), windows },
    };
  }

  return { estimate };
}
