import { useCallback, useEffect, useId, useState } from 'react';
import { Link, useSearchParams } from 'react-router';
import type { OnChangeFn, SortingState } from '@tanstack/react-table';
import type { RosterEntry } from '@shared/api/roster';
import { Button, buttonClasses } from '@client/components/ui/button';
import { DateTime } from '@client/components/ui/date-time';
import { ErrorNotice } from '@client/components/ui/error-notice';
import { Num } from '@client/components/ui/num';
import { ConfirmDialog } from '@client/components/ui/confirm-dialog';
import { FormError, inputClasses } from '@client/features/courses/components/form-fields';
import { useCourseFromLayout } from '@client/features/courses/lib/course-context';
import { useSections } from '@client/features/sections/api/get-sections';
import { formatSort, parseSort, withParam } from '@client/lib/table-url';
import { useMoveStudent, useRoster, useRosterImports, useSetWithdrawn } from '../api/get-roster';
import { AddStudentForm } from '../components/add-student-form';
import { RosterTable } from '../components/roster-table';
import { filterRoster, readRosterFilters, ROSTER_COLUMN_IDS } from '../lib/roster-filters';

const fullName = (e: RosterEntry) => [e.givenName, e.familyName].filter(Boolean).join(' ') || e.studentNumber;

/**
 * /courses/:courseId/roster: the students of the course (assistants: of their
 * sections, read-only). `q`, `section`, `status` and `sort` live in the URL.
 */
