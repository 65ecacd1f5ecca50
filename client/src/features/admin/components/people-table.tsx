import { useMemo } from 'react';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type FilterFn,
  type OnChangeFn,
  type SortingFn,
  type SortingState,
} from '@tanstack/react-table';
import type { AdminUserRow } from '@shared/api';
import { DateTime } from '@client/components/ui/date-time';
import { Num } from '@client/components/ui/num';
import { RoleBadge } from '@client/components/ui/role-badge';
import { StatusText } from '@client/components/ui/status-text';
import { SortableHead } from '@client/components/ui/sortable-head';
import { SkeletonRows, Table, Td } from '@client/components/ui/table';

/** Column ids; also the values of `sort` in the URL. */
export const PEOPLE_COLUMN_IDS = ['name', 'email', 'siteRole', 'status', 'lastSignIn', 'added'] as const;

const byText: SortingFn<AdminUserRow> = (a, b, id) =>
  String(a.getValue(id) ?? '').localeCompare(String(b.getValue(id) ?? ''), undefined, { sensitivity: 'base' });

/** The filter box matches name or e-mail, ignoring case. */
export const matchesPerson: FilterFn<AdminUserRow> = (row, _columnId, value) => {
  const needle = String(value ?? '').trim().toLowerCase();
  if (!needle) return true;
  return (
    row.original.displayName.toLowerCase().includes(needle) || row.original.email.toLowerCase().includes(needle)
  );
};

const column = createColumnHelper<AdminUserRow>();

const columns = [
  column.accessor('displayName', {
    id: 'name',
    header: 'Name',
    sortingFn: byText,
    cell: (info) => <span className="font-semibold">{info.getValue()}</span>,
  }),
  column.accessor('email', {
    id: 'email',
    header: 'E-mail',
    sortingFn: byText,
    cell: (info) => <span className="break-all">{info.getValue()}</span>,
  }),
  column.accessor((row) => (row.isAdmin ? 'admin' : ''), {
    id: 'siteRole',
    header: 'Site role',
    sortingFn: byText,
    sortDescFirst: true,
    cell: (info) => (info.getValue() ? <RoleBadge role="admin" /> : <span className="text-graphite">—</span>),
  }),
  column.accessor((row) => (row.active ? 'active' : 'deactivated'), {
    id: 'status',
    header: 'Status',
    sortingFn: byText,
    cell: (info) =>
      info.getValue() === 'active' ? (
        <StatusText tone="good">Active</StatusText>
      ) : (
        <StatusText tone="neutral">Deactivated</StatusText>
      ),
  }),
  column.accessor((row) => row.lastSignInAt ?? undefined, {
    id: 'lastSignIn',
    header: 'Last sign-in',
    sortingFn: 'basic',
    sortUndefined: 'last',
    sortDescFirst: true,
    cell: (info) => {
      const value = info.getValue();
      return value ? <DateTime iso={value} /> : <span className="text-graphite">Never</span>;
    },
  }),
  column.accessor('createdAt', {
    id: 'added',
    header: 'Added',
    sortingFn: 'basic',
    sortDescFirst: true,
    cell: (info) => <DateTime iso={info.getValue()} dateOnly />,
  }),
];

/**
 * Everyone with an account. Sorting and the filter are controlled by the page
 * (which keeps them in the URL); the table only renders and reports changes.
 */
export function PeopleTable({
  users,
  loading,
  sorting,
  onSortingChange,
  filter,
}: {
  users: AdminUserRow[] | undefined;
  loading: boolean;
  sorting: SortingState;
  onSortingChange: OnChangeFn<SortingState>;
  filter: string;
}) {
  const data = useMemo(() => users ?? [], [users]);
  const table = useReactTable({
    data,
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange,
    globalFilterFn: matchesPerson,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getRowId: (row) => String(row.id),
  });
  const rows = table.getRowModel().rows;

  return (
    <>
    <p className="mb-2 text-sm text-graphite" role="status" aria-live="polite" data-testid="people-count">
      {loading ? (
        null
      ) : filter.trim() ? (
        <>
          <Num className="text-ink">{rows.length}</Num> of <Num>{data.length}</Num> people match
        </>
      ) : (
        <>
          <Num className="text-ink">{data.length}</Num> {data.length === 1 ? 'person' : 'people'}
        </>
      )}
    </p>
    <Table label="People" busy={loading} testId="people-table">
      <SortableHead table={table} />
      <tbody>
        {loading ? (
          <SkeletonRows columns={columns.length} rows={8} label="Loading people" />
        ) : rows.length === 0 ? (
          <tr>
            <Td colSpan={columns.length} className="py-6 text-center text-graphite">
              {data.length === 0 ? (
                'No accounts yet. An account is made the first time someone signs in.'
              ) : (
                <>
                  Nobody matches <Num className="text-ink">“{filter}”</Num>. Clear the filter to see all{' '}
                  <Num>{data.length}</Num>.
                </>
              )}
            </Td>
          </tr>
        ) : (
          rows.map((row) => (
            <tr key={row.id} data-testid="person-row" data-person-id={row.id} className="hover:bg-paper">
              {row.getVisibleCells().map((cell) => (
                <Td key={cell.id} className={cell.column.id === 'email' ? '' : 'whitespace-nowrap'}>
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </Td>
              ))}
            </tr>
          ))
        )}
      </tbody>
    </Table>
    </>
  );
}
