import type { ReactNode } from 'react';

/** A sheet of the analysis: a short title, one line on how to read it, then its content. */
export function AnalysisCard({
  title,
  description,
  aside,
  children,
  className = '',
  labelId,
}: {
  title: string;
  description?: ReactNode;
  aside?: ReactNode;
  children: ReactNode;
  className?: string;
  labelId?: string;
}) {
  return (
    <section aria-labelledby={labelId} className={`flex min-w-0 flex-col rounded-lg border border-rule bg-paper-raised ${className}`}>
      <header className="flex flex-wrap items-start justify-between gap-x-6 gap-y-2 border-b border-rule px-5 pt-4 pb-3">
        <div className="min-w-0">
          <h3 id={labelId} className="text-base font-semibold text-ink">
            {title}
          </h3>
          {description && <p className="mt-0.5 text-[0.875rem] text-ink-soft">{description}</p>}
        </div>
        {aside}
      </header>
      <div className="flex min-w-0 flex-1 flex-col px-5 py-4">{children}</div>
    </section>
  );
}
