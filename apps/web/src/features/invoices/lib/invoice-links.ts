import type { Invoice } from '../api/get-invoices';

/** The hosted payment page, only for an open external invoice and only over http(s). */
export function payOnlineUrl(invoice: Pick<Invoice, 'kind' | 'status' | 'hostedInvoiceUrl'>): string | null {
  if (invoice.kind !== 'external' || invoice.status !== 'open' || !invoice.hostedInvoiceUrl) return null;
  try {
    const url = new URL(invoice.hostedInvoiceUrl);
    return url.protocol === 'https:' || url.protocol === 'http:' ? url.href : null;
  } catch {
    return null;
  }
}

export const invoicePdfUrl = (invoice: Pick<Invoice, 'id' | 'pdfUrl'>) =>
  invoice.pdfUrl?.startsWith('/api/') ? invoice.pdfUrl : `/api/invoices/${encodeURIComponent(invoice.id)}.pdf`;

export const exportPaths = { invoicesCsv: '/api/invoices/export.csv', journalCsv: '/api/journals/export.csv' } as const;
