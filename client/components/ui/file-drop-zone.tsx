import { useRef, useState, type DragEvent, type ReactNode } from 'react';
import { Button } from './button';

interface FileDropZoneProps {
  /** What the hidden file input is called for assistive technology (and tests). */
  inputLabel: string;
  /** The `accept` attribute of the file picker, e.g. ".csv,text/csv". */
  accept: string;
  multiple?: boolean;
  disabled?: boolean;
  title: string;
  hint?: ReactNode;
  buttonLabel: string;
  onFiles: (files: File[]) => void;
  compact?: boolean;
}

/**
 * A dashed area that takes files dropped on it, with a button that opens the file picker for
 * keyboard and touch users. It only hands the files over; the caller checks and uploads them.
 */
export function FileDropZone({ inputLabel, accept, multiple = false, disabled = false, title, hint, buttonLabel, onFiles, compact = false }: FileDropZoneProps) {
  const input = useRef<HTMLInputElement>(null);
  const [dragDepth, setDragDepth] = useState(0);
  const over = dragDepth > 0 && !disabled;

  const hasFiles = (event: DragEvent) => Array.from(event.dataTransfer.types).includes('Files');
  const onDragEnter = (event: DragEvent) => {
    if (!hasFiles(event)) return;
    event.preventDefault();
    setDragDepth((d) => d + 1);
  };
  const onDragOver = (event: DragEvent) => {
    if (!hasFiles(event)) return;
    event.preventDefault();
    event.dataTransfer.dropEffect = disabled ? 'none' : 'copy';
  };
  const onDrop = (event: DragEvent) => {
    event.preventDefault();
    setDragDepth(0);
    if (disabled) return;
    const files = Array.from(event.dataTransfer.files);
    if (files.length) onFiles(multiple ? files : files.slice(0, 1));
  };

  return (
    <div
      onDragEnter={onDragEnter}
      onDragOver={onDragOver}
      onDragLeave={() => setDragDepth((d) => Math.max(0, d - 1))}
      onDrop={onDrop}
      data-drop-target={over || undefined}
      className={`flex flex-wrap items-center gap-x-6 gap-y-3 rounded-lg border-2 border-dashed transition-colors ${compact ? 'px-4 py-3' : 'px-6 py-7'} ${
        over ? 'border-ink bg-paper-sunk' : 'border-rule-strong bg-paper-raised/60'
      } ${disabled ? 'opacity-60' : ''}`}
    >
      <div className="min-w-0 flex-1">
        <p className="font-semibold text-ink">{over ? 'Let go to add' : title}</p>
        {hint && <div className="mt-0.5 text-[0.875rem] text-ink-soft">{hint}</div>}
      </div>
      <Button size={compact ? 'sm' : 'md'} disabled={disabled} onClick={() => input.current?.click()}>
        {buttonLabel}
      </Button>
      <input
        ref={input}
        type="file"
        aria-label={inputLabel}
        accept={accept}
        multiple={multiple}
        disabled={disabled}
        tabIndex={-1}
        className="sr-only"
        onChange={(event) => {
          const files = Array.from(event.target.files ?? []);
          // Cleared so that choosing the same file again (after fixing it) is seen as a change.
          event.target.value = '';
          if (files.length) onFiles(files);
        }}
      />
    </div>
  );
}
