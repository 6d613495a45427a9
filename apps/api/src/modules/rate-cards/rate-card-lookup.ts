import { IsNull, LessThanOrEqual, MoreThan, type EntityManager } from 'typeorm';
import { AppError } from '../../lib/errors/app-error';
import { RateCard } from './rate-card.entity';

/** The rate card in force on a facility-local date, or a 422 that names the date. */
export async function rateCardOn(m: EntityManager, date: string): Promise<RateCard> {
  const card = await m.getRepository(RateCard).findOne({
    where: [{ effectiveFrom: LessThanOrEqual(date), effectiveTo: IsNull() }, { effectiveFrom: LessThanOrEqual(date), effectiveTo: MoreThan(date) }],
  });
  if (!card) throw new AppError('no_rate_card', `No rate card is in force on ${date}; finance must add one first`, 422, { date });
  return card;
}
