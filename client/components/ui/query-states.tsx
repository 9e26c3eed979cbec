import type { ReactNode } from 'react';
import { describeError } from '../../lib/api-error';
import { Button } from './button';
import { LoadingBar } from './loading';

/** Shown while a list or record loads. */
export function LoadingPanel({ label }: { label: string }) {
  return (
    <div role="status" aria-live="polite" className="flex flex-col items-center gap-3 rounded-lg border border-dashed border-rule-strong px-6 py-12">
      <LoadingBar className="max-w-40" />
      <span className="text-sm text-ink-faint">{label}</span>
    </div>
  );
}

/** Shown when a list or record could not be loaded: what failed, the server's reason, a retry. */
export function ErrorPanel({ title, error, onRetry, retrying = false }: { title: string; error: unknown; onRetry?: () => void; retrying?: boolean }) {
  return (
    <div role="alert" className="rounded-lg border border-rule-strong bg-paper-raised px-6 py-8">
      <div className="flex items-start gap-4">
        <span aria-hidden className="mt-0.5 flex size-8 shrink-0 items-center justify-center rounded-full border-2 border-rust/70 font-bold text-rust">
          !
        </span>
        <div className="min-w-0">
          <p className="font-semibold text-ink">{title}</p>
          <p className="mt-1 text-[0.9375rem] text-ink-soft">{describeError(error)}</p>
          {onRetry && (
            <Button className="mt-4" size="sm" onClick={onRetry} busy={retrying} busyLabel="Trying again…">
              Try again
            </Button>
          )}
        </div>
      </div>
    </div>
  );
}

/** Shown when a list is empty: say so plainly and what would fill it. */
export function EmptyPanel({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="rounded-lg border border-dashed border-rule-strong px-6 py-12 text-center">
      <p className="font-semibold text-ink">{title}</p>
      {children && <div className="mx-auto mt-1 max-w-md text-[0.9375rem] text-ink-soft">{children}</div>}
    </div>
  );
}
