import { Fragment } from 'react';
import type { AuditEntry } from '@shared/api';
import { Button } from '@client/components/ui/button';
import { DateTime } from '@client/components/ui/date-time';
import { EmptyState } from '@client/components/ui/empty-state';
import { ErrorNotice } from '@client/components/ui/error-notice';
import { Num } from '@client/components/ui/num';
import { PageHeader } from '@client/components/ui/page-header';
import { SkeletonRows, Table, Td, Th } from '@client/components/ui/table';
import { AUDIT_PAGE_SIZE, useAuditLog } from '../api/get-audit';
import { ChangeSummary } from '../components/change-summary';

function AuditRow({ entry }: { entry: AuditEntry }) {
  return (
    <tr data-testid="audit-row" data-audit-id={entry.id} className="hover:bg-paper">
      <Td className="whitespace-nowrap">
        <DateTime iso={entry.at} />
        <div className="text-[0.75rem] text-graphite">
          <Num>#{entry.id}</Num>
        </div>
      </Td>
      <Td className="min-w-[7rem]">
        {entry.actorName ?? <span className="text-graphite">{entry.actorId === null ? 'System' : `Account ${entry.actorId}`}</span>}
      </Td>
      <Td className="whitespace-nowrap">
        <code className="num text-ink">{entry.action}</code>
      </Td>
      <Td className="whitespace-nowrap">
        {entry.entityType}
        {entry.entityId !== null ? <Num className="text-graphite"> {entry.entityId}</Num> : null}
      </Td>
      <Td className="min-w-[15rem]">
        <ChangeSummary before={entry.before} after={entry.after} />
      </Td>
    </tr>
  );
}

/** /admin/audit: the append-only record of who changed what, newest first, fifty at a time. */
export function AuditPage() {
  const audit = useAuditLog();
  const entries = audit.data?.pages.flatMap((page) => page.entries) ?? [];

  return (
    <>
      <title>Audit log · Bondmark</title>
      <PageHeader
        title="Audit log"
        description="Every change to people, courses, marks and settings, newest first. Entries are only ever added, never changed."
        actions={
          audit.data ? (
            <p className="text-sm text-graphite" data-testid="audit-count">
              <Num className="text-ink">{entries.length}</Num> {entries.length === 1 ? 'entry' : 'entries'} shown
            </p>
          ) : null
        }
      />
      {audit.isError && !audit.data ? (
        <ErrorNotice what="the audit log" error={audit.error} onRetry={() => void audit.refetch()} />
      ) : audit.data && entries.length === 0 ? (
        <EmptyState title="Nothing recorded yet" testId="audit-empty">
          Entries appear here as soon as someone changes a person, a course, a mark or a setting.
        </EmptyState>
      ) : (
        <>
          <Table label="Audit log" busy={audit.isPending || audit.isFetchingNextPage} testId="audit-table">
            <thead>
              <tr>
                <Th>When</Th>
                <Th>Who</Th>
                <Th>Action</Th>
                <Th>Record</Th>
                <Th>Change</Th>
              </tr>
            </thead>
            <tbody>
              {audit.isPending ? (
                <SkeletonRows columns={5} rows={8} label="Loading the audit log" />
              ) : (
                audit.data?.pages.map((page, index) => (
                  <Fragment key={index}>
                    {page.entries.map((entry) => (
                      <AuditRow key={entry.id} entry={entry} />
                    ))}
                  </Fragment>
                ))
              )}
              {audit.isFetchingNextPage ? <SkeletonRows columns={5} rows={3} label="Loading older entries" /> : null}
            </tbody>
          </Table>
          <div className="mt-3 flex flex-wrap items-center gap-3">
            {audit.hasNextPage ? (
              <Button
                onClick={() => void audit.fetchNextPage()}
                disabled={audit.isFetchingNextPage}
                aria-busy={audit.isFetchingNextPage || undefined}
                data-testid="audit-load-older"
              >
                Load older
              </Button>
            ) : audit.data ? (
              <p className="text-sm text-graphite" data-testid="audit-end">
                Beginning of the log reached.
              </p>
            ) : null}
            {audit.isFetchNextPageError ? (
              <p role="alert" className="text-sm text-antibonding">
                Older entries could not be loaded: {audit.error?.message}
              </p>
            ) : null}
            <p className="text-sm text-graphite">
              <Num>{AUDIT_PAGE_SIZE}</Num> entries a page.
            </p>
          </div>
        </>
      )}
    </>
  );
}
