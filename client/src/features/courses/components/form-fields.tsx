import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes } from 'react';

/** Class names of a text input or select in our forms (3:1 border, visible focus from the base styles). */
export const inputClasses =
  'h-9 w-full rounded-[3px] border border-rule-strong bg-white px-2.5 text-ink placeholder:text-graphite disabled:bg-wash';

function Shell({ id, label, hint, error, children, className = '' }: { id: string; label: ReactNode; hint?: ReactNode; error?: string | null; children: ReactNode; className?: string }) {
  return (
    <div className={`flex min-w-0 flex-col ${className}`}>
      <label htmlFor={id} className="mb-1 text-sm font-semibold text-ink">
        {label}
      </label>
      {children}
      {hint ? (
        <p id={`${id}-hint`} className="mt-1 text-[0.8rem] text-graphite">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="mt-1 text-[0.85rem] text-antibonding">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/** A labelled input; the label is the accessible name. */
export function TextField({
  label,
  hint,
  error,
  className,
  ...input
}: InputHTMLAttributes<HTMLInputElement> & { label: ReactNode; hint?: ReactNode; error?: string | null }) {
  const id = useId();
  const described = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(' ') || undefined;
  return (
    <Shell id={id} label={label} hint={hint} error={error} className={className}>
      <input id={id} className={inputClasses} aria-invalid={error ? true : undefined} aria-describedby={described} {...input} />
    </Shell>
  );
}

/** A labelled select. */
export function SelectField({
  label,
  hint,
  error,
  className,
  children,
  ...select
}: SelectHTMLAttributes<HTMLSelectElement> & { label: ReactNode; hint?: ReactNode; error?: string | null }) {
  const id = useId();
  const described = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(' ') || undefined;
  return (
    <Shell id={id} label={label} hint={hint} error={error} className={className}>
      <select id={id} className={inputClasses} aria-invalid={error ? true : undefined} aria-describedby={described} {...select}>
        {children}
      </select>
    </Shell>
  );
}

/** A failed mutation, inline, announced. */
export function FormError({ error }: { error: unknown }) {
  if (!error) return null;
  const message = error instanceof Error ? error.message : 'Something went wrong.';
  return (
    <p role="alert" className="rounded-[3px] border border-antibonding/50 bg-sheet px-3 py-2 text-[0.9rem] text-antibonding" data-testid="form-error">
      {message}
    </p>
  );
}

/** The message of the first detail that names `path`, for showing beside that field. */
export function fieldError(error: unknown, path: string): string | null {
  const details = (error as { details?: unknown } | null)?.details;
  if (!Array.isArray(details)) return null;
  const hit = details.find((d) => (d as { path?: string }).path === path) as { message?: string } | undefined;
  return hit?.message ?? null;
}
