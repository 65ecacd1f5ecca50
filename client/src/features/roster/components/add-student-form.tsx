import { useState, type FormEvent } from 'react';
import type { Section } from '@shared/api/sections';
import { Button } from '@client/components/ui/button';
import { fieldError, FormError, SelectField, TextField } from '@client/features/courses/components/form-fields';
import { useAddStudent } from '../api/get-roster';

const blank = { studentNumber: '', familyName: '', givenName: '', email: '', sectionId: '' };

/** One student by hand (late registrations); the import is the usual way. */
export function AddStudentForm({ courseId, sections, onDone }: { courseId: number; sections: Section[]; onDone: () => void }) {
  const add = useAddStudent(courseId);
  const [v, setV] = useState(blank);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    add.mutate(
      { studentNumber: v.studentNumber, familyName: v.familyName, givenName: v.givenName, email: v.email, sectionId: v.sectionId ? Number(v.sectionId) : null },
      {
        onSuccess: () => {
          setV(blank);
          onDone();
        },
      },
    );
  };
  return (
    <form onSubmit={submit} aria-label="Add a student" className="mb-5 grid gap-4 rounded-[3px] border border-rule bg-sheet p-4">
      <div className="grid gap-4 sm:grid-cols-[10rem_1fr_1fr]">
        <TextField label="Student number" required value={v.studentNumber} onChange={(e) => setV({ ...v, studentNumber: e.target.value })} error={fieldError(add.error, 'studentNumber')} autoComplete="off" />
        <TextField label="Family name" required value={v.familyName} onChange={(e) => setV({ ...v, familyName: e.target.value })} error={fieldError(add.error, 'familyName')} autoComplete="off" />
        <TextField label="Given name" required value={v.givenName} onChange={(e) => setV({ ...v, givenName: e.target.value })} error={fieldError(add.error, 'givenName')} autoComplete="off" />
      </div>
      <div className="grid gap-4 sm:grid-cols-[1fr_14rem]">
        <TextField label="E-mail" type="email" required value={v.email} onChange={(e) => setV({ ...v, email: e.target.value })} error={fieldError(add.error, 'email')} autoComplete="off" />
        <SelectField label="Section" value={v.sectionId} onChange={(e) => setV({ ...v, sectionId: e.target.value })}>
          <option value="">None yet</option>
          {sections
            .filter((s) => !s.archived)
            .map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
        </SelectField>
      </div>
      <FormError error={add.error} />
      <div className="flex gap-2">
        <Button type="submit" variant="primary" disabled={add.isPending}>
          Add student
        </Button>
        <Button
          onClick={() => {
            add.reset();
            onDone();
          }}
        >
          Cancel
        </Button>
      </div>
    </form>
  );
}
