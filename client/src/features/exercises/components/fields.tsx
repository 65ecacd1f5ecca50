/**
 * Form controls of the exercise editor. Each control is named by its field
 * path (the same path the zod schema and the server report), shows its
 * message beside it, and is linked to it with aria-describedby.
 */
import { useEffect, useState, type ReactNode } from 'react';
import { fieldId, issueAt, type IssueMap } from '../lib/form-issues';

export const inputClasses =
  'h-9 w-full rounded-[3px] border border-rule-strong bg-white px-2.5 text-ink placeholder:text-graphite aria-[invalid=true]:border-antibonding';

interface Common {
  path: string;
  label: ReactNode;
  issues: IssueMap;
  hint?: ReactNode;
  /** also show messages of child paths here (lists) */
  deep?: boolean;
  className?: string;
}

export function FieldShell({ path, label, issues, hint, deep, className = '', children }: Common & { children: (a11y: { id: string; 'aria-invalid': boolean; 'aria-describedby'?: string }) => ReactNode }) {
  const id = fieldId(path);
  const error = issueAt(issues, path, deep);
  const describedBy = [error ? `${id}-error` : null, hint ? `${id}-hint` : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className={`flex min-w-0 flex-col ${className}`} data-field={path}>
      <label htmlFor={id} className="mb-1 text-sm font-semibold text-ink">
        {label}
      </label>
      {children({ id, 'aria-invalid': Boolean(error), 'aria-describedby': describedBy })}
      {hint ? (
        <p id={`${id}-hint`} className="mt-0.5 text-[0.8rem] text-graphite">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="mt-0.5 text-[0.85rem] font-semibold text-antibonding" data-testid="field-error">
          {error}
        </p>
      ) : null}
    </div>
  );
}

export function TextField({ value, onChange, placeholder, ...common }: Common & { value: string; onChange: (v: string) => void; placeholder?: string }) {
  return (
    <FieldShell {...common}>
      {(a11y) => <input {...a11y} type="text" value={value} placeholder={placeholder} onChange={(e) => onChange(e.target.value)} className={inputClasses} autoComplete="off" />}
    </FieldShell>
  );
}

const numberText = (v: number | undefined) => (v === undefined || Number.isNaN(v) ? '' : String(v));
const parseNumber = (t: string) => (t.trim() === '' ? Number.NaN : Number(t.trim().replace(',', '.')));

/** A number typed as text (so "1." and "-" can be on the way to a number); NaN while empty or unreadable. */
export function NumberField({ value, onChange, unit, ...common }: Common & { value: number | undefined; onChange: (v: number) => void; unit?: string }) {
  const [text, setText] = useState(numberText(value));
  useEffect(() => {
    const current = parseNumber(text);
    const same = Object.is(current, value) || (Number.isNaN(current) && (value === undefined || Number.isNaN(value)));
    // only a change of the value from outside resets the text
    if (!same) setText(numberText(value));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [value]);
  return (
    <FieldShell {...common}>
      {(a11y) => (
        <div className="flex items-center gap-1.5">
          <input
            {...a11y}
            type="text"
            inputMode="decimal"
            value={text}
            onChange={(e) => {
              setText(e.target.value);
              onChange(parseNumber(e.target.value));
            }}
            className={`${inputClasses} num`}
            autoComplete="off"
          />
          {unit ? <span className="text-sm whitespace-nowrap text-graphite">{unit}</span> : null}
        </div>
      )}
    </FieldShell>
  );
}

/** Numbers separated by commas or spaces: "1, 1.1, 1.2". */
export function NumberListField({ value, onChange, ...common }: Common & { value: number[]; onChange: (v: number[]) => void }) {
  const [text, setText] = useState(value.join(', '));
  useEffect(() => {
    const parsed = text.split(/[\s,;]+/).filter(Boolean).map(Number);
    if (parsed.length !== value.length || parsed.some((p, i) => !Object.is(p, value[i]))) setText(value.join(', '));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [value]);
  return (
    <FieldShell {...common} deep>
      {(a11y) => (
        <input
          {...a11y}
          type="text"
          value={text}
          onChange={(e) => {
            setText(e.target.value);
            onChange(e.target.value.split(/[\s,;]+/).filter(Boolean).map(Number));
          }}
          className={`${inputClasses} num`}
          autoComplete="off"
        />
      )}
    </FieldShell>
  );
}

export function SelectField<T extends string>({
  value,
  onChange,
  options,
  ...common
}: Common & { value: T; onChange: (v: T) => void; options: readonly (readonly [T, string])[] }) {
  return (
    <FieldShell {...common}>
      {(a11y) => (
        <select {...a11y} value={value} onChange={(e) => onChange(e.target.value as T)} className={inputClasses}>
          {options.map(([v, label]) => (
            <option key={v} value={v}>
              {label}
            </option>
          ))}
        </select>
      )}
    </FieldShell>
  );
}

export function Fieldset({ legend, children, description }: { legend: string; children: ReactNode; description?: ReactNode }) {
  return (
    <fieldset className="min-w-0 rounded-[3px] border border-rule bg-sheet px-4 pt-2 pb-4">
      <legend className="px-1 font-serif text-lg font-semibold text-ink">{legend}</legend>
      {description ? <p className="mb-3 text-sm text-graphite">{description}</p> : null}
      {children}
    </fieldset>
  );
}
