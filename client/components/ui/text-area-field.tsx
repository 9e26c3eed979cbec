import { useId, type ReactNode, type Ref, type TextareaHTMLAttributes } from 'react';

interface TextAreaFieldProps extends Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> {
  label: string;
  hint?: ReactNode;
  error?: string;
  ref?: Ref<HTMLTextAreaElement>;
}

/** A labelled multi-line field in the look of TextField, for reasons, comments and assumptions. */
export function TextAreaField({ label, hint, error, className = '', rows = 3, ...textarea }: TextAreaFieldProps) {
  const id = useId();
  const describedBy = error ? `${id}-error` : hint ? `${id}-hint` : undefined;
  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={id} className="text-sm font-semibold text-ink">
        {label}
      </label>
      <textarea
        id={id}
        rows={rows}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`block w-full rounded-md border bg-paper-raised px-3 py-2 text-[0.9375rem] leading-relaxed text-ink placeholder:text-ink-faint focus:border-ink focus:ring-2 focus:ring-ink/15 focus:outline-none disabled:bg-paper-sunk ${
          error ? 'border-rust' : 'border-rule-strong'
        } ${className}`}
        {...textarea}
      />
      {hint && !error && (
        <p id={`${id}-hint`} className="text-[0.8125rem] text-ink-faint">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="text-[0.8125rem] font-medium text-rust">
          {error}
        </p>
      )}
    </div>
  );
}
