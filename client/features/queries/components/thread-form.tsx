import { useId, useState } from 'react';
import { Button } from '../../../components/ui/button';

interface ThreadFormProps {
  label: string;
  submitLabel: string;
  busyLabel: string;
  busy: boolean;
  /** Minimum length of the text; 0 makes it optional. */
  minLength?: number;
  requiredMessage?: string;
  tone?: 'secondary' | 'danger' | 'primary';
  placeholder?: string;
  onSubmit: (text: string) => void;
  onCancel: () => void;
}

/** A short text and its button, used for every message on a thread. The text stays when the server
 * refuses, so nothing typed is lost. */
export function ThreadForm({ label, submitLabel, busyLabel, busy, minLength = 1, requiredMessage, tone = 'secondary', placeholder, onSubmit, onCancel }: ThreadFormProps) {
  const id = useId();
  const [text, setText] = useState('');
  const [tried, setTried] = useState(false);
  const error = tried && text.trim().length < minLength ? (requiredMessage ?? 'Write a few words first.') : undefined;
  return (
    <form
      noValidate
      className="flex flex-col gap-2"
      onSubmit={(event) => {
        event.preventDefault();
        setTried(true);
        if (text.trim().length < minLength) return;
        onSubmit(text.trim());
      }}
    >
      <label htmlFor={id} className="text-sm font-semibold text-ink">
        {label}
      </label>
      <textarea
        id={id}
        rows={3}
        maxLength={4000}
        value={text}
        placeholder={placeholder}
        onChange={(e) => setText(e.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className={`block w-full rounded-md border bg-paper-raised px-3 py-2 text-[0.9375rem] leading-relaxed placeholder:text-ink-faint focus:border-ink focus:ring-2 focus:ring-ink/15 focus:outline-none ${error ? 'border-rust' : 'border-rule-strong'}`}
      />
      {error && (
        <p id={`${id}-error`} className="text-[0.8125rem] font-medium text-rust">
          {error}
        </p>
      )}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" size="sm" variant={tone} busy={busy} busyLabel={busyLabel}>
          {submitLabel}
        </Button>
        <Button size="sm" variant="quiet" className="text-sm" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
