import { useState, type FormEvent } from 'react';
import type { Term } from '@shared/api/courses';
import { Button } from '@client/components/ui/button';
import { fieldError, FormError, SelectField, TextField } from './form-fields';

export interface CourseFormValues {
  code: string;
  title: string;
  termId: number | null;
}

/** Code, title and term of a course: the create and the edit form share it. */
export function CourseForm({
  initial,
  terms,
  submitLabel,
  busy,
  error,
  onSubmit,
  extra,
}: {
  initial: CourseFormValues;
  terms: Term[];
  submitLabel: string;
  busy: boolean;
  error: unknown;
  onSubmit: (values: { code: string; title: string; termId: number }) => void;
  extra?: React.ReactNode;
}) {
  const [values, setValues] = useState(initial);
  const [missingTerm, setMissingTerm] = useState(false);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (values.termId === null) {
      setMissingTerm(true);
      return;
    }
    onSubmit({ code: values.code, title: values.title, termId: values.termId });
  };
  return (
    <form onSubmit={submit} className="grid max-w-[48rem] gap-4" noValidate={false}>
      <div className="grid gap-4 sm:grid-cols-[12rem_1fr]">
        <TextField
          label="Course code"
          name="code"
          required
          maxLength={32}
          value={values.code}
          onChange={(e) => setValues({ ...values, code: e.target.value })}
          placeholder="CHEM 2140"
          autoComplete="off"
          error={fieldError(error, 'code')}
        />
        <TextField
          label="Title"
          name="title"
          required
          maxLength={200}
          value={values.title}
          onChange={(e) => setValues({ ...values, title: e.target.value })}
          error={fieldError(error, 'title')}
        />
      </div>
      <SelectField
        label="Term"
        name="termId"
        required
        className="max-w-[24rem]"
        value={values.termId ?? ''}
        onChange={(e) => {
          setMissingTerm(false);
          setValues({ ...values, termId: e.target.value ? Number(e.target.value) : null });
        }}
        error={missingTerm ? 'Choose the term the course runs in.' : fieldError(error, 'termId')}
      >
        <option value="">Choose a term…</option>
        {terms.map((t) => (
          <option key={t.id} value={t.id}>
            {t.name} ({t.startsOn} – {t.endsOn})
          </option>
        ))}
      </SelectField>
      {extra}
      <FormError error={error} />
      <div>
        <Button type="submit" variant="primary" disabled={busy} aria-busy={busy || undefined}>
          {submitLabel}
        </Button>
      </div>
    </form>
  );
}
