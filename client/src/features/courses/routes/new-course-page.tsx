import { useState, type FormEvent } from 'react';
import { Link, useNavigate } from 'react-router';
import { Button } from '@client/components/ui/button';
import { ErrorNotice } from '@client/components/ui/error-notice';
import { PageHeader } from '@client/components/ui/page-header';
import { useCurrentUser } from '@client/features/session/api/get-me';
import { useCreateCourse } from '../api/course-mutations';
import { useCreateTerm, useTerms } from '../api/get-terms';
import { CourseForm } from '../components/course-form';
import { FormError, TextField } from '../components/form-fields';

/** Admins add a term when the one they need is not there yet. */
function NewTermForm({ onCreated }: { onCreated: (id: number) => void }) {
  const create = useCreateTerm();
  const [values, setValues] = useState({ name: '', startsOn: '', endsOn: '' });
  const submit = (event: FormEvent) => {
    event.preventDefault();
    create.mutate(values, { onSuccess: (term) => onCreated(term.id) });
  };
  return (
    <form onSubmit={submit} className="mt-2 grid gap-3 rounded-[3px] border border-rule bg-sheet p-4 sm:grid-cols-[1fr_11rem_11rem_auto] sm:items-end" aria-label="New term">
      <TextField label="Term name" required value={values.name} onChange={(e) => setValues({ ...values, name: e.target.value })} placeholder="Spring 2027" />
      <TextField label="Starts on" type="date" required value={values.startsOn} onChange={(e) => setValues({ ...values, startsOn: e.target.value })} />
      <TextField label="Ends on" type="date" required value={values.endsOn} onChange={(e) => setValues({ ...values, endsOn: e.target.value })} />
      <Button type="submit" disabled={create.isPending}>
        Add term
      </Button>
      <div className="sm:col-span-4">
        <FormError error={create.error} />
      </div>
    </form>
  );
}

/** /courses/new: lecturers and admins create a course; the creator becomes its lecturer. */
export function NewCoursePage() {
  const me = useCurrentUser();
  const terms = useTerms();
  const create = useCreateCourse();
  const navigate = useNavigate();
  const [lecturerEmails, setLecturerEmails] = useState('');
  const [termFormOpen, setTermFormOpen] = useState(false);
  const [formKey, setFormKey] = useState(0);
  const [pickedTerm, setPickedTerm] = useState<number | null>(null);

  return (
    <>
      <title>New course · Bondmark</title>
      <PageHeader
        title="New course"
        description={me.isAdmin ? 'Create a course for a term and name its lecturers (or become its lecturer yourself).' : 'Create a course for a term. You become its lecturer; add assistants afterwards.'}
        actions={
          <Link to="/courses" className="text-sm">
            Back to courses
          </Link>
        }
      />
      {terms.isError ? (
        <ErrorNotice what="the terms" error={terms.error} onRetry={() => void terms.refetch()} />
      ) : !terms.data ? (
        <p role="status" className="text-graphite">
          Loading terms…
        </p>
      ) : (
        <>
          <CourseForm
            key={formKey}
            initial={{ code: '', title: '', termId: pickedTerm ?? terms.data[0]?.id ?? null }}
            terms={terms.data}
            submitLabel="Create course"
            busy={create.isPending}
            error={create.error}
            onSubmit={(values) =>
              create.mutate(
                {
                  ...values,
                  lecturerEmails: me.isAdmin
                    ? lecturerEmails
                        .split(/[\s,;]+/)
                        .map((s) => s.trim())
                        .filter(Boolean)
                    : undefined,
                },
                { onSuccess: (course) => navigate(`/courses/${course.id}/sections`) },
              )
            }
            extra={
              me.isAdmin ? (
                <TextField
                  label="Lecturers (e-mail addresses)"
                  hint="Separate addresses with commas. Leave empty to become the lecturer yourself."
                  value={lecturerEmails}
                  onChange={(e) => setLecturerEmails(e.target.value)}
                  className="max-w-[36rem]"
                />
              ) : null
            }
          />
          {me.isAdmin ? (
            <div className="mt-6 max-w-[48rem]">
              <Button size="sm" variant="quiet" aria-expanded={termFormOpen} onClick={() => setTermFormOpen((v) => !v)}>
                {termFormOpen ? 'Close the term form' : 'The term is not listed? Add a term'}
              </Button>
              {termFormOpen ? (
                <NewTermForm
                  onCreated={(id) => {
                    setPickedTerm(id);
                    setFormKey((k) => k + 1);
                    setTermFormOpen(false);
                  }}
                />
              ) : null}
            </div>
          ) : null}
        </>
      )}
    </>
  );
}
