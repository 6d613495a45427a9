import { localDate } from '@femtoslot/shared';
import { formatMoney } from '@femtoslot/shared/billing/money';
import { newPdf } from '../../lib/pdf/document';
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
  doc.fontSize(16);
  writeText(doc, facility.name, 'bold');
  doc.moveDown(0.3).fontSize(10).fillColor('#555');
  writeText(doc, 'Beam time statement — Femtoslot', 'regular');
  doc.moveDown().fillColor('#000').fontSize(12);
  writeText(doc, inv.kind === 'internal' ? `Journal ${inv.number}` : `Invoice ${inv.number}`, 'bold');
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
  for (const line of inv.lines) {
    const y = doc.y;
    writeText(doc, money(line.amountMinor), 'regular', { x: 440, y, width: 105, align: 'right' });
    writeText(doc, line.label, 'bold', { x: 50, y, width: 380 });
    doc.fillColor('#444');
    writeText(doc, line.explanation, 'regular', { x: 50, y: doc.y, width: 380 });
    doc.fillColor('#000').moveDown(0.6);
  }
  doc.moveTo(50, doc.y).lineTo(545, doc.y).stroke();
  doc.moveDown(0.5);
  const y = doc.y;
  writeText(doc, 'Total', 'bold', { x: 50, y, width: 380 });
  writeText(doc, money(inv.totalMinor), 'bold', { x: 440, y, width: 105, align: 'right' });
  if (inv.hostedInvoiceUrl) {
    doc.moveDown();
    writeText(doc, `Pay online: ${inv.hostedInvoiceUrl}`, 'regular', { x: 50 });
  }
  doc.end();
  return done;
}
