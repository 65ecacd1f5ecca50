import { useState, type FormEvent } from 'react';
import type { StaffMember, StaffRole } from '@shared/api/courses';
import { Button } from '@client/components/ui/button';
import { ErrorNotice } from '@client/components/ui/error-notice';
import { Table, Td, Th } from '@client/components/ui/table';
import { RoleBadge } from '@client/components/ui/role-badge';
import { useAddStaff, useRemoveStaff, useSetCourseArchived, useUpdateCourse } from '../api/course-mutations';
import { useTerms } from '../api/get-terms';
import { ConfirmDialog } from '@client/components/ui/confirm-dialog';
import { CourseForm } from '../components/course-form';
import { FormError, SelectField, TextField } from '../components/form-fields';
import { useCourseFromLayout } from '../lib/course-context';

function SectionTitle({ children }: { children: React.ReactNode }) {
  return <h2 className="mb-3 font-serif text-xl font-semibold">{children}</h2>;
}

function TeachingTeam() {
  const course = useCourseFromLayout();
  const add = useAddStaff(course.id);
  const remove = useRemoveStaff(course.id);
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<StaffRole>('assistant');
  const [leaving, setLeaving] = useState<StaffMember | null>(null);
  const lecturers = course.staff.filter((s) => s.role === 'lecturer').length;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    add.mutate({ email, role }, { onSuccess: () => setEmail('') });
  };
  return (
    <section aria-labelledby="team-title" className="mb-10">
      <h2 id="team-title" className="mb-1 font-serif text-xl font-semibold">
        Teaching team
      </h2>
      <p className="mb-3 max-w-[70ch] text-graphite">
        Lecturers edit the course, its sections and its roster. Assistants see the sections they are assigned to and those
        students. People are added by the e-mail of their Bondmark account.
      </p>
      <Table label="Teaching team" testId="staff-table">
        <thead>
          <tr>
            <Th>Name</Th>
            <Th>E-mail</Th>
            <Th>Role</Th>
            <Th>
              <span className="sr-only">Actions</span>
            </Th>
          </tr>
        </thead>
        <tbody>
          {course.staff.map((s) => (
            <tr key={`${s.userId}:${s.role}`} data-testid="staff-row">
              <Td className="font-semibold">{s.displayName}</Td>
              <Td className="break-all">{s.email}</Td>
              <Td>
                <RoleBadge role={s.role} />
              </Td>
              <Td className="text-right">
                <Button
                  size="sm"
                  variant="quiet"
                  disabled={s.role === 'lecturer' && lecturers === 1}
                  title={s.role === 'lecturer' && lecturers === 1 ? 'A course needs at least one lecturer' : undefined}
                  onClick={() => setLeaving(s)}
                  aria-label={`Remove ${s.displayName} as ${s.role}`}
                >
                  Remove
                </Button>
              </Td>
            </tr>
          ))}
        </tbody>
      </Table>
      <form onSubmit={submit} className="mt-4 grid max-w-[44rem] gap-3 sm:grid-cols-[1fr_10rem_auto] sm:items-end" aria-label="Add to the teaching team">
        <TextField label="E-mail of the person" type="email" required value={email} onChange={(e) => setEmail(e.target.value)} autoComplete="off" />
        <SelectField label="Role" value={role} onChange={(e) => setRole(e.target.value as StaffRole)}>
          <option value="assistant">Assistant</option>
          <option value="lecturer">Lecturer</option>
        </SelectField>
        <Button type="submit" disabled={add.isPending}>
          Add to team
        </Button>
      </form>
      <div className="mt-2 max-w-[44rem]">
        <FormError error={add.error} />
      </div>
      <ConfirmDialog
        open={leaving !== null}
        title={`Remove ${leaving?.displayName ?? ''}?`}
        confirmLabel="Remove from team"
        busy={remove.isPending}
        error={remove.error}
        onCancel={() => {
          remove.reset();
          setLeaving(null);
        }}
        onConfirm={() => leaving && remove.mutate({ userId: leaving.userId, role: leaving.role }, { onSuccess: () => setLeaving(null) })}
      >
        {leaving?.role === 'assistant'
          ? 'They lose access to this course and are taken off every section they teach. Their past marking stays recorded.'
          : 'They can no longer edit this course. Everything they did stays recorded.'}
      </ConfirmDialog>
    </section>
  );
}

function ArchiveCourse() {
  const course = useCourseFromLayout();
  const setArchived = useSetCourseArchived(course.id);
  const [asking, setAsking] = useState(false);
  return (
    <section aria-labelledby="archive-title" className="mb-10 max-w-[70ch]">
      <SectionTitle>
        <span id="archive-title">{course.archived ? 'Restore the course' : 'Archive the course'}</span>
      </SectionTitle>
      {course.archived ? (
        <>
          <p className="mb-3 text-graphite">The course is archived: its sections and roster are frozen. Restoring makes them editable again.</p>
          <Button onClick={() => setArchived.mutate(false)} disabled={setArchived.isPending}>
            Restore course
          </Button>
          <FormError error={setArchived.error} />
        </>
      ) : (
        <>
          <p className="mb-3 text-graphite">
            Archiving freezes the sections and the roster at the end of term. Nothing is deleted, and the course can be
            restored.
          </p>
          <Button variant="danger" onClick={() => setAsking(true)}>
            Archive course
          </Button>
        </>
      )}
      <ConfirmDialog
        open={asking}
        title={`Archive ${course.code}?`}
        confirmLabel="Archive"
        busy={setArchived.isPending}
        error={setArchived.error}
        onCancel={() => {
          setArchived.reset();
          setAsking(false);
        }}
        onConfirm={() => setArchived.mutate(true, { onSuccess: () => setAsking(false) })}
      >
        Its <strong>{course.sectionCount}</strong> sections and the roster of <strong>{course.studentCount}</strong> students
        become read-only until the course is restored. Nothing is deleted.
      </ConfirmDialog>
    </section>
  );
}

/** /courses/:courseId/settings (lecturers, admins): code, title and term; the teaching team; archive/restore. */
export function CourseSettingsPage() {
  const course = useCourseFromLayout();
  const terms = useTerms();
  const update = useUpdateCourse(course.id);
  const [saved, setSaved] = useState(false);
  if (!course.permissions.editCourse) {
    return <ErrorNotice what="the settings" error={new Error('Only the lecturers of this course and admins can change it.')} />;
  }
  return (
    <>
      <section aria-labelledby="details-title" className="mb-10">
        <SectionTitle>
          <span id="details-title">Course details</span>
        </SectionTitle>
        {terms.data ? (
          <CourseForm
            initial={{ code: course.code, title: course.title, termId: course.term.id }}
            terms={terms.data}
            submitLabel="Save changes"
            busy={update.isPending}
            error={update.error}
            onSubmit={(values) => {
              setSaved(false);
              update.mutate(values, { onSuccess: () => setSaved(true) });
            }}
          />
        ) : terms.isError ? (
          <ErrorNotice what="the terms" error={terms.error} onRetry={() => void terms.refetch()} />
        ) : (
          <p role="status" className="text-graphite">
            Loading…
          </p>
        )}
        {saved ? (
          <p role="status" className="mt-2 text-bonding">
            Saved.
          </p>
        ) : null}
      </section>
      <TeachingTeam />
      <ArchiveCourse />
    </>
  );
}
