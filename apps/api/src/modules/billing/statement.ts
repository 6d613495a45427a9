import { changeoverFor, localDate, wallTimeAt, zonedToUtc, type AccountStatement, type OrganisationKind, type PriceLine } from '@femtoslot/shared';
import { cancellationFeeLine, displacementLine, usageLines, type LineContext } from '@femtoslot/shared/billing/pricing';
import { In, LessThanOrEqual, Not, type EntityManager } from 'typeorm';
import { Account } from '../accounts/account.entity';
import { TimelineBlock } from '../bookings/timeline-block.entity';
import { loadInstrumentTimeline, stateOf } from '../bookings/timeline.repository';
import type { FacilitySettings } from '../facility/facility-settings.entity';
import { Configuration } from '../instruments/configuration.entity';
import { Organisation } from '../organisations/organisation.entity';
import { rateCardOn } from '../rate-cards/rate-card-lookup';
import type { RateCard } from '../rate-cards/rate-card.entity';
import { UsageLog } from '../usage/usage-log.entity';

/** The facility-local calendar month as a half-open UTC interval. */
export function monthBounds(month: string, timeZone: string): { startsAt: Date; endsAt: Date } {
  const [year, mon] = month.split('-').map(Number) as [number, number];
  const next = mon === 12 ? { year: year + 1, month: 1 } : { year, month: mon + 1 };
  return { startsAt: zonedToUtc({ year, month: mon, day: 1, hour: 0, minute: 0 }, timeZone), endsAt: zonedToUtc({ ...next, day: 1, hour: 0, minute: 0 }, timeZone) };
}

function clock(d: Date, tz: string): string {
  const w = wallTimeAt(d, tz);
  return `${String(w.hour).padStart(2, '0')}:${String(w.minute).padStart(2, '0')}`;
}

/** Changeover minutes the source needed before this booking, from the booking before it on the same instrument. */
async function changeoverBefore(m: EntityManager, b: TimelineBlock): Promise<number> {
  const previous = await m.getRepository(TimelineBlock).findOne({
    where: { instrumentId: b.instrumentId, kind: 'booking', status: In(['approved', 'completed']), endsAt: LessThanOrEqual(b.startsAt), id: Not(b.id) },
    order: { endsAt: 'DESC' },
  });
  if (!previous) return 0;
  const timeline = await loadInstrumentTimeline(m, b.instrumentId);
  const from = stateOf(previous, timeline.configurations);
  const to = stateOf(b, timeline.configurations);
  return to ? changeoverFor(from, to, timeline.model, false).totalMinutes : 0;
}

export interface BookingLines { lines: PriceLine[]; basis: 'confirmed_log' | 'unconfirmed_log' | 'booked_times' | 'cancellation' | 'displacement' | 'none' }

/** Price lines of one booking under one rate card: its log if there is one, else its booked times; fees; displacement. */
export async function linesForBooking(m: EntityManager, facility: FacilitySettings, card: RateCard, b: TimelineBlock, log: UsageLog | null): Promise<BookingLines> {
  const account = await m.getRepository(Account).findOneByOrFail({ id: b.accountId! });
  const organisation = await m.getRepository(Organisation).findOneByOrFail({ id: account.organisationId });
  const configuration = await m.getRepository(Configuration).findOneByOrFail({ id: b.configurationId! });
  const rules = { currency: card.currency.trim(), billingIncrementMinutes: card.billingIncrementMinutes, changeoverSharePercent: card.changeoverSharePercent, minimumChargeMinutes: card.minimumChargeMinutes, rates: card.rates };
  const tz = facility.timeZone;
  const base = (key: string, label: string): LineContext => ({ key, bookingId: b.id, usageLogId: log?.id ?? null, label, category: organisation.kind as OrganisationKind, rateClass: configuration.rateClass });
  const booked = { start: b.startsAt, end: b.endsAt };
  const when = `${localDate(b.startsAt, tz)} ${clock(b.startsAt, tz)}–${clock(b.endsAt, tz)}`;
  if (b.status === 'cancelled') {
    if (!b.cancellationFeePercent || !b.cancelledAt) return { lines: [], basis: 'none' };
    const hoursBefore = (b.startsAt.getTime() - b.cancelledAt.getTime()) / 3_600_000;
    return { lines: [cancellationFeeLine(rules, base(`cancellation-${b.id}`, `Cancelled beam time ${when}, ${configuration.name}`), booked, b.cancellationFeePercent, hoursBefore)], basis: 'cancellation' };
  }
  if (b.status === 'displaced') return { lines: [displacementLine(rules, base(`displacement-${b.id}`, `Displaced beam time ${when}, ${configuration.name}`), booked)], basis: 'displacement' };
  const changeover = rules.changeoverSharePercent > 0 ? await changeoverBefore(m, b) : 0;
  const span = log ? { start: log.actualStartsAt, end: log.actualEndsAt } : booked;
  const label = `Beam time ${localDate(span.start, tz)} ${clock(span.start, tz)}–${clock(span.end, tz)}, ${configuration.name}`;
  const key = log ? `usage-${log.id}` : `booking-${b.id}`;
  return { lines: usageLines(rules, base(key, label), span, changeover), basis: log ? (log.status === 'submitted' ? 'unconfirmed_log' : 'confirmed_log') : 'booked_times' };
}

