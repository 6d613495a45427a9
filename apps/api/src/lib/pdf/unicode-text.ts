import type PDFDocument from 'pdfkit';
import { fontChains, splitByCoverage, type Weight } from './unicode-fonts';

type Doc = InstanceType<typeof PDFDocument>;
export type TextOptions = PDFKit.Mixins.TextOptions & { x?: number; y?: number };

/** Makes every face of both chains known to the document (embedded only if used). */
export function registerUnicodeFonts(doc: Doc): void {
  const chains = fontChains();
  for (const face of [...chains.regular, ...chains.bold]) doc.registerFont(face.name, face.file);
}

/**
 * Writes text in runs of the first face that has each character, chained with pdfkit's `continued` so the runs
 * wrap and align as one paragraph.
 */
export function writeText(doc: Doc, text: string, weight: Weight, options: TextOptions = {}): Doc {
  const { x, y, ...rest } = options;
  const chain = fontChains()[weight];
  const runs = splitByCoverage(text, chain);
  if (!runs.length) runs.push({ face: chain[0]!, text: '' });
  runs.forEach((run, i) => {
    doc.font(run.face.name);
    const o = { ...rest, continued: i < runs.length - 1 };
    if (i === 0 && x !== undefined) doc.text(run.text, x, y, o);
    else doc.text(run.text, o);
  });
  return doc;
}
