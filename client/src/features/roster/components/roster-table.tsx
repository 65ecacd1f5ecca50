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
import type { RosterEntry } from '@shared/api/roster';
import type { Section } from '@shared/api/sections';
import { Button } from '@client/components/ui/button';
import { Num } from '@client/components/ui/num';
import { StatusText } from '@client/components/ui/status-text';
import { SortableHead } from '@client/components/ui/sortable-head';
import { SkeletonRows, Table, Td } from '@client/components/ui/table';
import { matchesText } from '../lib/roster-filters';

const byText: SortingFn<RosterEntry> = (a, b, id) =>
  String(a.getValue(id) ?? '').localeCompare(String(b.getValue(id) ?? ''), undefined, { sensitivity: 'base', numeric: true });

const textFilter: FilterFn<RosterEntry> = (row, _id, value) => matchesText(row.original, String(value ?? ''));

const fullName = (e: RosterEntry) => [e.givenName, e.familyName].filter(Boolean).join(' ') || e.studentNumber;

const column = createColumnHelper<RosterEntry>();

/**
 * The roster: sortable by every column, filtered by the page (URL state).
 * Managers get a section picker and withdraw/reinstate per row.
 */
export function RosterTable({
  entries,
  loading,
  sorting,
  onSortingChange,
  filter,
  sections,
  manage,
  onMove,
  onWithdraw,
  onReinstate,
  busyId,
}: {
  entries: RosterEntry[] | undefined;
  loading: boolean;
  sorting: SortingState;
  onSortingChange: OnChangeFn<SortingState>;
  filter: string;
  sections: Section[];
  manage: boolean;
  onMove: (entry: RosterEntry, sectionId: number | null) => void;
  onWithdraw: (entry: RosterEntry) => void;
  onReinstate: (entry: RosterEntry) => void;
  busyId: number | null;
}) {
  const data = useMemo(() => entries ?? [], [entries]);
  const columns = useMemo(() => {
    const list = [
      column.accessor('studentNumber', { id: 'studentNumber', header: 'Student number', sortingFn: byText, cell: (i) => <Num>{i.getValue()}</Num> }),
      column.accessor((e) => e.familyName ?? '', { id: 'familyName', header: 'Family name', sortingFn: byText, cell: (i) => <span className="font-semibold">{i.getValue()}</span> }),
      column.accessor((e) => e.givenName ?? '', { id: 'givenName', header: 'Given name', sortingFn: byText }),
      column.accessor((e) => e.email ?? '', {
        id: 'email',
        header: 'E-mail',
        sortingFn: byText,
        cell: (i) => (
          <span className="break-all">
            {i.getValue()}
            {!i.row.original.signedIn ? (
              <span className="ml-1.5 text-[0.8rem] whitespace-nowrap text-graphite" title="Known from the roster; has not signed in yet">
                (not signed in yet)
              </span>
            ) : null}
          </span>
        ),
      }),
      column.accessor((e) => e.section?.name ?? '', {
        id: 'section',
        header: 'Section',
        sortingFn: byText,
        sortUndefined: 'last',
        cell: (i) => {
          const entry = i.row.original;
          if (!manage || entry.status === 'withdrawn') return entry.section ? entry.section.name : <span className="text-graphite">None</span>;
          return (
            <select
              aria-label={`Section of ${fullName(entry)}`}
              className="h-8 rounded-[3px] border border-rule-strong bg-white px-1.5 text-ink"
              value={entry.section?.id ?? ''}
              disabled={busyId === entry.enrolmentId}
              onChange={(e) => onMove(entry, e.target.value ? Number(e.target.value) : null)}
            >
              <option value="">None</option>
              {sections
                .filter((s) => !s.archived || s.id === entry.section?.id)
                .map((s) => (
                  <option key={s.id} value={s.id}>
                    {s.name}
                  </option>
                ))}
            </select>
          );
        },
      }),
      column.accessor('status', {
        id: 'status',
        header: 'Status',
        sortingFn: byText,
        cell: (i) => (i.getValue() === 'active' ? <StatusText tone="good">Enrolled</StatusText> : <StatusText tone="neutral">Withdrawn</StatusText>),
      }),
    ];
    if (manage) {
      list.push(
        column.display({
          id: 'actions',
          header: () => <span className="sr-only">Actions</span>,
          cell: (i) => {
            const entry = i.row.original;
            return entry.status === 'active' ? (
              <Button size="sm" variant="quiet" onClick={() => onWithdraw(entry)} aria-label={`Withdraw ${fullName(entry)}`} disabled={busyId === entry.enrolmentId}>
                Withdraw
              </Button>
            ) : (
              <Button size="sm" variant="quiet" onClick={() => onReinstate(entry)} aria-label={`Reinstate ${fullName(entry)}`} disabled={busyId === entry.enrolmentId}>
                Reinstate
              </Button>
            );
          },
        }) as never,
      );
    }
    return list;
  }, [manage, sections, busyId, onMove, onWithdraw, onReinstate]);

  const table = useReactTable({
    data,
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange,
    globalFilterFn: textFilter,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getRowId: (row) => String(row.enrolmentId),
  });
  const rows = table.getRowModel().rows;

  return (
    <>
      <p className="mb-2 text-sm text-graphite" role="status" aria-live="polite" data-testid="roster-count">
        {loading ? null : rows.length === data.length ? (
          <>
            <Num className="text-ink">{data.length}</Num> {data.length === 1 ? 'student' : 'students'}
          </>
        ) : (
          <>
            <Num className="text-ink">{rows.length}</Num> of <Num>{data.length}</Num> students shown
          </>
        )}
      </p>
      <Table label="Roster" busy={loading} testId="roster-table">
        <SortableHead table={table} />
        <tbody>
          {loading ? (
            <SkeletonRows columns={columns.length} rows={8} label="Loading the roster" />
          ) : rows.length === 0 ? (
            <tr>
              <Td colSpan={columns.length} className="py-6 text-center text-graphite">
                {data.length === 0 ? 'No students here yet.' : 'No student matches these filters.'}
              </Td>
            </tr>
          ) : (
            rows.map((row) => (
              <tr key={row.id} data-testid="roster-row" data-student-number={row.original.studentNumber} className={row.original.status === 'withdrawn' ? 'text-graphite' : 'hover:bg-paper'}>
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
