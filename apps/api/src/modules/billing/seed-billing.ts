import { localDate } from '@femtoslot/shared';
import { monthBounds } from '@femtoslot/shared/billing/billing-month';
import { In, type EntityManager } from 'typeorm';
import { FacilitySettings } from '../facility/facility-settings.entity';
import { Invoice } from '../invoices/invoice.entity';
import { RateCard } from '../rate-cards/rate-card.entity';
import { UsageLog } from '../usage/usage-log.entity';
import { User } from '../users/user.entity';
import { BillingPeriod, BillingPeriodAccount, JournalLine } from './billing.entities';
import { computeStatement } from './statement';

/**
 * Demo billing: the rate card from three months back, and last month closed for the internal groups by journal
 * (no Stripe needed). External accounts' sessions of that month stay confirmed and unbilled in the demo.
 */
export async function seedBilling(m: EntityManager, now: Date, card: Pick<RateCard, 'name' | 'billingIncrementMinutes' | 'changeoverSharePercent' | 'minimumChargeMinutes' | 'rates'>): Promise<void> {
  const facility = await m.getRepository(FacilitySettings).findOneByOrFail({ id: 1 });
  const today = localDate(now, facility.timeZone);
  const [y, mo] = today.split('-').map(Number) as [number, number];
  const shift = (k: number) => { const d = new Date(Date.UTC(y, mo - 1 - k, 1)); return `${d.getUTCFullYear()}-${String(d.getUTCMonth() + 1).padStart(2, '0')}`; };
  await m.getRepository(RateCard).insert({ ...card, effectiveFrom: `${shift(3)}-01`, effectiveTo: null, currency: facility.currency.trim() });
  const finance = await m.getRepository(User).findOneBy({ role: 'finance' });
  const month = shift(1);
  const bounds = monthBounds(month, facility.timeZone);
  const period = await m.getRepository(BillingPeriod).save(m.getRepository(BillingPeriod).create({
    month, ...bounds, timeZone: facility.timeZone, status: 'closed', createdBy: finance?.id ?? null, closeRequestedBy: finance?.id ?? null, closedAt: now,
  }));
  for (const a of (await computeStatement(m, facility, bounds)).filter((s) => s.accountKind === 'cost_centre')) {
    const [{ seq }] = await m.query(`SELECT nextval('invoice_number_seq')::int AS seq`);
    const invoice = await m.getRepository(Invoice).save(m.getRepository(Invoice).create({
      periodId: period.id, accountId: a.accountId, organisationId: a.organisationId, number: `FS-JNL-${month.replace('-', '')}-${String(seq).padStart(5, '0')}`,
      kind: 'internal', status: 'journal', currency: a.currency, totalMinor: a.totalMinor, amountPaidMinor: 0, lines: a.lines,
    }));
    await m.getRepository(BillingPeriodAccount).insert({ periodId: period.id, accountId: a.accountId, currency: a.currency, lines: a.lines, totalMinor: a.totalMinor, status: 'done', invoiceId: invoice.id });
    for (const line of a.lines) {
      await m.getRepository(JournalLine).insert({ periodId: period.id, accountId: a.accountId, invoiceId: invoice.id, costCentreCode: a.costCentreCode!, lineKey: line.key, amountMinor: line.amountMinor, currency: a.currency, description: `${line.label}: ${line.explanation}` });
    }
    const logIds = a.lines.filter((l) => l.kind === 'usage' && l.usageLogId).map((l) => l.usageLogId!);
    if (logIds.length && finance) await m.getRepository(UsageLog).update({ id: In(logIds) }, { status: 'billed', billedBy: finance.id, billedAt: now });
  }
}
