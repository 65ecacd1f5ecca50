import { useEffect, useRef, type ReactNode } from 'react';
import { Button } from '@client/components/ui/button';

/**
 * A modal question before a consequential step (native <dialog>: focus stays
 * inside, Escape cancels, focus returns to the opener on close).
 */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  tone = 'primary',
  busy = false,
  onConfirm,
  onCancel,
}: {
  open: boolean;
  title: string;
  children: ReactNode;
  confirmLabel: string;
  tone?: 'primary' | 'danger';
  busy?: boolean;
  onConfirm: () => void;
  onCancel: () => void;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      aria-labelledby="confirm-dialog-title"
      onCancel={(e) => {
        e.preventDefault();
        if (!busy) onCancel();
      }}
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-[3px] border border-rule-strong bg-paper p-0 text-ink backdrop:bg-ink/40"
    >
      {open ? (
        <div className="grid gap-3 p-5">
          <h2 id="confirm-dialog-title" className="font-serif text-xl font-semibold">
            {title}
          </h2>
          <div className="text-ink">{children}</div>
          <div className="mt-2 flex justify-end gap-2">
            <Button onClick={onCancel} disabled={busy}>
              Cancel
            </Button>
            <Button variant={tone} onClick={onConfirm} disabled={busy} autoFocus>
              {busy ? 'Working…' : confirmLabel}
            </Button>
          </div>
        </div>
      ) : null}
    </dialog>
  );
}
