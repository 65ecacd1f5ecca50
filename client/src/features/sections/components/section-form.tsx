import { useState, type FormEvent } from 'react';
import { WEEKDAY_NAMES, type CreateSectionBody, type Section } from '@shared/api/sections';
import type { StaffMember } from '@shared/api/courses';
import { Button } from '@client/components/ui/button';
import { fieldError, FormError, SelectField, TextField } from '@client/features/courses/components/form-fields';

export type SectionFormValues = Required<CreateSectionBody>;

export const emptySection: SectionFormValues = { name: '', weekday: null, startsAt: null, endsAt: null, room: null, capacity: null, assistantIds: [] };

export function valuesOf(section: Section): SectionFormValues {
  return {
    name: section.name,
    weekday: section.weekday,
    startsAt: section.startsAt,
    endsAt: section.endsAt,
    room: section.room,
    capacity: section.capacity,
    assistantIds: section.assistants.map((a) => a.userId),
  };
}

/** Name, weekday, times, room, capacity and the course assistants who teach the section. */
export function SectionForm({
  initial,
  assistants,
  submitLabel,
  busy,
  error,
  onSubmit,
  onCancel,
  label,
}: {
  initial: SectionFormValues;
  assistants: StaffMember[];
  submitLabel: string;
  busy: boolean;
  error: unknown;
  onSubmit: (values: SectionFormValues) => void;
  onCancel: () => void;
  label: string;
}) {
  const [v, setV] = useState(initial);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    onSubmit({ ...v, room: v.room?.trim() ? v.room : null });
  };
  const toggle = (userId: number) =>
    setV({ ...v, assistantIds: v.assistantIds.includes(userId) ? v.assistantIds.filter((id) => id !== userId) : [...v.assistantIds, userId] });
  return (
    <form onSubmit={submit} aria-label={label} className="mb-6 grid gap-4 rounded-[3px] border border-rule bg-sheet p-4">
      <div className="grid gap-4 sm:grid-cols-[minmax(10rem,1fr)_11rem_8rem_8rem]">
        <TextField label="Section name" required maxLength={80} value={v.name} onChange={(e) => setV({ ...v, name: e.target.value })} error={fieldError(error, 'name')} placeholder="Lab A" />
        <SelectField label="Weekday" value={v.weekday ?? ''} onChange={(e) => setV({ ...v, weekday: e.target.value ? Number(e.target.value) : null })}>
          <option value="">Not fixed</option>
          {WEEKDAY_NAMES.map((name, i) => (
            <option key={name} value={i + 1}>
              {name}
            </option>
          ))}
        </SelectField>
        <TextField label="Starts at" type="time" value={v.startsAt ?? ''} onChange={(e) => setV({ ...v, startsAt: e.target.value || null })} error={fieldError(error, 'startsAt')} />
        <TextField label="Ends at" type="time" value={v.endsAt ?? ''} onChange={(e) => setV({ ...v, endsAt: e.target.value || null })} error={fieldError(error, 'endsAt')} />
      </div>
      <div className="grid gap-4 sm:grid-cols-[minmax(10rem,20rem)_8rem]">
        <TextField label="Room" maxLength={80} value={v.room ?? ''} onChange={(e) => setV({ ...v, room: e.target.value })} />
        <TextField
          label="Capacity"
          type="number"
          min={1}
          max={2000}
          inputMode="numeric"
          value={v.capacity ?? ''}
          onChange={(e) => setV({ ...v, capacity: e.target.value ? Number(e.target.value) : null })}
          error={fieldError(error, 'capacity')}
        />
      </div>
      <fieldset>
        <legend className="mb-1 text-sm font-semibold text-ink">Assistants</legend>
        {assistants.length === 0 ? (
          <p className="text-[0.9rem] text-graphite">The course has no assistants yet; add them to the teaching team under Settings.</p>
        ) : (
          <ul className="flex flex-wrap gap-x-5 gap-y-1">
            {assistants.map((a) => (
              <li key={a.userId}>
                <label className="inline-flex items-center gap-2">
                  <input type="checkbox" checked={v.assistantIds.includes(a.userId)} onChange={() => toggle(a.userId)} className="size-4 accent-[var(--color-reference)]" />
                  {a.displayName}
                </label>
              </li>
            ))}
          </ul>
        )}
      </fieldset>
      <FormError error={error} />
      <div className="flex gap-2">
        <Button type="submit" variant="primary" disabled={busy} aria-busy={busy || undefined}>
          {submitLabel}
        </Button>
        <Button onClick={onCancel} disabled={busy}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