export type { AccountStatement };

const cardCache = (m: EntityManager) => {
  const cards = new Map<string, Promise<RateCard>>();
  return async (date: string) => {
    let c = cards.get(date);
    if (!c) {
      c = rateCardOn(m, date);
      cards.set(date, c);
    }
    return c;
  };
};

/**
 * The statement of a month: confirmed, unbilled session logs that started in it; cancellation fees of bookings
 * cancelled in it; zero lines for bookings displaced by maintenance that were to start in it. Each line is priced by
 * the rate card in force on its facility-local day.
 */
export async function computeStatement(m: EntityManager, facility: FacilitySettings, bounds: { startsAt: Date; endsAt: Date }): Promise<AccountStatement[]> {
  const tz = facility.timeZone;
  const cardOn = cardCache(m);
  const logs: UsageLog[] = await m.getRepository(UsageLog).createQueryBuilder('u')
    .where(`u.status = 'confirmed' AND u.actual_starts_at >= :from AND u.actual_starts_at < :to`, { from: bounds.startsAt, to: bounds.endsAt })
    .orderBy('u.actual_starts_at', 'ASC').getMany();
  const logBookings = logs.length ? await m.getRepository(TimelineBlock).findBy({ id: In(logs.map((l) => l.bookingId)) }) : [];
  const bookingById = new Map(logBookings.map((b) => [b.id, b]));
  const others: TimelineBlock[] = await m.getRepository(TimelineBlock).createQueryBuilder('b')
    .where(`b.kind = 'booking' AND ((b.status = 'cancelled' AND b.cancellation_fee_percent > 0 AND b.cancelled_at >= :from AND b.cancelled_at < :to)
      OR (b.status = 'displaced' AND b.starts_at >= :from AND b.starts_at < :to))`, { from: bounds.startsAt, to: bounds.endsAt })
    .orderBy('b.starts_at', 'ASC').getMany();

  const byAccount = new Map<string, PriceLine[]>();
  const add = (accountId: string, lines: PriceLine[]) => { if (lines.length) byAccount.set(accountId, [...(byAccount.get(accountId) ?? []), ...lines]); };
  for (const log of logs) {
    const b = bookingById.get(log.bookingId)!;
    add(b.accountId!, (await linesForBooking(m, facility, await cardOn(localDate(log.actualStartsAt, tz)), b, log)).lines);
  }
  for (const b of others) {
    const day = localDate(b.status === 'cancelled' ? b.cancelledAt! : b.startsAt, tz);
    add(b.accountId!, (await linesForBooking(m, facility, await cardOn(day), b, null)).lines);
  }
  if (!byAccount.size) return [];
  const accounts = await m.getRepository(Account).findBy({ id: In([...byAccount.keys()]) });
  const organisations = new Map((await m.getRepository(Organisation).findBy({ id: In(accounts.map((a) => a.organisationId)) })).map((o) => [o.id, o]));
  return accounts.map((a) => {
    const lines = byAccount.get(a.id)!;
    return {
      accountId: a.id, accountName: a.name, accountKind: a.kind, organisationId: a.organisationId, organisationName: organisations.get(a.organisationId)?.name ?? '',
      costCentreCode: a.costCentreCode, currency: facility.currency.trim(), lines, totalMinor: lines.reduce((s, l) => s + l.amountMinor, 0),
    };
  }).sort((x, y) => x.accountName.localeCompare(y.accountName));
}
