import { useState } from 'react';
import { WEEKDAY_NAMES, type Section } from '@shared/api/sections';
import { Button } from '@client/components/ui/button';
import { EmptyState } from '@client/components/ui/empty-state';
import { ErrorNotice } from '@client/components/ui/error-notice';
import { Num } from '@client/components/ui/num';
import { StatusText } from '@client/components/ui/status-text';
import { SkeletonRows, Table, Td, Th } from '@client/components/ui/table';
import { ConfirmDialog } from '@client/components/ui/confirm-dialog';
import { FormError } from '@client/features/courses/components/form-fields';
import { useCourseFromLayout } from '@client/features/courses/lib/course-context';
import { useCreateSection, useSections, useSetSectionArchived, useUpdateSection } from '../api/get-sections';
import { emptySection, SectionForm, valuesOf } from '../components/section-form';

function When({ section }: { section: Section }) {
  if (!section.weekday && !section.startsAt) return <span className="text-graphite">Not fixed</span>;
  return (
    <span className="whitespace-nowrap">
      {section.weekday ? WEEKDAY_NAMES[section.weekday - 1] : ''}{' '}
      {section.startsAt ? (
        <Num>
          {section.startsAt}
          {section.endsAt ? `–${section.endsAt}` : ''}
        </Num>
      ) : null}
    </span>
  );
}

/** /courses/:courseId/sections: lecturers manage the lab sections; assistants see the ones they teach. */
export function SectionsPage() {
  const course = useCourseFromLayout();
  const sections = useSections(course.id);
  const create = useCreateSection(course.id);
  const update = useUpdateSection(course.id);
  const setArchived = useSetSectionArchived(course.id);
  const [editing, setEditing] = useState<'new' | number | null>(null);
  const [archiving, setArchiving] = useState<Section | null>(null);
  const manage = course.permissions.manageSections;
  const assistants = course.staff.filter((s) => s.role === 'assistant');
  const list = sections.data ?? [];

  const form =
    editing === 'new' ? (
      <SectionForm
        label="New section"
        initial={emptySection}
        assistants={assistants}
        submitLabel="Create section"
        busy={create.isPending}
        error={create.error}
        onSubmit={(values) => create.mutate(values, { onSuccess: () => setEditing(null) })}
        onCancel={() => {
          create.reset();
          setEditing(null);
        }}
      />
    ) : typeof editing === 'number' ? (
      <SectionForm
        key={editing}
        label="Edit section"
        initial={valuesOf(list.find((s) => s.id === editing)!)}
        assistants={assistants}
        submitLabel="Save section"
        busy={update.isPending}
        error={update.error}
        onSubmit={(values) => update.mutate({ sectionId: editing, body: values }, { onSuccess: () => setEditing(null) })}
        onCancel={() => {
          update.reset();
          setEditing(null);
        }}
      />
    ) : null;

  return (
    <>
      <title>{`Sections · ${course.code} · Bondmark`}</title>
      <div className="mb-3 flex flex-wrap items-center justify-between gap-3">
        <p className="max-w-[70ch] text-graphite">
          {manage
            ? 'The lab sections of this course: when and where they meet, how many students fit, and who teaches them.'
            : course.permissions.editCourse
              ? 'The course is archived; its sections are read-only.'
              : 'The sections you teach in this course.'}
        </p>
        {manage && editing === null ? (
          <Button variant="primary" size="sm" onClick={() => setEditing('new')}>
            New section
          </Button>
        ) : null}
      </div>
      {form}
      {sections.isError ? (
        <ErrorNotice what="the sections" error={sections.error} onRetry={() => void sections.refetch()} />
      ) : sections.data && list.length === 0 ? (
        <EmptyState title="No sections yet" testId="sections-empty">
          {manage ? 'Create the lab sections students are placed in; the roster import can then place students by section name.' : 'You are not assigned to a section of this course yet.'}
        </EmptyState>
      ) : (
        <Table label="Sections" busy={sections.isPending} testId="sections-table">
          <thead>
            <tr>
              <Th>Section</Th>
              <Th>When</Th>
              <Th>Room</Th>
              <Th className="text-right">Students</Th>
              <Th>Assistants</Th>
              <Th>State</Th>
              {manage ? (
                <Th>
                  <span className="sr-only">Actions</span>
                </Th>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {sections.isPending ? (
              <SkeletonRows columns={manage ? 7 : 6} rows={3} label="Loading sections" />
            ) : (
              list.map((s) => (
                <tr key={s.id} data-testid="section-row" data-section-id={s.id}>
                  <Td className="font-semibold">{s.name}</Td>
                  <Td>
                    <When section={s} />
                  </Td>
                  <Td>{s.room ?? <span className="text-graphite">—</span>}</Td>
                  <Td className="text-right whitespace-nowrap">
                    <Num className={s.capacity !== null && s.studentCount > s.capacity ? 'text-caution' : ''}>
                      {s.studentCount}
                      {s.capacity !== null ? ` / ${s.capacity}` : ''}
                    </Num>
                  </Td>
                  <Td>{s.assistants.length ? s.assistants.map((a) => a.displayName).join(', ') : <span className="text-graphite">None</span>}</Td>
                  <Td>{s.archived ? <StatusText tone="neutral">Archived</StatusText> : <StatusText tone="good">Meeting</StatusText>}</Td>
                  {manage ? (
                    <Td className="text-right whitespace-nowrap">
                      <Button size="sm" variant="quiet" onClick={() => setEditing(s.id)} aria-label={`Edit section ${s.name}`} disabled={editing !== null}>
                        Edit
                      </Button>
                      {s.archived ? (
                        <Button size="sm" variant="quiet" onClick={() => setArchived.mutate({ sectionId: s.id, archived: false })} aria-label={`Restore section ${s.name}`}>
                          Restore
                        </Button>
                      ) : (
                        <Button size="sm" variant="quiet" onClick={() => setArchiving(s)} aria-label={`Archive section ${s.name}`}>
                          Archive
                        </Button>
                      )}
                    </Td>
                  ) : null}
                </tr>
              ))
            )}
          </tbody>
        </Table>
      )}
      {!archiving ? <FormError error={setArchived.error} /> : null}
      <ConfirmDialog
        open={archiving !== null}
        title={`Archive section ${archiving?.name ?? ''}?`}
        confirmLabel="Archive section"
        busy={setArchived.isPending}
        error={setArchived.error}
        onCancel={() => {
          setArchived.reset();
          setArchiving(null);
        }}
        onConfirm={() => archiving && setArchived.mutate({ sectionId: archiving.id, archived: true }, { onSuccess: () => setArchiving(null) })}
      >
        An archived section takes no new students. A section can only be archived once its students have been moved to
        another; it can be restored later.
      </ConfirmDialog>
    </>
  );
}
