import { formatMoney, minorToDecimalString } from '@femtoslot/shared/billing/money';
import { toCsv } from '@femtoslot/shared/csv/csv-export';
import { In } from 'typeorm';
import type { SessionUser } from '../../lib/auth/session';
import type { AppContext } from '../../lib/context';
import { forbidden, notFound } from '../../lib/errors/app-error';
import { Account } from '../accounts/account.entity';
import { BillingPeriod, JournalLine } from '../billing/billing.entities';
import { Invoice } from './invoice.entity';

const facilityWide = new Set(['finance', 'admin']);

export function toInvoiceDto(i: Invoice, account: Account | undefined, month: string | undefined) {
  return {
    id: i.id, number: i.number, periodId: i.periodId, month: month ?? null, accountId: i.accountId, accountName: account?.name ?? null, organisationId: i.organisationId,
    kind: i.kind, status: i.status, currency: i.currency.trim(), totalMinor: i.totalMinor, totalFormatted: formatMoney(i.totalMinor, i.currency.trim()),
    amountPaidMinor: i.amountPaidMinor, paidAt: i.paidAt?.toISOString() ?? null, dueDate: i.dueDate, stripeInvoiceNumber: i.stripeInvoiceNumber,
    hostedInvoiceUrl: i.hostedInvoiceUrl, lines: i.lines, pdfUrl: `/api/invoices/${i.id}.pdf`, poNumber: i.poNumber, issuedAt: i.createdAt.toISOString(),
  };
}

export function invoicesService(ctx: AppContext) {
  const db = ctx.db;

  async function visible(viewer: SessionUser): Promise<Invoice[]> {
    const where = facilityWide.has(viewer.role) ? {} : { organisationId: viewer.organisationId };
    return db.getRepository(Invoice).find({ where, order: { createdAt: 'DESC', number: 'DESC' }, take: 1000 });
  }

  async function decorate(rows: Invoice[]) {
    const accounts = new Map((rows.length ? await db.getRepository(Account).findBy({ id: In([...new Set(rows.map((r) => r.accountId))]) }) : []).map((a) => [a.id, a]));
    const periods = new Map((rows.length ? await db.getRepository(BillingPeriod).findBy({ id: In([...new Set(rows.map((r) => r.periodId))]) }) : []).map((p) => [p.id, p.month]));
    return rows.map((r) => toInvoiceDto(r, accounts.get(r.accountId), periods.get(r.periodId)));
  }

  async function list(viewer: SessionUser) {
    return decorate(await visible(viewer));
  }

  async function one(viewer: SessionUser, id: string) {
    const row = await db.getRepository(Invoice).findOneBy({ id });
    if (!row) throw notFound('Invoice');
    if (!facilityWide.has(viewer.role) && row.organisationId !== viewer.organisationId) throw forbidden('This invoice belongs to another organisation');
    return (await decorate([row]))[0]!;
  }

  async function invoicesCsv(viewer: SessionUser): Promise<string> {
    const rows = await list(viewer);
    return toCsv([
      ['number', 'month', 'account', 'kind', 'status', 'currency', 'total', 'amount_paid', 'due_date', 'stripe_invoice_number', 'hosted_invoice_url'],
      ...rows.map((r) => [r.number, r.month, r.accountName, r.kind, r.status, r.currency, minorToDecimalString(r.totalMinor, r.currency), minorToDecimalString(r.amountPaidMinor, r.currency), r.dueDate ?? '', r.stripeInvoiceNumber ?? '', r.hostedInvoiceUrl ?? '']),
    ]);
  }

  async function journalsCsv(): Promise<string> {
    const rows = await db.getRepository(JournalLine).find({ order: { createdAt: 'ASC', lineKey: 'ASC' }, take: 20_000 });
    const periods = new Map((rows.length ? await db.getRepository(BillingPeriod).findBy({ id: In([...new Set(rows.map((r) => r.periodId))]) }) : []).map((p) => [p.id, p.month]));
    const invoices = new Map((rows.length ? await db.getRepository(Invoice).findBy({ id: In([...new Set(rows.map((r) => r.invoiceId))]) }) : []).map((i) => [i.id, i.number]));
    return toCsv([
      ['period', 'journal_number', 'cost_centre', 'currency', 'amount', 'amount_minor', 'description'],
      ...rows.map((r) => [periods.get(r.periodId) ?? '', invoices.get(r.invoiceId) ?? '', r.costCentreCode, r.currency.trim(), minorToDecimalString(r.amountMinor, r.currency.trim()), r.amountMinor, r.description]),
    ]);
  }

  return { list, one, invoicesCsv, journalsCsv };
}
