import type { BookingEstimateDto } from '@femtoslot/shared/billing/estimate.types';
import { formatMoney } from '@femtoslot/shared/billing/money';
import { newPdf, type Doc } from '../../lib/pdf/document';
import { writeHeading, writePricedLines, writeTotal } from '../../lib/pdf/statement-layout';
import { writeText } from '../../lib/pdf/unicode-text';

const windowWords = (w: BookingEstimateDto['cancellation']['windows'][number], tz: string) =>
  w.fromLocal ? `from ${w.fromLocal} to ${w.untilLocal} (${tz})` : `until ${w.untilLocal} (${tz})`;

function row(doc: Doc, label: string, value: string) {
  const y = doc.y;
  doc.fillColor('#555');
  writeText(doc, label, 'regular', { x: 50, y, width: 130 });
  doc.fillColor('#000');
  writeText(doc, value, 'regular', { x: 180, y, width: 365 });
  doc.moveDown(0.2);
}

/**
 * A printable quote for a booking request, for an external user's purchase-order request: the same lines and font
 * chain as the invoice, amounts in the currency's ISO 4217 minor unit.
 */
export function renderQuotePdf(q: BookingEstimateDto): Promise<Buffer> {
  const { doc, done } = newPdf({ Title: `Quote ${q.quoteNumber}`, Author: q.facilityName });
  const money = (minor: number) => formatMoney(minor, q.currency);
  writeHeading(doc, q.facilityName, 'Quote for beam time — Femtoslot', `Quote ${q.quoteNumber}`);
  doc.fontSize(10).moveDown(0.3);
  row(doc, 'Quote date', q.issuedOn);
  row(doc, 'Valid until', q.validUntil);
  row(doc, 'Account', `${q.account.name} — ${q.account.organisationName} (${q.account.category})`);
  if (q.account.poNumber) row(doc, 'Current PO', q.account.poNumber);
  row(doc, 'Instrument', q.instrument.name);
  row(doc, 'Configuration', `${q.configuration.name} (${q.configuration.rateClass === 'dfg' ? 'DFG' : 'standard'} rate class)`);
  row(doc, 'Wavelength', q.wavelength);
  row(doc, 'Beam time', `${q.startsAtLocal} to ${q.endsAtLocal} (${q.timeZone})`);
  row(doc, 'Rate card', `${q.rateCard.name}, in force from ${q.rateCard.effectiveFrom}`);
  doc.moveDown();
  writePricedLines(doc, q.lines, money);
  writeTotal(doc, 'Estimated total', money(q.totalMinor));
  doc.moveDown(1.2);
  writeText(doc, 'Cancellation terms', 'bold', { x: 50 });
  for (const w of q.cancellation.windows) {
    writeText(doc, `Cancelled ${windowWords(w, q.timeZone)}: ${w.percent} % — ${money(w.amountMinor)}`, 'regular', { x: 50, width: 495 });
  }
  doc.moveDown(0.3).fillColor('#444');
  writeText(doc, `${q.cancellation.description}`, 'regular', { x: 50, width: 495 });
  doc.moveDown(0.6);
  writeText(doc,
    `This is an estimate for the times booked. The invoice bills the session log confirmed by staff, rounded up to the ${q.rateCard.billingIncrementMinutes}-min increment` +
    `${q.rateCard.minimumChargeMinutes ? ` with a minimum charge of ${q.rateCard.minimumChargeMinutes} min` : ''}, at the rate card in force on the session's date.` +
    ' Beam time is subject to staff approval, valid laser-safety training and eyewear rated for every wavelength on the table, as the facility\'s laser-safety officer sets.',
    'regular', { x: 50, width: 495 });
  doc.end();
  return done;
}
