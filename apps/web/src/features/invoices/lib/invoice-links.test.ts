import { describe, expect, test } from 'vitest';
import { invoicePdfUrl, payOnlineUrl } from './invoice-links';

const open = { kind: 'external' as const, status: 'open' as const, hostedInvoiceUrl: 'https://pay.example.test/i/abc' };

describe('invoice links', () => {
  test('when an external invoice is open, then it can be paid online at its hosted page', () => {
    expect(payOnlineUrl(open)).toBe('https://pay.example.test/i/abc');
  });

  test('when the invoice is paid, void, a journal, or has no page, then there is no pay link', () => {
    expect(payOnlineUrl({ ...open, status: 'paid' })).toBeNull();
    expect(payOnlineUrl({ ...open, status: 'void' })).toBeNull();
    expect(payOnlineUrl({ ...open, kind: 'internal', status: 'journal' })).toBeNull();
    expect(payOnlineUrl({ ...open, hostedInvoiceUrl: null })).toBeNull();
  });

  test('when the hosted address is not http(s), then it is never offered as a link', () => {
    expect(payOnlineUrl({ ...open, hostedInvoiceUrl: 'javascript:alert(1)' })).toBeNull();
    expect(payOnlineUrl({ ...open, hostedInvoiceUrl: 'not a url' })).toBeNull();
  });

  test('when the PDF address is not an API path, then the invoice id builds it', () => {
    expect(invoicePdfUrl({ id: 'a1', pdfUrl: '/api/invoices/a1.pdf' })).toBe('/api/invoices/a1.pdf');
    expect(invoicePdfUrl({ id: 'a1', pdfUrl: 'https://elsewhere.test/x.pdf' })).toBe('/api/invoices/a1.pdf');
  });
});
