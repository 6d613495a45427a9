import type { RenderedMail } from '../../lib/mail/templates';
import { layout } from '../../lib/mail/templates';

export function invoiceNoticeMail(p: { accountName: string; facility: string; number: string; month: string; total: string; dueDate: string | null; url: string | null }): RenderedMail {
  const lines = [
    `Hello ${p.accountName},`,
    `Invoice ${p.number} for beam time at ${p.facility} in ${p.month} is ready: ${p.total}${p.dueDate ? `, due on ${p.dueDate}` : ''}.`,
    p.url ? 'You can see every line and pay it on the invoice page.' : 'Nothing is due on it.',
  ];
  return {
    template: 'invoice-notice',
    subject: `Invoice ${p.number} — ${p.facility}`,
    text: [...lines, ...(p.url ? [p.url] : [])].join('\n\n'),
    html: layout(`Invoice ${p.number}`, lines, p.url ? { label: 'View and pay the invoice', url: p.url } : undefined),
  };
}
