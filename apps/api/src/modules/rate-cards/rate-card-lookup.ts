import { IsNull, LessThanOrEqual, MoreThan, type EntityManager } from 'typeorm';
import { AppError } from '../../lib/errors/app-error';
import { RateCard } from './rate-card.entity';

const noCard = (date: string) => new AppError('no_rate_card', `No rate card is in force on ${date}; finance must add one first`, 422, { date });

/** The rate card in force on a facility-local date, or a 422 that names the date. */
export async function rateCardOn(m: EntityManager, date: string): Promise<RateCard> {
  const card = await m.getRepository(RateCard).findOne({
    where: [{ effectiveFrom: LessThanOrEqual(date), effectiveTo: IsNull() }, { effectiveFrom: LessThanOrEqual(date), effectiveTo: MoreThan(date) }],
  });
  if (!card) throw noCard(date);
  return card;
}

/**
 * Every card in force on some day from `first` to `last` (facility-local dates), in one query; the answer picks the
 * card of a day, or throws the same 422 as rateCardOn. Cards never overlap (rate_cards_no_overlap), so at most one fits.
 */
export async function rateCardsBetween(m: EntityManager, first: string, last: string): Promise<(date: string) => RateCard> {
  const cards = await m.getRepository(RateCard).find({
    where: [{ effectiveFrom: LessThanOrEqual(last), effectiveTo: IsNull() }, { effectiveFrom: LessThanOrEqual(last), effectiveTo: MoreThan(first) }],
  });
  const byDay = new Map<string, RateCard>();
  return (date) => {
    let card = byDay.get(date);
    if (!card) {
      // ISO dates compare as strings.
      card = cards.find((c) => c.effectiveFrom <= date && (c.effectiveTo === null || c.effectiveTo > date));
      if (!card) throw noCard(date);
      byDay.set(date, card);
    }
    return card;
  };
}
