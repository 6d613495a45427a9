import type { User } from '@femtoslot/shared';
import {
  type ColumnDef,
  type SortingState,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
} from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { TableShell } from '../../../components/ui/table-shell';
import { roleLabels } from '../../../config/roles';
import { cx } from '../../../lib/cx';
import { ActiveToggle, OfficerToggle, RoleSelect } from './user-row-actions';
import { UserStatusBadge, userStatus, userStatusLabels } from './user-status';

export interface UsersTableProps {
  users: User[];
  /** the signed-in admin: their own role and access are not editable here, to avoid a lock-out */
  currentUserId: string;
  timeZone?: string;
}

function buildColumns(currentUserId: string, timeZone?: string): ColumnDef<User>[] {
  const dateFormat = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeZone });
  return [
    { id: 'name', header: 'Name', accessorKey: 'name' },
    { id: 'email', header: 'E-mail', accessorKey: 'email' },
    {
      id: 'role',
      header: 'Role',
      accessorFn: (user) => roleLabels[user.role],
      cell: ({ row }) => <RoleSelect user={row.original} disabled={row.original.id === currentUserId} />,
    },
    { id: 'organisation', header: 'Organisation', accessorFn: (user) => user.organisation.name },
    {
      id: 'laserSafetyOfficer',
      header: 'Laser-safety officer',
      enableGlobalFilter: false,
      accessorFn: (user) => (user.laserSafetyOfficer ? 1 : 0),
      cell: ({ row }) => <OfficerToggle user={row.original} />,
    },
    {
      id: 'status',
      header: 'Status',
      accessorFn: (user) => userStatusLabels[userStatus(user)],
      cell: ({ row }) => <UserStatusBadge status={userStatus(row.original)} />,
    },
    {
      id: 'createdAt',
      header: 'Created',
      accessorKey: 'createdAt',
      enableGlobalFilter: false,
      cell: ({ getValue }) => {
        const value = new Date(getValue<string>());
        return Number.isNaN(value.getTime()) ? '—' : <time dateTime={value.toISOString()}>{dateFormat.format(value)}</time>;
      },
    },
    {
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      enableSorting: false,
      enableGlobalFilter: false,
      cell: ({ row }) =>
        row.original.id === currentUserId ? (
          <span className="text-xs text-ink-muted">You</span>
        ) : (
          <ActiveToggle user={row.original} />
        ),
    },
  ];
}

const sortMarks = { asc: '▲', desc: '▼' } as const;

export function UsersTable({ users, currentUserId, timeZone }: UsersTableProps) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'name', desc: false }]);
  const [filter, setFilter] = useState('');
  const columns = useMemo(() => buildColumns(currentUserId, timeZone), [currentUserId, timeZone]);

  const table = useReactTable({
    data: users,
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setFilter,
    getRowId: (user) => user.id,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });

  const rows = table.getRowModel().rows;

  return (
    <TableShell
      caption="People with access to Femtoslot"
      testId="users-table"
      isEmpty={rows.length === 0}
      empty={filter ? `Nobody matches “${filter}”.` : 'Nobody has been invited yet.'}
      toolbar={
        <>
          <label className="flex flex-col gap-1 text-sm font-semibold">
            Filter
            <input
              type="search"
              value={filter}
              onChange={(event) => setFilter(event.target.value)}
              placeholder="Name, e-mail, role, organisation…"
              data-testid="people-filter"
              className="w-72 max-w-full rounded-lg border border-line bg-panel px-3 py-1.5 font-normal"
            />
          </label>
          <p className="ml-auto text-sm text-ink-muted" aria-live="polite">
            {rows.length} of {users.length} {users.length === 1 ? 'person' : 'people'}
          </p>
        </>
      }
    >
      <thead className="bg-sunk text-xs tracking-wide text-ink-muted uppercase">
        {table.getHeaderGroups().map((group) => (
          <tr key={group.id}>
            {group.headers.map((header) => {
              const sorted = header.column.getIsSorted();
              const label = flexRender(header.column.columnDef.header, header.getContext());
              return (
                <th
                  key={header.id}
                  scope="col"
                  aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                  className="px-4 py-2.5 font-semibold"
                >
                  {header.column.getCanSort() ? (
                    <button
                      type="button"
                      onClick={header.column.getToggleSortingHandler()}
                      data-testid={`sort-${header.column.id}`}
                      className="inline-flex items-center gap-1 rounded uppercase hover:text-ink"
                    >
                      {label}
                      <span aria-hidden="true" className={cx('text-[0.6rem]', !sorted && 'opacity-30')}>
                        {sorted ? sortMarks[sorted] : '▲'}
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
        {rows.map((row) => (
          <tr
            key={row.id}
            data-testid="user-row"
            data-email={row.original.email}
            className="border-t border-line align-middle hover:bg-sunk/50"
          >
            {row.getVisibleCells().map((cell) => (
              <td key={cell.id} className={cx('px-4 py-2.5', cell.column.id === 'name' && 'font-semibold')}>
                {flexRender(cell.column.columnDef.cell, cell.getContext())}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </TableShell>
  );
}
