import type { Doc } from './document';
import { writeText } from './unicode-text';

/**
 * The layout Femtoslot's money documents (invoice, journal, quote) share on an A4 page with 50 pt margins:
 * a heading, then priced lines with the amount right-aligned in its own column, then a ruled total.
 */
const LEFT = 50;
const TEXT_WIDTH = 380;
const AMOUNT_X = 440;
const AMOUNT_WIDTH = 105;
const RIGHT = AMOUNT_X + AMOUNT_WIDTH;

/** Facility name, a grey subtitle, then the document's title in bold; leaves the font at 12 pt. */
export function writeHeading(doc: Doc, facilityName: string, subtitle: string, title: string): void {
  doc.fontSize(16);
  writeText(doc, facilityName, 'bold');
  doc.moveDown(0.3).fontSize(10).fillColor('#555');
  writeText(doc, subtitle, 'regular');
  doc.moveDown().fillColor('#000').fontSize(12);
  writeText(doc, title, 'bold');
}

/** Each line: bold label with its amount beside it, then its explanation in grey. */
export function writePricedLines(
  doc: Doc,
  lines: readonly { label: string; explanation: string; amountMinor: number }[],
  money: (minor: number) => string,
): void {
  for (const line of lines) {
    const y = doc.y;
    writeText(doc, money(line.amountMinor), 'regular', { x: AMOUNT_X, y, width: AMOUNT_WIDTH, align: 'right' });
    writeText(doc, line.label, 'bold', { x: LEFT, y, width: TEXT_WIDTH });
    doc.fillColor('#444');
    writeText(doc, line.explanation, 'regular', { x: LEFT, y: doc.y, width: TEXT_WIDTH });
    doc.fillColor('#000').moveDown(0.6);
  }
}

/** A rule across the page, then the label and amount in bold on one line. */
export function writeTotal(doc: Doc, label: string, amount: string): void {
  doc.moveTo(LEFT, doc.y).lineTo(RIGHT, doc.y).stroke();
  doc.moveDown(0.5);
  const y = doc.y;
  writeText(doc, label, 'bold', { x: LEFT, y, width: TEXT_WIDTH });
  writeText(doc, amount, 'bold', { x: AMOUNT_X, y, width: AMOUNT_WIDTH, align: 'right' });
}
