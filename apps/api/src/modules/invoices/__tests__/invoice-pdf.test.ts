import { PDFParse } from 'pdf-parse';
import { describe, expect, it } from 'vitest';
import { renderInvoicePdf } from '../invoice-pdf';
import type { toInvoiceDto } from '../invoices.service';

type InvoiceDto = ReturnType<typeof toInvoiceDto>;
const uuid = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`;

/** An invoice whose printed names need Latin Extended-A, Greek, Cyrillic and CJK glyphs (invented names). */
function invoice(): InvoiceDto {
  const line = (n: number, label: string, explanation: string, amountMinor: number) => ({
    key: `usage-${uuid(n)}`, kind: 'usage' as const, bookingId: uuid(100 + n), usageLogId: uuid(200 + n), label, explanation,
    minutes: 120, rateMinorPerHour: 11_000, amountMinor, category: 'external_academic' as const, rateClass: 'standard' as const,
  });
  return {
    id: uuid(1), number: 'FS-INV-202611-00042', periodId: uuid(2), month: '2026-11', accountId: uuid(3), accountName: 'ΔΦ Labs, Łódź',
    organisationId: uuid(4), kind: 'external', status: 'open', currency: 'USD', totalMinor: 44_000, totalFormatted: '$440.00', amountPaidMinor: 0,
    paidAt: null, dueDate: '2026-12-31', stripeInvoiceNumber: null, hostedInvoiceUrl: null, pdfUrl: `/api/invoices/${uuid(1)}.pdf`,
    poNumber: 'PO-Kőszeg-7781', issuedAt: '2026-12-01T15:30:00.000Z',
    lines: [line(1, 'Beam time 2026-11-03 09:00–11:00, Жуковский bench', 'Booked by 東京 group', 22_000), line(2, 'Beam time 2026-11-04 09:00–11:00, OPA signal', 'Kőszeg run', 22_000)],
  } as InvoiceDto;
}

async function textOf(pdf: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  const text = (await parser.getText()).text.replace(/\s+/g, ' ');
  await parser.destroy();
  return text;
}

describe('invoice PDF', () => {
  it('when names use Polish, Hungarian, Greek, Cyrillic and Japanese letters, then they read back intact, with the PO number and the issue date', async () => {
    const text = await textOf(await renderInvoicePdf(invoice(), { name: 'Harrow Point — Łódź annex', timeZone: 'America/New_York' }));
    for (const name of ['Łódź', 'Kőszeg', 'ΔΦ Labs', 'Жуковский', '東京']) expect(text, name).toContain(name);
    expect(text).toContain('PO-Kőszeg-7781');
    // 15:30Z on 1 December 2026 is 10:30 EST: the issue date in the facility's zone is 2026-12-01.
    expect(text).toContain('Issued 2026-12-01');
    expect(text).toContain('Total $440.00');
  });
});
