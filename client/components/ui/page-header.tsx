import type { ReactNode } from 'react';

/** The top of every page: a small line of context, the page's one h1, a sentence on what it is for. */
export function PageHeader({ eyebrow, title, description, actions }: { eyebrow?: ReactNode; title: string; description?: ReactNode; actions?: ReactNode }) {
  return (
    <header className="flex flex-wrap items-end justify-between gap-x-8 gap-y-4 border-b border-rule pb-5">
      <div className="min-w-0 max-w-3xl">
        {eyebrow && <p className="text-[0.8125rem] font-medium tracking-wide text-ink-faint uppercase">{eyebrow}</p>}
        <h1 className="mt-1 text-[1.75rem] leading-tight font-semibold text-ink">{title}</h1>
        {description && <div className="mt-2 text-[0.9375rem] text-ink-soft">{description}</div>}
      </div>
      {actions && <div className="flex flex-wrap items-center gap-2">{actions}</div>}
    </header>
  );
}
