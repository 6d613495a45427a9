import PDFDocument from 'pdfkit';
import { registerUnicodeFonts } from './unicode-text';

export type Doc = InstanceType<typeof PDFDocument>;

/** An A4 document with Femtoslot's Unicode font chains registered, and a promise of its bytes once ended. */
export function newPdf(info: { Title: string; Author: string }): { doc: Doc; done: Promise<Buffer> } {
  const doc = new PDFDocument({ size: 'A4', margin: 50, info });
  registerUnicodeFonts(doc);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  return { doc, done };
}
