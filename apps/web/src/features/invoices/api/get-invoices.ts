import type { PriceLine } from '@femtoslot/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { invoiceKeys } from '../../../lib/query-keys';

export type InvoiceStatus = 'draft' | 'open' | 'paid' | 'void' | 'journal';

/** As apps/api/src/modules/invoices/invoices.service.ts toInvoiceDto answers it. */
export interface Invoice {
  id: string;
  number: string;
  periodId: string;
  month: string | null;
  accountId: string;
  accountName: string | null;
  organisationId: string;
  kind: 'external' | 'internal';
  status: InvoiceStatus;
  currency: string;
  totalMinor: number;
  amountPaidMinor: number;
  paidAt: string | null;
  dueDate: string | null;
  stripeInvoiceNumber: string | null;
  hostedInvoiceUrl: string | null;
  lines: PriceLine[];
  pdfUrl: string;
}

/** Finance and admin: every invoice; collaborators and PIs: their organisation's. */
export const getInvoices = (signal?: AbortSignal) =>
  apiClient.get<{ invoices: Invoice[] }>('/api/invoices', signal).then((body) => body.invoices);

// Read again whenever the window regains focus, so an invoice paid on the hosted page shows paid on return.
export const invoicesQueryOptions = () =>
  queryOptions({ queryKey: invoiceKeys.list(), queryFn: ({ signal }) => getInvoices(signal), staleTime: 0, refetchOnWindowFocus: true });

export function useInvoices(enabled = true) {
  return useQuery({ ...invoicesQueryOptions(), enabled });
}
