import { changeoverFor, localDate, wallTimeAt, type AccountStatement, type OrganisationKind, type PriceLine } from '@femtoslot/shared';
import { cancellationFeeLine, displacementLine, usageLines, type LineContext } from '@femtoslot/shared/billing/pricing';
import { In, type EntityManager } from 'typeorm';
import { Account } from '../accounts/account.entity';
import { TimelineBlock } from '../bookings/timeline-block.entity';
import { loadInstrumentTimeline, stateOf, type InstrumentTimeline } from '../bookings/timeline.repository';
import type { FacilitySettings } from '../facility/facility-settings.entity';
import { Configuration } from '../instruments/configuration.entity';
import { Organisation } from '../organisations/organisation.entity';
import { rateCardsBetween } from '../rate-cards/rate-card-lookup';
import type { RateCard } from '../rate-cards/rate-card.entity';
import { UsageLog } from '../usage/usage-log.entity';

const pad = (n: number) => String(n).padStart(2, '0');

/** "2026-10-06 09:04–12:08" in the facility's zone; each instant converted once (the zone lookup is the costly part). */
function interval(start: Date, end: Date, tz: string): string {
  const s = wallTimeAt(start, tz);
  const e = wallTimeAt(end, tz);
  return `${s.year}-${pad(s.month)}-${pad(s.day)} ${pad(s.hour)}:${pad(s.minute)}–${pad(e.hour)}:${pad(e.minute)}`;
}

/** Everything a booking's lines are priced from besides the booking itself, loaded once for a whole statement. */
export interface StatementLookups {
  accounts: Map<string, Account>;
  organisations: Map<string, Organisation>;
  configurations: Map<string, Configuration>;
  /** Changeover minutes before each booking (by booking id); only filled when a rate card charges a share of it. */
  changeoverBefore: Map<string, number>;
}

const found = <T>(map: Map<string, T>, id: string, what: string): T => {
  const v = map.get(id);
  // The foreign keys make this unreachable; an invariant broken here is a 500, not a silently wrong line.
  if (!v) throw new Error(`statement: ${what} ${id} not found`);
  return v;
};

/** Stands in for a booking id when pricing one that does not exist yet (an estimate): matches no row. */
export const UNSAVED_BOOKING_ID = '00000000-0000-0000-0000-000000000000';

/**
 * Changeover minutes the source needed before each booking, from the booking before it on the same instrument: one
 * query for every predecessor, one timeline per instrument. The bookings are passed as values, so an estimate for a
 * booking not yet saved finds its predecessor the same way.
 */
async function changeoverBeforeAll(m: EntityManager, bookings: TimelineBlock[]): Promise<Map<string, number>> {
  const out = new Map<string, number>();
  if (!bookings.length) return out;
  const previous: { booking_id: string; configuration_id: string | null; target_min_nm: string | null; target_max_nm: string | null }[] = await m.query(
    `SELECT b.id AS booking_id, p.configuration_id, p.target_min_nm, p.target_max_nm
       FROM unnest($1::uuid[], $2::uuid[], $3::timestamptz[]) AS b(id, instrument_id, starts_at)
       JOIN LATERAL (SELECT q.configuration_id, q.target_min_nm, q.target_max_nm FROM timeline_blocks q
                      WHERE q.instrument_id = b.instrument_id AND q.kind = 'booking' AND q.status IN ('approved', 'completed')
                        AND q.ends_at <= b.starts_at AND q.id <> b.id
                      ORDER BY q.ends_at DESC LIMIT 1) p ON true`,
    [bookings.map((b) => b.id), bookings.map((b) => b.instrumentId), bookings.map((b) => b.startsAt)]);
  const byId = new Map(bookings.map((b) => [b.id, b]));
  const timelines = new Map<string, InstrumentTimeline>();
  for (const p of previous) {
    const b = byId.get(p.booking_id)!;
    let timeline = timelines.get(b.instrumentId);
    if (!timeline) {
      timeline = await loadInstrumentTimeline(m, b.instrumentId);
      timelines.set(b.instrumentId, timeline);
    }
    const nm = (v: string | null) => (v === null ? null : Number(v));
    const from = stateOf({ configurationId: p.configuration_id, targetMinNm: nm(p.target_min_nm), targetMaxNm: nm(p.target_max_nm) }, timeline.configurations);
    const to = stateOf(b, timeline.configurations);
    if (to) out.set(b.id, changeoverFor(from, to, timeline.model, false).totalMinutes);
  }
  return out;
}

