import { formatMoney } from '@femtoslot/shared/billing/money';
import type { GroupSpendDto, SpendAmounts } from '@femtoslot/shared/billing/spend.schemas';
import type { PriceLine } from '@femtoslot/shared';
import type { EntityManager } from 'typeorm';
import { Account } from '../accounts/account.entity';
import { TimelineBlock } from '../bookings/timeline-block.entity';
import type { FacilitySettings } from '../facility/facility-settings.entity';
import { Invoice } from '../invoices/invoice.entity';
import { UsageLog } from '../usage/usage-log.entity';
import { monthBounds } from '@femtoslot/shared/billing/billing-month';
import { priceItems, type PricedItem } from './statement';

export interface SpendScope {
  organisation: { id: string; name: string };
  /** Only this person's bookings (a member or collaborator looking at their own spend). */
  userId: string | null;
  /** A facility-local month, YYYY-MM: invoices of periods from it on, unbilled charges from its first instant on. */
  from: string | null;
}

function amounts(billedMinor: number, unbilledMinor: number, currency: string): SpendAmounts {
  const totalMinor = billedMinor + unbilledMinor;
  return {
    billedMinor, unbilledMinor, totalMinor,
    billedFormatted: formatMoney(billedMinor, currency), unbilledFormatted: formatMoney(unbilledMinor, currency), totalFormatted: formatMoney(totalMinor, currency),
  };
}

/**
 * What a group (or one person in it) has spent: the lines of its invoices and journals already issued, plus what the
 * next close would bill for it — confirmed session logs not billed yet and cancellation fees on no invoice yet —
 * priced by the same engine as the close (priceItems: rate card of the day, increment, minimum, changeover share).
 */
export async function groupSpend(m: EntityManager, facility: FacilitySettings, scope: SpendScope): Promise<GroupSpendDto> {
  const currency = facility.currency.trim();
  const orgId = scope.organisation.id;
  const since = scope.from ? monthBounds(scope.from, facility.timeZone).startsAt : new Date(0);

  const invoices: Invoice[] = await m.getRepository(Invoice).createQueryBuilder('i')
    .innerJoin('billing_periods', 'p', 'p.id = i.period_id')
    .where(`i.organisation_id = :orgId AND i.status <> 'void'`, { orgId })
    .andWhere(scope.from ? 'p.month >= :from' : 'TRUE', { from: scope.from })
    .getMany();
  const ownBookings = scope.userId ? await bookingIdsOf(m, scope.userId, invoices.flatMap((i) => i.lines.map((l) => l.bookingId))) : null;
  const billedLines = invoices.flatMap((i) => i.lines.filter((l) => !ownBookings || ownBookings.has(l.bookingId)).map((l) => ({ accountId: i.accountId, line: l })));

  const userFilter = scope.userId ? ' AND b.user_id = :userId' : '';
  const logs = await m.getRepository(UsageLog).createQueryBuilder('u')
    .innerJoin(TimelineBlock, 'b', 'b.id = u.booking_id')
    .innerJoin(Account, 'a', 'a.id = b.account_id')
    .where(`u.status = 'confirmed' AND a.organisation_id = :orgId AND u.actual_starts_at >= :since${userFilter}`, { orgId, since, userId: scope.userId })
    .orderBy('u.actual_starts_at', 'ASC').getMany();
  const logBookings = logs.length ? await m.getRepository(TimelineBlock).createQueryBuilder('b').where('b.id = ANY(:ids)', { ids: logs.map((l) => l.bookingId) }).getMany() : [];
  const byId = new Map(logBookings.map((b) => [b.id, b]));
  // A cancellation fee is billed once its line (key cancellation-<booking id>, as linesForBooking names it) is on an invoice.
  const fees = await m.getRepository(TimelineBlock).createQueryBuilder('b')
    .innerJoin(Account, 'a', 'a.id = b.account_id')
    .where(`b.kind = 'booking' AND b.status = 'cancelled' AND b.cancellation_fee_percent > 0 AND a.organisation_id = :orgId AND b.cancelled_at >= :since${userFilter}`, { orgId, since, userId: scope.userId })
    .andWhere(`NOT EXISTS (SELECT 1 FROM invoices i WHERE i.account_id = b.account_id AND i.lines @> jsonb_build_array(jsonb_build_object('key', 'cancellation-' || b.id::text)))`)
    .orderBy('b.cancelled_at', 'ASC').getMany();
  const items: PricedItem[] = [...logs.map((log) => ({ b: byId.get(log.bookingId)!, log })), ...fees.map((b) => ({ b, log: null }))];
  const priced = await priceItems(m, facility, items);
  const unbilledLines = items.flatMap((p, i) => priced.lines[i]!.map((line) => ({ accountId: p.b.accountId!, line })));

  const accountNames = new Map((await m.getRepository(Account).findBy({ organisationId: orgId })).map((a) => [a.id, a.name]));
  const perAccount = new Map<string, { billed: number; unbilled: number }>();
  const add = (accountId: string, line: PriceLine, kind: 'billed' | 'unbilled') => {
    const row = perAccount.get(accountId) ?? { billed: 0, unbilled: 0 };
    row[kind] += line.amountMinor;
    perAccount.set(accountId, row);
  };
  for (const { accountId, line } of billedLines) add(accountId, line, 'billed');
  for (const { accountId, line } of unbilledLines) add(accountId, line, 'unbilled');
  const billed = billedLines.reduce((s, x) => s + x.line.amountMinor, 0);
  const unbilled = unbilledLines.reduce((s, x) => s + x.line.amountMinor, 0);
  return {
    scope: scope.userId ? 'own' : 'organisation', organisation: scope.organisation, currency, from: scope.from,
    ...amounts(billed, unbilled, currency),
    accounts: [...perAccount].map(([accountId, v]) => ({ accountId, accountName: accountNames.get(accountId) ?? 'Unknown account', ...amounts(v.billed, v.unbilled, currency) }))
      .sort((x, y) => x.accountName.localeCompare(y.accountName)),
    unbilledLines: unbilledLines.filter((x) => x.line.amountMinor !== 0).map(({ accountId, line }) => ({
      key: line.key, bookingId: line.bookingId, accountName: accountNames.get(accountId) ?? 'Unknown account', label: line.label, explanation: line.explanation,
      amountMinor: line.amountMinor, amountFormatted: formatMoney(line.amountMinor, currency),
    })),
  };
}

async function bookingIdsOf(m: EntityManager, userId: string, bookingIds: string[]): Promise<Set<string>> {
  if (!bookingIds.length) return new Set();
  const rows: { id: string }[] = await m.query(`SELECT id FROM timeline_blocks WHERE id = ANY($1::uuid[]) AND user_id = $2`, [[...new Set(bookingIds)], userId]);
  return new Set(rows.map((r) => r.id));
}
