import { localDate } from '@femtoslot/shared';
import { formatMoney } from '@femtoslot/shared/billing/money';
import { newPdf } from '../../lib/pdf/document';
import { writeHeading, writePricedLines, writeTotal } from '../../lib/pdf/statement-layout';
import { writeText } from '../../lib/pdf/unicode-text';
import type { toInvoiceDto } from './invoices.service';

type InvoiceDto = ReturnType<typeof toInvoiceDto>;

/**
 * The invoice (or journal) as a PDF. Every name is written through the Unicode font chain, so "Łódź", "ΔΦ Labs",
 * "Жуковский" or "東京" print as typed; amounts are formatted with the currency's ISO 4217 minor unit.
 */
export function renderInvoicePdf(inv: InvoiceDto, facility: { name: string; timeZone: string }): Promise<Buffer> {
  const { doc, done } = newPdf({ Title: `Invoice ${inv.number}`, Author: facility.name });
  const money = (minor: number) => formatMoney(minor, inv.currency);
  writeHeading(doc, facility.name, 'Beam time statement — Femtoslot', inv.kind === 'internal' ? `Journal ${inv.number}` : `Invoice ${inv.number}`);
  doc.fontSize(10);
  // The issue date is the facility's calendar date when the close wrote the invoice.
  writeText(doc, `Issued ${localDate(new Date(inv.issuedAt), facility.timeZone)}`, 'regular');
  writeText(doc, `Account: ${inv.accountName ?? inv.accountId}`, 'regular');
  if (inv.poNumber) writeText(doc, `Purchase order: ${inv.poNumber}`, 'regular');
  writeText(doc, `Billing period: ${inv.month ?? ''}`, 'regular');
  if (inv.stripeInvoiceNumber) writeText(doc, `Stripe invoice: ${inv.stripeInvoiceNumber}`, 'regular');
  writeText(doc, `Status: ${inv.status}`, 'regular');
  if (inv.dueDate) writeText(doc, `Due date: ${inv.dueDate}`, 'regular');
  doc.moveDown();
  writePricedLines(doc, inv.lines, money);
  writeTotal(doc, 'Total', money(inv.totalMinor));
  if (inv.hostedInvoiceUrl) {
    doc.moveDown();
    writeText(doc, `Pay online: ${inv.hostedInvoiceUrl}`, 'regular', { x: 50 });
  }
  doc.end();
  return done;
}
