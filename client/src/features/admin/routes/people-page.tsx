import { useEffect, useId, useState } from 'react';
import { useSearchParams } from 'react-router';
import type { OnChangeFn, SortingState } from '@tanstack/react-table';
import { Button } from '@client/components/ui/button';
import { ErrorNotice } from '@client/components/ui/error-notice';
import { PageHeader } from '@client/components/ui/page-header';
import { formatSort, parseSort, withParam } from '@client/lib/table-url';
import { useAdminUsers } from '../api/get-users';
import { PEOPLE_COLUMN_IDS, PeopleTable } from '../components/people-table';

/**
 * /admin/people: every account, sortable by any column, filtered by name or
 * e-mail. `q` (filter) and `sort` (e.g. `-lastSignIn`) live in the URL.
 */
export function PeoplePage() {
  const users = useAdminUsers();
  const [searchParams, setSearchParams] = useSearchParams();
  const filterId = useId();

  // The input keeps its own value so typing never waits for the router;
  // every keystroke also replaces the URL's `q`.
  const [filter, setFilter] = useState(() => searchParams.get('q') ?? '');
  // Back/forward or a pasted link can change `q` under us: follow it.
  const urlFilter = searchParams.get('q') ?? '';
  useEffect(() => {
    setFilter((current) => ((current.trim() ? current : '') === urlFilter ? current : urlFilter));
  }, [urlFilter]);
  const sorting = parseSort(searchParams.get('sort'), PEOPLE_COLUMN_IDS);

  const changeFilter = (value: string) => {
    setFilter(value);
    setSearchParams((params) => withParam(params, 'q', value.trim() ? value : null), { replace: true });
  };

  const onSortingChange: OnChangeFn<SortingState> = (updater) => {
    const next = typeof updater === 'function' ? updater(sorting) : updater;
    setSearchParams((params) => withParam(params, 'sort', formatSort(next)), { replace: true });
  };

  return (
    <>
      <title>People · Bondmark</title>
      <PageHeader
        title="People"
        description="Everyone with a Bondmark account. Accounts are made at first sign-in; course roles come from rosters and teaching teams."
      />
      <div className="mb-3 flex flex-wrap items-end gap-2">
        <div className="flex flex-col">
          <label htmlFor={filterId} className="mb-1 text-sm font-semibold text-ink">
            Filter people
          </label>
          <input
            id={filterId}
            type="search"
            value={filter}
            onChange={(event) => changeFilter(event.target.value)}
            placeholder="Name or e-mail"
            autoComplete="off"
            spellCheck={false}
            className="h-9 w-[20rem] max-w-full rounded-[3px] border border-rule-strong bg-white px-2.5 text-ink placeholder:text-graphite"
            data-testid="people-filter"
          />
        </div>
        {filter ? (
          <Button size="sm" variant="quiet" onClick={() => changeFilter('')} className="h-9">
            Clear filter
          </Button>
        ) : null}
      </div>
      {users.isError ? (
        <ErrorNotice what="people" error={users.error} onRetry={() => void users.refetch()} />
      ) : (
        <PeopleTable
          users={users.data}
          loading={users.isPending}
          sorting={sorting}
          onSortingChange={onSortingChange}
          filter={filter}
        />
      )}
    </>
  );
}
