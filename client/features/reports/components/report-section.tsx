import type { ReactNode } from 'react';

/** A part of the report: a title on a ruled line, an optional sentence on what it shows. */
export function ReportSection({ id, title, lead, children }: { id: string; title: string; lead?: ReactNode; children: ReactNode }) {
  return (
    <section aria-labelledby={`${id}-title`} className="flex flex-col gap-4">
      <div className="flex flex-col gap-1 border-t-2 border-ink pt-3">
        <h2 id={`${id}-title`} className="text-[1.25rem] leading-tight font-semibold text-ink">
          {title}
        </h2>
        {lead && <p className="max-w-3xl text-[0.9375rem] text-ink-soft">{lead}</p>}
      </div>
      {children}
    </section>
  );
}
