import { useId, useRef, useState, type DragEvent } from 'react';
import { Button } from '@client/components/ui/button';
import { formatBytes } from '../lib/series';

/**
 * A file slot: drop a file on it or choose one with the button (keyboard
 * users use the button; the input itself is labelled for assistive tools).
 */
export function DropZone({
  label,
  buttonLabel,
  accept,
  file,
  onFile,
  hint,
  disabled = false,
  testId,
}: {
  /** accessible name of the file input, e.g. "Data file" */
  label: string;
  buttonLabel: string;
  accept: string;
  file: File | null;
  onFile: (file: File | null) => void;
  hint?: string;
  disabled?: boolean;
  testId?: string;
}) {
  const id = useId();
  const input = useRef<HTMLInputElement>(null);
  const [over, setOver] = useState(false);

  const onDrop = (e: DragEvent<HTMLDivElement>) => {
    e.preventDefault();
    setOver(false);
    if (disabled) return;
    const dropped = e.dataTransfer.files?.[0];
    if (dropped) onFile(dropped);
  };

  return (
    <div
      className={`flex flex-col gap-2 rounded-[3px] border-2 border-dashed px-4 py-4 transition-colors ${over ? 'border-reference bg-wash' : 'border-rule-strong bg-sheet'} ${disabled ? 'opacity-60' : ''}`}
      onDragOver={(e) => {
        e.preventDefault();
        if (!disabled) setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={onDrop}
      data-testid={testId}
      data-dragging={over || undefined}
    >
      <label htmlFor={id} className="font-semibold text-ink">
        {label}
      </label>
      <input
        ref={input}
        id={id}
        type="file"
        accept={accept}
        className="sr-only"
        disabled={disabled}
        aria-describedby={hint ? `${id}-hint` : undefined}
        onChange={(e) => {
          onFile(e.target.files?.[0] ?? null);
          e.target.value = '';
        }}
      />
      <div className="flex flex-wrap items-center gap-3">
        <Button size="sm" onClick={() => input.current?.click()} disabled={disabled}>
          {buttonLabel}
        </Button>
        {file ? (
          <span className="text-[0.9rem]">
            <span className="font-medium">{file.name}</span> <span className="num text-graphite">({formatBytes(file.size)})</span>
            <Button variant="quiet" size="sm" className="ml-2" onClick={() => onFile(null)} disabled={disabled} aria-label={`Remove ${file.name}`}>
              Remove
            </Button>
          </span>
        ) : (
          <span className="text-graphite">or drop the file here</span>
        )}
      </div>
      {hint ? (
        <p id={`${id}-hint`} className="text-[0.8rem] text-graphite">
          {hint}
        </p>
      ) : null}
    </div>
  );
}