/** The accounts, organisations and configurations of these bookings, three queries whatever their number. */
export async function loadStatementLookups(m: EntityManager, bookings: TimelineBlock[], withChangeover: boolean): Promise<StatementLookups> {
  const byId = async <T extends { id: string }>(entity: new () => T, ids: (string | null)[]): Promise<Map<string, T>> => {
    const wanted = [...new Set(ids.filter((id): id is string => id !== null))];
    const rows = wanted.length ? await m.getRepository(entity).findBy({ id: In(wanted) } as never) : [];
    return new Map(rows.map((r) => [r.id, r]));
  };
  const accounts = await byId(Account, bookings.map((b) => b.accountId));
  const organisations = await byId(Organisation, [...accounts.values()].map((a) => a.organisationId));
  const configurations = await byId(Configuration, bookings.map((b) => b.configurationId));
  const changeoverBefore = withChangeover ? await changeoverBeforeAll(m, bookings) : new Map<string, number>();
  return { accounts, organisations, configurations, changeoverBefore };
}

export interface BookingLines { lines: PriceLine[]; basis: 'confirmed_log' | 'unconfirmed_log' | 'booked_times' | 'cancellation' | 'displacement' | 'none' }

/** Price lines of one booking under one rate card: its log if there is one, else its booked times; fees; displacement. */
export function linesForBooking(look: StatementLookups, facility: FacilitySettings, card: RateCard, b: TimelineBlock, log: UsageLog | null): BookingLines {
  const account = found(look.accounts, b.accountId!, 'account');
  const organisation = found(look.organisations, account.organisationId, 'organisation');
  const configuration = found(look.configurations, b.configurationId!, 'configuration');
  const rules = { currency: card.currency.trim(), billingIncrementMinutes: card.billingIncrementMinutes, changeoverSharePercent: card.changeoverSharePercent, minimumChargeMinutes: card.minimumChargeMinutes, rates: card.rates };
  const tz = facility.timeZone;
  const base = (key: string, label: string): LineContext => ({ key, bookingId: b.id, usageLogId: log?.id ?? null, label, category: organisation.kind as OrganisationKind, rateClass: configuration.rateClass });
  const booked = { start: b.startsAt, end: b.endsAt };
  if (b.status === 'cancelled') {
    if (!b.cancellationFeePercent || !b.cancelledAt) return { lines: [], basis: 'none' };
    const hoursBefore = (b.startsAt.getTime() - b.cancelledAt.getTime()) / 3_600_000;
    const label = `Cancelled beam time ${interval(b.startsAt, b.endsAt, tz)}, ${configuration.name}`;
    return { lines: [cancellationFeeLine(rules, base(`cancellation-${b.id}`, label), booked, b.cancellationFeePercent, hoursBefore)], basis: 'cancellation' };
  }
  if (b.status === 'displaced') return { lines: [displacementLine(rules, base(`displacement-${b.id}`, `Displaced beam time ${interval(b.startsAt, b.endsAt, tz)}, ${configuration.name}`), booked)], basis: 'displacement' };
  const changeover = rules.changeoverSharePercent > 0 ? look.changeoverBefore.get(b.id) ?? 0 : 0;
  const span = log ? { start: log.actualStartsAt, end: log.actualEndsAt } : booked;
  const label = `Beam time ${interval(span.start, span.end, tz)}, ${configuration.name}`;
  const key = log ? `usage-${log.id}` : `booking-${b.id}`;
  return { lines: usageLines(rules, base(key, label), span, changeover), basis: log ? (log.status === 'submitted' ? 'unconfirmed_log' : 'confirmed_log') : 'booked_times' };
}

export type { AccountStatement };

/** A booking to price: with its session log (usage), or without (a cancellation fee or a displacement). */
export interface PricedItem { b: TimelineBlock; log: UsageLog | null }

