import { useId, useRef, useState, type DragEvent, type ReactNode } from 'react';
import { Upload } from 'lucide-react';
import { cn } from '../../lib/cn';

/**
 * A place to drop a file, which is also a button opening the file picker (keyboard and
 * screen readers use the picker). Calls `onFile` with the first file chosen.
 */
export function FileDrop({
  accept,
  onFile,
  disabled,
  title,
  children,
}: {
  /** `accept` of the file input, e.g. `.csv,text/csv`. */
  accept: string;
  onFile: (file: File) => void;
  disabled?: boolean;
  title: ReactNode;
  /** What may be dropped, in a sentence. */
  children?: ReactNode;
}) {
  const inputId = useId();
  const input = useRef<HTMLInputElement>(null);
  const [over, setOver] = useState(false);

  function handleDrop(event: DragEvent<HTMLLabelElement>) {
    event.preventDefault();
    setOver(false);
    if (disabled) return;
    const file = event.dataTransfer.files[0];
    if (file) onFile(file);
  }

  return (
    <label
      htmlFor={inputId}
      onDragOver={(event) => {
        event.preventDefault();
        if (!disabled) setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={handleDrop}
      className={cn(
        'flex cursor-pointer flex-col items-center gap-2 rounded-lg border-2 border-dashed px-6 py-8 text-center transition-colors',
        over ? 'border-accent-500 bg-accent-50' : 'border-ink-300 bg-white hover:border-ink-400',
        disabled && 'cursor-not-allowed opacity-60',
      )}
    >
      <Upload aria-hidden="true" className="size-7 text-accent-600" />
      <span className="font-semibold text-ink-900">{title}</span>
      {children && <span className="max-w-md text-sm text-ink-600">{children}</span>}
      <input
        ref={input}
        id={inputId}
        type="file"
        accept={accept}
        disabled={disabled}
        className="sr-only"
        onChange={(event) => {
          const file = event.target.files?.[0];
          if (file) onFile(file);
          // The same file chosen again (after fixing it) must fire again.
          event.target.value = '';
        }}
      />
    </label>
  );
}
