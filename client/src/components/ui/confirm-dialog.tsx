import { useEffect, useId, useRef, type ReactNode } from 'react';
import { FormError } from '@client/features/courses/components/form-fields';
import { Button } from './button';

/**
 * A modal question before a destructive or far-reaching step (native
 * <dialog>: focus stays inside, Escape cancels, focus returns to the opener on
 * close). The dialog is named by its title. By default the safe choice
 * (Cancel) has the focus; `focus="confirm"` gives it to the action instead.
 * `busyLabel`, when given, replaces the action's label while `busy`.
 */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  onConfirm,
  onCancel,
  busy = false,
  busyLabel,
  error,
  tone = 'danger',
  focus = 'cancel',
}: {
  open: boolean;
  title: string;
  children: ReactNode;
  confirmLabel: string;
  onConfirm: () => void;
  onCancel: () => void;
  busy?: boolean;
  busyLabel?: string;
  error?: unknown;
  tone?: 'danger' | 'primary';
  focus?: 'cancel' | 'confirm';
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
            <Button onClick={onCancel} disabled={busy} autoFocus={focus === 'cancel'}>
              Cancel
            </Button>
            <Button variant={tone} onClick={onConfirm} disabled={busy} aria-busy={busy || undefined} autoFocus={focus === 'confirm'}>
              {busy && busyLabel ? busyLabel : confirmLabel}
            </Button>
          </div>
        </div>
      ) : null}
    </dialog>
  );
}
