import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { formatMoney } from '@femtoslot/shared/billing/money';
import PDFDocument from 'pdfkit';
import type { toInvoiceDto } from './invoices.service';

type InvoiceDto = ReturnType<typeof toInvoiceDto>;

/** Manrope from @fontsource (WOFF, which pdfkit's fontkit reads); Helvetica if the package is missing. */
function manropeFiles(): { regular: string; bold: string } | null {
  try {
    const dir = path.join(path.dirname(createRequire(import.meta.url).resolve('@fontsource/manrope/package.json')), 'files');
    const regular = path.join(dir, 'manrope-latin-400-normal.woff');
    const bold = path.join(dir, 'manrope-latin-700-normal.woff');
    return existsSync(regular) && existsSync(bold) ? { regular, bold } : null;
  } catch {
    return null;
  }
}

export function renderInvoicePdf(inv: InvoiceDto, facilityName: string): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 50, info: { Title: `Invoice ${inv.number}`, Author: facilityName } });
  const fonts = manropeFiles();
  const regular = fonts ? 'Manrope' : 'Helvetica';
  const bold = fonts ? 'Manrope-Bold' : 'Helvetica-Bold';
  if (fonts) {
    doc.registerFont('Manrope', fonts.regular);
    doc.registerFont('Manrope-Bold', fonts.bold);
  }
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const money = (minor: number) => formatMoney(minor, inv.currency);
  doc.font(bold).fontSize(16).text(facilityName);
  doc.moveDown(0.3).font(regular).fontSize(10).fillColor('#555').text('Beam time statement — Femtoslot');
  doc.moveDown().fillColor('#000').font(bold).fontSize(12).text(inv.kind === 'internal' ? `Journal ${inv.number}` : `Invoice ${inv.number}`);
  doc.font(regular).fontSize(10);
  doc.text(`Account: ${inv.accountName ?? inv.accountId}`);
  doc.text(`Billing period: ${inv.month ?? ''}`);
  if (inv.stripeInvoiceNumber) doc.text(`Stripe invoice: ${inv.stripeInvoiceNumber}`);
  doc.text(`Status: ${inv.status}`);
  if (inv.dueDate) doc.text(`Due date: ${inv.dueDate}`);
  doc.moveDown();
  for (const line of inv.lines) {
    const y = doc.y;
    doc.font(bold).text(line.label, 50, y, { width: 380 });
    doc.font(regular).text(money(line.amountMinor), 440, y, { width: 105, align: 'right' });
    doc.font(regular).fillColor('#444').text(line.explanation, 50, doc.y, { width: 380 });
    doc.fillColor('#000').moveDown(0.6);
  }
  doc.moveTo(50, doc.y).lineTo(545, doc.y).stroke();
  doc.moveDown(0.5);
  const y = doc.y;
  doc.font(bold).text('Total', 50, y, { width: 380 });
  doc.text(money(inv.totalMinor), 440, y, { width: 105, align: 'right' });
  if (inv.hostedInvoiceUrl) doc.moveDown().font(regular).text(`Pay online: ${inv.hostedInvoiceUrl}`, 50);
  doc.end();
  return done;
}
