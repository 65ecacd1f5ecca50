import { useEffect, useId, useState, type ReactNode } from 'react';

const inputClass =
  'h-9 w-full rounded-[3px] border border-rule-strong bg-white px-2 text-ink aria-[invalid=true]:border-antibonding disabled:bg-wash disabled:text-graphite';

export function FieldShell({ label, htmlFor, hint, error, errorId, hintId, children, className = '' }: { label: ReactNode; htmlFor: string; hint?: ReactNode; error?: string | null; errorId?: string; hintId?: string; children: ReactNode; className?: string }) {
  return (
    <div className={`flex min-w-0 flex-col gap-1 ${className}`}>
      <label htmlFor={htmlFor} className="text-[0.85rem] font-semibold text-ink">
        {label}
      </label>
      {children}
      {hint ? (
        <p id={hintId} className="text-[0.78rem] text-graphite">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={errorId} className="text-[0.8rem] text-antibonding" role="alert">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/**
 * Text kept locally while the person types, committed upwards (to the URL)
 * whenever it is acceptable, and re-synchronized when the committed value
 * changes from outside (back button, a shared link).
 */
export function useCommittedText<T>(value: T, format: (v: T) => string, equal: (text: string, value: T) => boolean) {
  const [text, setText] = useState(() => format(value));
  useEffect(() => {
    setText((current) => (equal(current, value) ? current : format(value)));
    // format/equal are stable per field
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [value]);
  return [text, setText] as const;
}

export interface NumberFieldProps {
  label: ReactNode;
  value: number;
  onCommit: (value: number) => void;
  min: number;
  max: number;
  step?: number;
  integer?: boolean;
  unit?: string;
  hint?: ReactNode;
  disabled?: boolean;
  className?: string;
  testId?: string;
  /** a further check on an in-range number; returns the message to show, or null */
  validate?: (value: number) => string | null;
}

/** A number input that only passes on numbers inside [min, max] and says why otherwise. */
export function NumberField({ label, value, onCommit, min, max, step = 0.1, integer = false, unit, hint, disabled, className, testId, validate }: NumberFieldProps) {
  const id = useId();
  const [text, setText] = useCommittedText(value, (v) => String(v), (t, v) => Number(t) === v && t.trim() !== '');
  const parsed = text.trim() === '' ? NaN : Number(text);
  const inRange = Number.isFinite(parsed) && parsed >= min && parsed <= max && (!integer || Number.isInteger(parsed));
  const extra = inRange && validate ? validate(parsed) : null;
  const error = disabled ? null : !inRange ? `Give ${integer ? 'a whole number' : 'a number'} from ${min} to ${max}.` : extra;
  return (
    <FieldShell label={label} htmlFor={id} hint={hint} hintId={`${id}-hint`} error={error} errorId={`${id}-error`} className={className}>
      <div className="flex items-center gap-1.5">
        <input
          id={id}
          type="number"
          inputMode="decimal"
          className={`${inputClass} num`}
          value={text}
          min={min}
          max={max}
          step={integer ? 1 : step}
          disabled={disabled}
          aria-invalid={error ? true : undefined}
          aria-describedby={[hint ? `${id}-hint` : '', error ? `${id}-error` : ''].filter(Boolean).join(' ') || undefined}
          data-testid={testId}
          onChange={(e) => {
            setText(e.target.value);
            const v = Number(e.target.value);
            if (e.target.value.trim() !== '' && Number.isFinite(v) && v >= min && v <= max && (!integer || Number.isInteger(v)) && !(validate && validate(v))) onCommit(v);
          }}
        />
        {unit ? <span className="shrink-0 text-[0.85rem] text-graphite">{unit}</span> : null}
      </div>
    </FieldShell>
  );
}

export function SelectField<T extends string>({ label, value, options, onChange, hint, className, testId }: { label: ReactNode; value: T; options: readonly { value: T; label: string }[]; onChange: (value: T) => void; hint?: ReactNode; className?: string; testId?: string }) {
  const id = useId();
  return (
    <FieldShell label={label} htmlFor={id} hint={hint} hintId={`${id}-hint`} className={className}>
      <select id={id} className={inputClass} value={value} onChange={(e) => onChange(e.target.value as T)} data-testid={testId} aria-describedby={hint ? `${id}-hint` : undefined}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </FieldShell>
  );
}

export function CheckboxField({ label, checked, onChange, className = '', testId }: { label: ReactNode; checked: boolean; onChange: (checked: boolean) => void; className?: string; testId?: string }) {
  const id = useId();
  return (
    <div className={`flex items-center gap-2 ${className}`}>
      <input id={id} type="checkbox" className="h-4 w-4 accent-[var(--color-reference)]" checked={checked} onChange={(e) => onChange(e.target.checked)} data-testid={testId} />
      <label htmlFor={id} className="text-[0.9rem] text-ink">
        {label}
      </label>
    </div>
  );
}

export { inputClass };
