import { type ColumnDef, type SortingState, flexRender, getCoreRowModel, getSortedRowModel, useReactTable } from '@tanstack/react-table';
import { type ReactNode, useMemo, useState } from 'react';
import { type PillTone, StatusPill } from '../../../components/ui/status-pill';
import { TableShell } from '../../../components/ui/table-shell';
import { cx } from '../../../lib/cx';
import { formatMinor } from '../../../lib/money';
import { monthLabel } from '../../../lib/months';
import type { Invoice, InvoiceStatus } from '../api/get-invoices';
import { invoicePdfUrl, payOnlineUrl } from '../lib/invoice-links';

const statusLabels: Record<InvoiceStatus, string> = { draft: 'Draft', open: 'Open', paid: 'Paid', void: 'Void', journal: 'Journal' };
const statusTones: Record<InvoiceStatus, PillTone> = { draft: 'neutral', open: 'caution', paid: 'success', void: 'neutral', journal: 'accent' };

/** data-testids: the page's main table, or the copy inside a closed period (kept distinct so each id is unique). */
const testIdSets = {
  main: { table: 'invoices-table', row: 'invoice-row', pay: 'pay-invoice', pdf: 'invoice-pdf' },
  period: { table: 'period-invoices', row: 'period-invoice', pay: 'period-pay-invoice', pdf: 'period-invoice-pdf' },
} as const;

export interface InvoicesTableProps {
  invoices: Invoice[];
  variant?: keyof typeof testIdSets;
  toolbar?: ReactNode;
  empty?: string;
}

const link = 'inline-flex items-center whitespace-nowrap rounded-lg px-2.5 py-1 text-sm font-semibold';

function columns(ids: (typeof testIdSets)[keyof typeof testIdSets]): ColumnDef<Invoice>[] {
  return [
    {
      id: 'number',
      header: 'Number',
      accessorFn: (i) => i.number,
      cell: ({ row: { original } }) => (
        <span>
          <span className="font-mono text-xs font-semibold">{original.number}</span>
          {original.stripeInvoiceNumber && <span className="block text-xs text-ink-muted">Stripe {original.stripeInvoiceNumber}</span>}
        </span>
      ),
    },
    { id: 'period', header: 'Period', accessorFn: (i) => i.month ?? '', cell: ({ getValue }) => (getValue<string>() ? monthLabel(getValue<string>()) : '—') },
    {
      id: 'account',
      header: 'Account',
      accessorFn: (i) => i.accountName ?? '',
      cell: ({ row: { original } }) => (
        <span>
          {original.accountName ?? '—'}
          <span className="block text-xs text-ink-muted">{original.kind === 'internal' ? 'Internal · cost-centre journal' : 'External · invoice'}</span>
        </span>
      ),
    },
    {
      id: 'status',
      header: 'Status',
      accessorFn: (i) => i.status,
      cell: ({ row: { original } }) => <StatusPill tone={statusTones[original.status]}>{statusLabels[original.status] ?? original.status}</StatusPill>,
    },
    {
      id: 'total',
      header: () => <span className="block text-right">Total</span>,
      accessorFn: (i) => i.totalMinor,
      cell: ({ row: { original } }) => (
        <span className="block text-right font-semibold tabular-nums" data-amount-minor={original.totalMinor}>
          {formatMinor(original.totalMinor, original.currency)}
        </span>
      ),
    },
    { id: 'due', header: 'Due', accessorFn: (i) => i.dueDate ?? '', cell: ({ row: { original } }) => (original.kind === 'internal' ? '—' : original.dueDate ?? '—') },
    {
      id: 'actions',
      header: () => <span className="sr-only">Links</span>,
      enableSorting: false,
      cell: ({ row: { original } }) => {
        const pay = payOnlineUrl(original);
        return (
          <span className="flex justify-end gap-1">
            {pay && (
              <a href={pay} target="_blank" rel="noopener noreferrer" data-testid={ids.pay} className={cx(link, 'bg-accent text-accent-ink hover:bg-accent-hover')}>
                Pay online
              </a>
            )}
            <a href={invoicePdfUrl(original)} data-testid={ids.pdf} className={cx(link, 'border border-line text-ink hover:bg-sunk')} download>
              PDF
            </a>
          </span>
        );
      },
    },
  ];
}

export function InvoicesTable({ invoices, variant = 'main', toolbar, empty = 'No invoices yet.' }: InvoicesTableProps) {
  const ids = testIdSets[variant];
  const cols = useMemo(() => columns(ids), [ids]);
  const [sorting, setSorting] = useState<SortingState>([]);
  const table = useReactTable({
    data: invoices,
    columns: cols,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getRowId: (i) => i.id,
  });
  return (
    <TableShell caption="Invoices and journals" testId={ids.table} toolbar={toolbar} isEmpty={invoices.length === 0} empty={empty}>
      <thead className="border-b border-line bg-sunk/60 text-xs text-ink-muted">
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((header) => (
              <th key={header.id} scope="col" className="px-4 py-2 font-semibold" aria-sort={header.column.getIsSorted() === 'asc' ? 'ascending' : header.column.getIsSorted() === 'desc' ? 'descending' : undefined}>
                {header.column.getCanSort() ? (
                  <button type="button" onClick={header.column.getToggleSortingHandler()} className="hover:text-ink">
                    {flexRender(header.column.columnDef.header, header.getContext())}
                    {{ asc: ' ↑', desc: ' ↓' }[header.column.getIsSorted() as string] ?? ''}
                  </button>
                ) : (
                  flexRender(header.column.columnDef.header, header.getContext())
                )}
              </th>
            ))}
          </tr>
        ))}
      </thead>
      <tbody>
        {table.getRowModel().rows.map((row) => (
          <tr key={row.id} data-testid={ids.row} data-invoice-id={row.original.id} data-status={row.original.status} className="border-t border-line align-top">
            {row.getVisibleCells().map((cell) => (
              <td key={cell.id} className="px-4 py-2.5">
                {flexRender(cell.column.columnDef.cell, cell.getContext())}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </TableShell>
  );
}
