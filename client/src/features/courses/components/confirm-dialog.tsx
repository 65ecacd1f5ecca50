import { useEffect, useId, useRef, type ReactNode } from 'react';
import { Button } from '@client/components/ui/button';
import { FormError } from './form-fields';

/**
 * A modal question before a destructive or far-reaching action (native
 * <dialog>: focus is trapped, Escape cancels). The safe choice has the focus.
 */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  onConfirm,
  onCancel,
  busy = false,
  error,
  tone = 'danger',
}: {
  open: boolean;
  title: string;
  children: ReactNode;
  confirmLabel: string;
  onConfirm: () => void;
  onCancel: () => void;
  busy?: boolean;
  error?: unknown;
  tone?: 'danger' | 'primary';
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      onCancel={(event) => {
        event.preventDefault();
        if (!busy) onCancel();
      }}
      className="m-auto w-[32rem] max-w-[calc(100vw-2rem)] rounded-[3px] border border-rule-strong bg-sheet p-0 text-ink backdrop:bg-ink/40"
    >
      {open ? (
        <div className="p-5">
          <h2 id={titleId} className="font-serif text-xl font-semibold">
            {title}
          </h2>
          <div className="mt-2 text-ink">{children}</div>
          {error ? (
            <div className="mt-3">
              <FormError error={error} />
            </div>
          ) : null}
          <div className="mt-5 flex justify-end gap-2">
            <Button onClick={onCancel} disabled={busy} autoFocus>
              Cancel
            </Button>
            <Button variant={tone} onClick={onConfirm} disabled={busy} aria-busy={busy || undefined}>
              {confirmLabel}
            </Button>
          </div>
        </div>
      ) : null}
    </dialog>
  );
}
