import type { ReactNode, TdHTMLAttributes, ThHTMLAttributes } from 'react';

/**
 * The table shell every list in Bondmark uses: a bordered sheet that scrolls
 * sideways on narrow screens, dense rows, a sticky header line.
 */
export function Table({
  children,
  label,
  busy = false,
  testId,
}: {
  children: ReactNode;
  /** Accessible name of the table (visually hidden caption). */
  label: string;
  busy?: boolean;
  testId?: string;
}) {
  return (
    <div className="overflow-x-auto rounded-[3px] border border-rule bg-sheet">
      <table className="w-full border-collapse text-left text-[0.9rem]" aria-busy={busy || undefined} data-testid={testId}>
        <caption className="sr-only">{label}</caption>
        {children}
      </table>
    </div>
  );
}

export function Th({
  className = '',
  flush = false,
  ...rest
}: ThHTMLAttributes<HTMLTableCellElement> & {
  /** No padding: the cell holds a full-size control (e.g. a sort button) that brings its own. */
  flush?: boolean;
}) {
  return (
    <th
      scope="col"
      className={`sticky top-0 border-b border-rule-strong bg-wash align-bottom text-[0.8rem] font-semibold tracking-[0.02em] whitespace-nowrap text-graphite ${flush ? '' : 'px-3 py-2'} ${className}`}
      {...rest}
    />
  );
}

export function Td({ className = '', ...rest }: TdHTMLAttributes<HTMLTableCellElement>) {
  return <td className={`border-b border-rule px-3 py-1.5 align-top ${className}`} {...rest} />;
}

/** Placeholder rows while data loads; a status line tells screen readers what is happening. */
export function SkeletonRows({ columns, rows = 6, label = 'Loading' }: { columns: number; rows?: number; label?: string }) {
  const widths = ['w-3/4', 'w-1/2', 'w-2/3', 'w-5/6', 'w-2/5'];
  return (
    <>
      {Array.from({ length: rows }, (_, r) => (
        <tr key={r} data-testid="skeleton-row">
          {Array.from({ length: columns }, (_, c) => (
            <td key={c} className="border-b border-rule px-3 py-2.5">
              {r === 0 && c === 0 ? (
                <span role="status" className="sr-only">
                  {label}…
                </span>
              ) : null}
              <span aria-hidden="true" className={`skeleton block h-3 ${widths[(r + c) % widths.length]}`} />
            </td>
          ))}
        </tr>
      ))}
    </>
  );
}
