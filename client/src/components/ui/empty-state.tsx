import type { ReactNode } from 'react';

/** What a table or list shows when it has nothing yet: what is missing and what creates it. */
export function EmptyState({ title, children, testId }: { title: string; children?: ReactNode; testId?: string }) {
  return (
    <div
      className="rounded-[3px] border border-dashed border-rule-strong bg-sheet px-6 py-8 text-center"
      data-testid={testId ?? 'empty-state'}
    >
      <p className="font-serif text-lg font-semibold text-ink">{title}</p>
      {children ? <div className="mx-auto mt-1 max-w-[56ch] text-graphite">{children}</div> : null}
    </div>
  );
}