export function RosterPage() {
  const course = useCourseFromLayout();
  const roster = useRoster(course.id);
  const sections = useSections(course.id);
  const manage = course.permissions.manageRoster && roster.data?.readOnly === false;
  const imports = useRosterImports(course.id, course.permissions.manageRoster);
  const move = useMoveStudent(course.id);
  const withdraw = useSetWithdrawn(course.id);
  const [searchParams, setSearchParams] = useSearchParams();
  const filters = readRosterFilters(searchParams);
  const [text, setText] = useState(filters.q);
  const [adding, setAdding] = useState(false);
  const [leaving, setLeaving] = useState<RosterEntry | null>(null);
  const [busyId, setBusyId] = useState<number | null>(null);
  const ids = { q: useId(), section: useId(), status: useId() };

  useEffect(() => {
    setText((current) => ((current.trim() ? current : '') === filters.q ? current : filters.q));
  }, [filters.q]);

  const sorting = parseSort(searchParams.get('sort'), ROSTER_COLUMN_IDS);
  const onSortingChange: OnChangeFn<SortingState> = (updater) => {
    const next = typeof updater === 'function' ? updater(sorting) : updater;
    setSearchParams((p) => withParam(p, 'sort', formatSort(next)), { replace: true });
  };
  const setFilter = (key: 'q' | 'section' | 'status', value: string) => setSearchParams((p) => withParam(p, key, value || null), { replace: true });

  const onMove = useCallback(
    (entry: RosterEntry, sectionId: number | null) => {
      setBusyId(entry.enrolmentId);
      move.mutate({ enrolmentId: entry.enrolmentId, sectionId }, { onSettled: () => setBusyId(null) });
    },
    [move],
  );
  const onReinstate = useCallback(
    (entry: RosterEntry) => {
      setBusyId(entry.enrolmentId);
      withdraw.mutate({ enrolmentId: entry.enrolmentId, withdrawn: false }, { onSettled: () => setBusyId(null) });
    },
    [withdraw],
  );
  const onWithdraw = useCallback((entry: RosterEntry) => setLeaving(entry), []);

  const entries = roster.data ? filterRoster(roster.data.entries, filters) : undefined;
  const lastImport = imports.data?.[0];

  return (
    <>
      <title>{`Roster · ${course.code} · Bondmark`}</title>
      <div className="mb-3 flex flex-wrap items-start justify-between gap-3">
        <p className="max-w-[70ch] text-graphite">
          {manage ? (
            <>
              Students of this course. Import the registrar&rsquo;s file to add and update them; students missing from a new
              file are reported, never removed.
              {lastImport ? (
                <>
                  {' '}
                  Last import: <span className="text-ink">{lastImport.fileName}</span> on <DateTime iso={lastImport.createdAt} /> by{' '}
                  {lastImport.actorName ?? 'someone'}.
                </>
              ) : null}
            </>
          ) : course.permissions.manageRoster || course.permissions.editCourse ? (
            'The course is archived; its roster is read-only.'
          ) : (
            'The students of the sections you teach. Only the lecturers change the roster.'
          )}
        </p>
        {manage ? (
          <div className="flex gap-2">
            <Button size="sm" onClick={() => setAdding((v) => !v)} aria-expanded={adding}>
              Add a student
            </Button>
            <Link to="import" className={`${buttonClasses('primary', 'sm')} no-underline`}>
              Import roster
            </Link>
          </div>
        ) : null}
      </div>
      {adding && manage ? <AddStudentForm courseId={course.id} sections={sections.data ?? []} onDone={() => setAdding(false)} /> : null}
      <div className="mb-3 flex flex-wrap items-end gap-3" role="search" aria-label="Filter the roster">
        <div className="flex flex-col">
          <label htmlFor={ids.q} className="mb-1 text-sm font-semibold text-ink">
            Filter students
          </label>
          <input
            id={ids.q}
            type="search"
            value={text}
            onChange={(e) => {
              setText(e.target.value);
              setFilter('q', e.target.value.trim() ? e.target.value : '');
            }}
            placeholder="Number, name or e-mail"
            autoComplete="off"
            spellCheck={false}
            className={`${inputClasses} w-[18rem]`}
          />
        </div>
        <div className="flex flex-col">
          <label htmlFor={ids.section} className="mb-1 text-sm font-semibold text-ink">
            Section
          </label>
          <select id={ids.section} value={filters.section} onChange={(e) => setFilter('section', e.target.value)} className={`${inputClasses} w-[12rem]`}>
            <option value="">All sections</option>
            {(sections.data ?? []).map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
            <option value="none">No section</option>
          </select>
        </div>
        <div className="flex flex-col">
          <label htmlFor={ids.status} className="mb-1 text-sm font-semibold text-ink">
            Status
          </label>
          <select id={ids.status} value={filters.status} onChange={(e) => setFilter('status', e.target.value)} className={`${inputClasses} w-[10rem]`}>
            <option value="">All</option>
            <option value="active">Enrolled</option>
            <option value="withdrawn">Withdrawn</option>
          </select>
        </div>
        {filters.q || filters.section || filters.status ? (
          <Button
            size="sm"
            variant="quiet"
            className="h-9"
            onClick={() => {
              setText('');
              setSearchParams((p) => withParam(withParam(withParam(p, 'q', null), 'section', null), 'status', null), { replace: true });
            }}
          >
            Clear filters
          </Button>
        ) : null}
      </div>
      <FormError error={move.error ?? (leaving ? null : withdraw.error)} />
      {roster.isError ? (
        <ErrorNotice what="the roster" error={roster.error} onRetry={() => void roster.refetch()} />
      ) : (
        <RosterTable
          entries={entries}
          loading={roster.isPending}
          sorting={sorting}
          onSortingChange={onSortingChange}
          filter={text}
          sections={sections.data ?? []}
          manage={manage}
          onMove={onMove}
          onWithdraw={onWithdraw}
          onReinstate={onReinstate}
          busyId={busyId}
        />
      )}
      <ConfirmDialog
        open={leaving !== null}
        title={`Withdraw ${leaving ? fullName(leaving) : ''}?`}
        confirmLabel="Withdraw student"
        busy={withdraw.isPending}
        error={withdraw.error}
        onCancel={() => {
          withdraw.reset();
          setLeaving(null);
        }}
        onConfirm={() => leaving && withdraw.mutate({ enrolmentId: leaving.enrolmentId, withdrawn: true }, { onSuccess: () => setLeaving(null) })}
      >
        Student number <Num>{leaving?.studentNumber}</Num> stays on the roster as withdrawn, with everything they handed in
        and every mark. They no longer count as a student of the course; you can reinstate them later.
      </ConfirmDialog>
    </>
  );
}
