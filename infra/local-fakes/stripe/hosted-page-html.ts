import { formatMinorUnits } from './money';
import type { InvoiceItemRecord, InvoiceRecord } from './store';

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);
}

function isoDate(unixSeconds: number | null): string {
  return unixSeconds === null ? '—' : new Date(unixSeconds * 1000).toISOString().slice(0, 10);
}

export function page(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<link rel="icon" href="data:,">
<title>${escapeHtml(title)} · local test payment page</title>
<style>
  body { font: 16px/1.5 system-ui, sans-serif; margin: 0; background: #eef1f4; color: #1d2530; }
  main { max-width: 40rem; margin: 2rem auto; background: #fff; padding: 1.5rem 2rem; border-radius: 6px; border: 1px solid #cdd5de; }
  .banner { background: #fff4cc; border: 1px dashed #b38f00; padding: .5rem .75rem; font-size: .9rem; margin-bottom: 1rem; }
  table { width: 100%; border-collapse: collapse; margin: 1rem 0; }
  th, td { text-align: left; padding: .35rem .25rem; border-bottom: 1px solid #e3e8ee; }
  td.amount, th.amount { text-align: right; font-variant-numeric: tabular-nums; }
  tfoot td { font-weight: 700; border-bottom: none; }
  label { display: block; font-weight: 600; margin-top: 1rem; }
  input { font: inherit; padding: .4rem .5rem; width: 16rem; letter-spacing: .05em; }
  button { font: inherit; margin-top: 1rem; padding: .5rem 1.25rem; background: #24507a; color: #fff; border: 0; border-radius: 4px; }
  .state { font-size: 1.1rem; font-weight: 700; }
  .declined { color: #a11d1d; }
  .paid { color: #1d6b32; }
  .hint { font-size: .85rem; color: #5a6674; }
</style>
</head>
<body><main>
<p class="banner">Local test payment page of the Femtoslot Stripe fake. No real money moves and no card data leaves this machine.</p>
${body}
</main></body>
</html>`;
}

export function invoiceSummary(invoice: InvoiceRecord, items: InvoiceItemRecord[], customerName: string | null): string {
  const total = items.reduce((sum, item) => sum + item.amount, 0);
  const rows = items
    .map(
      (item) =>
        `<tr><td>${escapeHtml(item.description ?? 'Item')}</td><td class="amount">${item.quantity}</td>` +
        `<td class="amount">${formatMinorUnits(item.amount, item.currency)}</td></tr>`,
    )
    .join('\n');
  return `<h1>Invoice ${escapeHtml(invoice.number ?? invoice.id)}</h1>
<p>Billed to: ${escapeHtml(customerName ?? invoice.customer)}<br>Due date: <span id="due-date">${isoDate(invoice.due_date)}</span></p>
<table>
<thead><tr><th>Description</th><th class="amount">Qty</th><th class="amount">Amount</th></tr></thead>
<tbody>
${rows}
</tbody>
<tfoot><tr><td colspan="2">Total</td><td class="amount" id="total">${formatMinorUnits(total, invoice.currency)}</td></tr></tfoot>
</table>`;
}

export function paymentForm(invoice: InvoiceRecord, message?: string): string {
  return `${message ? `<p class="state declined" role="alert">${escapeHtml(message)}</p>` : ''}
<form method="post" action="/hosted/invoices/${encodeURIComponent(invoice.id)}/pay">
<label for="card_number">Test card number</label>
<input id="card_number" name="card_number" inputmode="numeric" autocomplete="off" required placeholder="4242 4242 4242 4242">
<p class="hint">4242 4242 4242 4242 pays. 4000 0000 0000 0002 is declined.</p>
<button type="submit">Pay invoice</button>
</form>`;
}

export function stateNotice(invoice: InvoiceRecord): string {
  switch (invoice.status) {
    case 'paid':
      return `<p class="state paid">This invoice has been paid${invoice.status_transitions.paid_at ? ` on ${isoDate(invoice.status_transitions.paid_at)}` : ''}.</p>`;
    case 'void':
      return '<p class="state">This invoice has been voided and can no longer be paid.</p>';
    case 'draft':
      return '<p class="state">This invoice is still a draft; it can be paid once it is finalized.</p>';
    default:
      return '';
  }
}
