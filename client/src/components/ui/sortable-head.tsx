import { flexRender, type Table as TanStackTable } from '@tanstack/react-table';
import { Th } from './table';

/** The sort state of a column as a small mark beside its header (decorative; aria-sort on the cell says it). */
export function SortMark({ direction }: { direction: false | 'asc' | 'desc' }) {
  return (
    <span aria-hidden="true" className={`num text-[0.75rem] ${direction ? 'text-reference' : 'text-rule-strong'}`}>
      {direction === 'asc' ? '▲' : direction === 'desc' ? '▼' : '△'}
    </span>
  );
}

/**
 * The header of a TanStack table: each sortable column's header is a button
 * (named by the header, test id `sort-<column id>`) that toggles its sorting,
 * with aria-sort on the cell; other columns get a plain header cell.
 */
export function SortableHead<TData>({ table }: { table: TanStackTable<TData> }) {
  return (
    <thead>
      {table.getHeaderGroups().map((group) => (
        <tr key={group.id}>
          {group.headers.map((header) => {
            const direction = header.column.getIsSorted();
            if (!header.column.getCanSort()) return <Th key={header.id}>{flexRender(header.column.columnDef.header, header.getContext())}</Th>;
            return (
              <Th key={header.id} aria-sort={direction === 'asc' ? 'ascending' : direction === 'desc' ? 'descending' : 'none'} flush>
                <button
                  type="button"
                  onClick={header.column.getToggleSortingHandler()}
                  className="flex w-full items-center gap-1.5 px-3 py-2 text-left font-semibold hover:bg-rule/40 hover:text-ink"
                  data-testid={`sort-${header.column.id}`}
                >
                  {flexRender(header.column.columnDef.header, header.getContext())}
                  <SortMark direction={direction} />
                </button>
              </Th>
            );
          })}
        </tr>
      ))}
    </thead>
  );
}
