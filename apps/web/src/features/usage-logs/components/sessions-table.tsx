import { type ColumnDef, type SortingState, flexRender, getCoreRowModel, getSortedRowModel, useReactTable } from '@tanstack/react-table';
import { Fragment, useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { ConfigurationChip } from '../../../components/ui/configuration-chip';
import { TableShell } from '../../../components/ui/table-shell';
import { sessionLogPath } from '../../../config/paths';
import { cx } from '../../../lib/cx';
import { formatInstant, formatMinutes, minutesBetween } from '../../../lib/wall-time';
import type { SessionRow } from '../api/get-sessions';
import { logStatusLabels, logStatusOf } from '../lib/log-status';
import { rangeText } from '../lib/range-units';
import { ConfirmPanel } from './confirm-panel';
import { type ConfigurationLookup, LogSummary } from './log-summary';
import { OutsideGraceBadge, UsageStatusBadge } from './usage-status';

export interface SessionsTableProps {
  sessions: SessionRow[];
  timeZone: string;
  configurationFor: ConfigurationLookup;
  /** 'to_confirm' lets staff review and confirm in place */
  scope: 'mine' | 'to_confirm';
  showWho: boolean;
}

const actionLabel = { needs_log: 'Log this session', submitted: 'Edit log', confirmed: 'Edit log', billed: 'View log' } as const;
const linkButton = 'inline-flex items-center whitespace-nowrap rounded-lg px-2.5 py-1 text-sm font-semibold';

function buildColumns({ timeZone, configurationFor, scope, showWho }: SessionsTableProps, expanded: string | null, toggle: (id: string) => void): ColumnDef<SessionRow>[] {
  const columns: ColumnDef<SessionRow>[] = [
    {
      id: 'when',
      header: 'Booked',
      accessorFn: (row) => row.booking.startsAt,
      cell: ({ row: { original } }) => (
        <span>
          <time dateTime={original.booking.startsAt}>{formatInstant(original.booking.startsAt, timeZone)}</time>
          <span className="block text-xs text-ink-muted">{formatMinutes(minutesBetween(original.booking.startsAt, original.booking.endsAt))}</span>
        </span>
      ),
    },
    {
      id: 'configuration',
      header: 'Configuration',
      accessorFn: (row) => configurationFor(row.booking.configurationId)?.name ?? row.booking.configurationKey,
      cell: ({ row: { original }, getValue }) => <ConfigurationChip name={getValue<string>()} outputKind={original.booking.outputKind} />,
    },
    {
      id: 'target',
      header: 'Target',
      enableSorting: false,
      accessorFn: (row) => (row.booking.detail ? rangeText({ minNm: row.booking.detail.targetMinNm, maxNm: row.booking.detail.targetMaxNm }) : '—'),
    },
  ];
  if (showWho) {
    columns.push({
      id: 'who',
      header: 'Booked by',
      accessorFn: (row) => (row.booking.detail ? `${row.booking.detail.userName} · ${row.booking.detail.organisationName}` : '—'),
    });
  }
  columns.push(
    {
      id: 'status',
      header: 'Session log',
      accessorFn: (row) => logStatusLabels[logStatusOf(row.log)],
      cell: ({ row: { original } }) => (
        <span className="flex flex-wrap items-center gap-1.5">
          <UsageStatusBadge status={logStatusOf(original.log)} />
          <OutsideGraceBadge log={original.log} />
        </span>
      ),
    },
    {
      id: 'action',
      header: () => <span className="sr-only">Action</span>,
      enableSorting: false,
      cell: ({ row: { original } }) =>
        scope === 'to_confirm' && original.log ? (
          <Button size="sm" variant="secondary" data-testid="log-session" aria-expanded={expanded === original.booking.id} onClick={() => toggle(original.booking.id)}>
            {expanded === original.booking.id ? 'Close' : 'Review'}
          </Button>
        ) : (
          <Link
            to={sessionLogPath(original.booking.id)}
            data-testid="log-session"
            className={cx(linkButton, original.log ? 'text-accent hover:bg-sunk' : 'bg-accent text-accent-ink hover:bg-accent-hover')}
          >
            {actionLabel[logStatusOf(original.log)]}
          </Link>
        ),
    },
  );
  return columns;
}

export function SessionsTable(props: SessionsTableProps) {
  const { sessions, timeZone, configurationFor, scope } = props;
  const [sorting, setSorting] = useState<SortingState>([{ id: 'when', desc: true }]);
  const [expanded, setExpanded] = useState<string | null>(null);
  const toggle = (id: string) => setExpanded((current) => (current === id ? null : id));
  const columns = useMemo(() => buildColumns(props, expanded, toggle), [props, expanded]);
  const table = useReactTable({
    data: sessions,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getRowId: (row) => row.booking.id,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
  const rows = table.getRowModel().rows;

  return (
    <TableShell
      caption={scope === 'to_confirm' ? 'Session logs waiting for staff confirmation' : 'Sessions of the last 60 days and their logs'}
      testId="sessions-table"
      isEmpty={rows.length === 0}
      empty={scope === 'to_confirm' ? 'No logs are waiting for confirmation.' : 'No sessions in the last 60 days. Sessions appear here once an approved booking has started.'}
    >
      <thead className="bg-sunk text-xs tracking-wide text-ink-muted uppercase">
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((header) => {
              const sorted = header.column.getIsSorted();
              const label = flexRender(header.column.columnDef.header, header.getContext());
              return (
                <th key={header.id} scope="col" aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined} className="px-4 py-2.5 font-semibold">
                  {header.column.getCanSort() ? (
                    <button type="button" onClick={header.column.getToggleSortingHandler()} className="inline-flex items-center gap-1 uppercase hover:text-ink">
                      {label}
                      <span aria-hidden="true" className={cx('text-[0.6rem]', !sorted && 'opacity-30')}>
                        {sorted === 'desc' ? '▼' : '▲'}
                      </span>
                    </button>
                  ) : (
                    label
                  )}
                </th>
              );
            })}
          </tr>
        ))}
      </thead>
      <tbody>
        {rows.map((row) => {
          const { booking, log } = row.original;
          return (
            <Fragment key={row.id}>
              <tr data-testid="session-row" data-booking-id={booking.id} data-log-status={logStatusOf(log)} className="border-t border-line align-middle">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-4 py-2.5">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
              {scope === 'to_confirm' && log && expanded === booking.id && (
                <tr className="bg-sunk/40" data-testid="session-review">
                  <td colSpan={row.getVisibleCells().length} className="space-y-4 px-4 py-4">
                    <LogSummary log={log} timeZone={timeZone} configurationFor={configurationFor} />
                    {log.status === 'submitted' && <ConfirmPanel log={log} booking={booking} timeZone={timeZone} />}
                    <Link to={sessionLogPath(booking.id)} className="text-sm font-semibold text-accent underline">
                      Open the full log
                    </Link>
                  </td>
                </tr>
              )}
            </Fragment>
          );
        })}
      </tbody>
    </TableShell>
  );
}
