import type { Configuration } from '../modules/instruments/configuration.entity';
import { TimelineBlock } from '../modules/bookings/timeline-block.entity';
import type { TestApi } from './test-api';

/** Sessions in the past cannot be requested through the API (the start would be in the past), so tests insert them. */
export async function pastSession(t: TestApi, o: { instrumentId: string; configuration: Configuration; accountId: string; userId: string; organisationId: string; startsAt: Date; hours: number; nm: number }) {
  return t.api.ctx.db.getRepository(TimelineBlock).save(t.api.ctx.db.getRepository(TimelineBlock).create({
    instrumentId: o.instrumentId, kind: 'booking', status: 'approved', startsAt: o.startsAt, endsAt: new Date(o.startsAt.getTime() + o.hours * 3_600_000),
    configurationId: o.configuration.id, targetMinNm: o.nm, targetMaxNm: o.nm, accountId: o.accountId, userId: o.userId, organisationId: o.organisationId, purpose: 'past session',
  }));
}
