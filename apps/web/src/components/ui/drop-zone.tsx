import { type DragEvent, type ReactNode, useId, useState } from 'react';
import { cx } from '../../lib/cx';
import { Spinner } from './spinner';

export interface DropZoneProps {
  label: string;
  hint?: ReactNode;
  /** file picker filter, e.g. ".csv,.txt" */
  accept?: string;
  multiple?: boolean;
  disabled?: boolean;
  busy?: boolean;
  onFiles: (files: File[]) => void;
  testId?: string;
  /** the file input's name, for forms and tests */
  name?: string;
}

/** Drop files on it or click it to pick them; a real file input stays inside for keyboards and tests. */
export function DropZone({ label, hint, accept, multiple = false, disabled = false, busy = false, onFiles, testId, name }: DropZoneProps) {
  const inputId = useId();
  const [over, setOver] = useState(false);

  const take = (list: FileList | null) => {
    const files = list ? [...list] : [];
    if (files.length > 0 && !disabled) onFiles(multiple ? files : files.slice(0, 1));
  };
  const onDragOver = (event: DragEvent) => {
    event.preventDefault();
    if (!disabled) setOver(true);
  };
  const onDrop = (event: DragEvent) => {
    event.preventDefault();
    setOver(false);
    take(event.dataTransfer.files);
  };

  return (
    <div
      data-testid={testId}
      data-disabled={disabled || undefined}
      onDragOver={onDragOver}
      onDragEnter={onDragOver}
      onDragLeave={() => setOver(false)}
      onDrop={onDrop}
      className={cx(
        'relative rounded-lg border-2 border-dashed px-4 py-4 text-center text-sm transition-colors focus-within:outline-2 focus-within:outline-focus',
        over ? 'border-accent bg-accent-soft' : 'border-line bg-sunk/50',
        disabled ? 'opacity-60' : 'hover:border-accent/60',
      )}
    >
      <label htmlFor={inputId} className={cx('block', disabled ? 'cursor-not-allowed' : 'cursor-pointer')}>
        <span className="inline-flex items-center gap-2 font-semibold text-accent">
          {busy && <Spinner />}
          {label}
        </span>
        {hint && <span className="mt-1 block text-xs text-ink-muted">{hint}</span>}
      </label>
      <input
        id={inputId}
        type="file"
        name={name}
        accept={accept}
        multiple={multiple}
        disabled={disabled}
        className="sr-only"
        onChange={(event) => {
          take(event.target.files);
          event.target.value = '';
        }}
      />
    </div>
  );
}
