import { useId, type TextareaHTMLAttributes } from 'react';

interface TextAreaFieldProps extends Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> {
  label: string;
  hint?: string;
  error?: string;
}

/** A labelled text area in the look of the shared fields, for the longer texts of the grid. */
export function TextAreaField({ label, hint, error, className = '', rows = 3, ...textarea }: TextAreaFieldProps) {
  const id = useId();
  const note = error ?? hint;
  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={id} className="text-sm font-semibold text-ink">
        {label}
      </label>
      <textarea
        id={id}
        rows={rows}
        aria-invalid={error ? true : undefined}
        aria-describedby={note ? `${id}-note` : undefined}
        className={`block w-full rounded-md border bg-paper-raised px-3 py-2 text-[0.9375rem] leading-relaxed text-ink placeholder:text-ink-faint focus:border-ink focus:ring-2 focus:ring-ink/15 focus:outline-none disabled:bg-paper-sunk ${
          error ? 'border-rust' : 'border-rule-strong'
        } ${className}`}
        {...textarea}
      />
      {note && (
        <p id={`${id}-note`} className={`text-[0.8125rem] ${error ? 'font-medium text-rust' : 'text-ink-faint'}`}>
          {note}
        </p>
      )}
    </div>
  );
}
