import type { Configuration } from '../modules/instruments/configuration.entity';
import { TimelineBlock } from '../modules/bookings/timeline-block.entity';
import type { DataSource } from 'typeorm';
import type { TestApi } from './test-api';

/** Sessions in the past cannot be requested through the API (the start would be in the past), so tests insert them. */
export async function pastSession(t: TestApi, o: { instrumentId: string; configuration: Configuration; accountId: string; userId: string; organisationId: string; startsAt: Date; hours: number; nm: number }) {
  return t.api.ctx.db.getRepository(TimelineBlock).save(t.api.ctx.db.getRepository(TimelineBlock).create({
    instrumentId: o.instrumentId, kind: 'booking', status: 'approved', startsAt: o.startsAt, endsAt: new Date(o.startsAt.getTime() + o.hours * 3_600_000),
    configurationId: o.configuration.id, targetMinNm: o.nm, targetMaxNm: o.nm, accountId: o.accountId, userId: o.userId, organisationId: o.organisationId, purpose: 'past session',
  }));
}

/**
 * The latest whole-hour start whose `hours`-long slot is free on the instrument and ends by `endBy`
 * (the demo seed books weekdays 09:00–12:00 and 14:00–17:30), searching back up to 200 hours.
 */
export async function freePastSlot(db: DataSource, instrumentId: string, hours: number, endBy: Date): Promise<Date> {
  let start = new Date(endBy.getTime() - hours * 3_600_000);
  start.setUTCMinutes(0, 0, 0);
  for (let i = 0; i < 200; i++, start = new Date(start.getTime() - 3_600_000)) {
    const [{ n }] = await db.query(
      `SELECT count(*)::int AS n FROM timeline_blocks WHERE instrument_id = $1 AND status IN ('requested','approved','completed','scheduled') AND tstzrange(starts_at, ends_at) && tstzrange($2, $3)`,
      [instrumentId, start, new Date(start.getTime() + hours * 3_600_000)]);
    if (n === 0) return start;
  }
  throw new Error('no free slot found in the last 200 hours');
}