/**
 * The lines of each item, priced by the rate card in force on its facility-local day (the session's start; the
 * cancellation's instant; the booked start of a displacement), with the lookups they were priced from.
 */
export async function priceItems(m: EntityManager, facility: FacilitySettings, items: PricedItem[]): Promise<{ lines: PriceLine[][]; look: StatementLookups }> {
  const tz = facility.timeZone;
  const days = items.map((p) => localDate(p.log ? p.log.actualStartsAt : p.b.status === 'cancelled' ? p.b.cancelledAt! : p.b.startsAt, tz));
  const look = (withChangeover: boolean) => loadStatementLookups(m, items.map((p) => p.b), withChangeover);
  if (!items.length) return { lines: [], look: await look(false) };
  const sorted = [...days].sort();
  const cardOn = await rateCardsBetween(m, sorted[0]!, sorted[sorted.length - 1]!);
  // Checked in item order, so a missing card is reported for the first day that needs it.
  const cards = days.map((day) => cardOn(day));
  const lookups = await look(cards.some((c) => c.changeoverSharePercent > 0));
  return { lines: items.map((p, i) => linesForBooking(lookups, facility, cards[i]!, p.b, p.log).lines), look: lookups };
}

/**
 * The statement of a month: confirmed, unbilled session logs that started in it; cancellation fees of bookings
 * cancelled in it; zero lines for bookings displaced by maintenance that were to start in it. Each line is priced by
 * the rate card in force on its facility-local day. A fixed handful of queries, whatever the number of sessions.
 */
export async function computeStatement(m: EntityManager, facility: FacilitySettings, bounds: { startsAt: Date; endsAt: Date }): Promise<AccountStatement[]> {
  const logs: UsageLog[] = await m.getRepository(UsageLog).createQueryBuilder('u')
    .where(`u.status = 'confirmed' AND u.actual_starts_at >= :from AND u.actual_starts_at < :to`, { from: bounds.startsAt, to: bounds.endsAt })
    .orderBy('u.actual_starts_at', 'ASC').getMany();
  // One array parameter rather than one placeholder per log.
  const logBookings = logs.length ? await m.getRepository(TimelineBlock).createQueryBuilder('b').where('b.id = ANY(:ids)', { ids: logs.map((l) => l.bookingId) }).getMany() : [];
  const bookingById = new Map(logBookings.map((b) => [b.id, b]));
  const others: TimelineBlock[] = await m.getRepository(TimelineBlock).createQueryBuilder('b')
    .where(`b.kind = 'booking' AND ((b.status = 'cancelled' AND b.cancellation_fee_percent > 0 AND b.cancelled_at >= :from AND b.cancelled_at < :to)
      OR (b.status = 'displaced' AND b.starts_at >= :from AND b.starts_at < :to))`, { from: bounds.startsAt, to: bounds.endsAt })
    .orderBy('b.starts_at', 'ASC').getMany();
  const priced: PricedItem[] = [...logs.map((log) => ({ b: bookingById.get(log.bookingId)!, log })), ...others.map((b) => ({ b, log: null }))];
  if (!priced.length) return [];
  const { lines: pricedLines, look } = await priceItems(m, facility, priced);

  const byAccount = new Map<string, PriceLine[]>();
  priced.forEach((p, i) => {
    const lines = pricedLines[i]!;
    if (!lines.length) return;
    const list = byAccount.get(p.b.accountId!);
    if (list) list.push(...lines);
    else byAccount.set(p.b.accountId!, [...lines]);
  });
  const currency = facility.currency.trim();
  return [...byAccount].map(([accountId, lines]) => {
    const a = found(look.accounts, accountId, 'account');
    return {
      accountId: a.id, accountName: a.name, accountKind: a.kind, organisationId: a.organisationId, organisationName: look.organisations.get(a.organisationId)?.name ?? '',
      costCentreCode: a.costCentreCode, currency, lines, totalMinor: lines.reduce((s, l) => s + l.amountMinor, 0),
    };
  }).sort((x, y) => x.accountName.localeCompare(y.accountName));
}
