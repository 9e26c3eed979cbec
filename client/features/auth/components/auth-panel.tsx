import type { ReactNode } from 'react';

/** The card that holds a sign-in, reset or invitation form. */
export function AuthPanel({ title, description, children }: { title: string; description?: ReactNode; children: ReactNode }) {
  return (
    <section aria-labelledby="auth-panel-title" className="rounded-xl border border-rule bg-paper-raised px-7 py-8 shadow-[0_1px_0_rgb(29_42_68/0.04),0_12px_32px_-18px_rgb(29_42_68/0.25)] sm:px-9">
      <h1 id="auth-panel-title" className="text-2xl font-semibold text-ink">
        {title}
      </h1>
      {description && <p className="mt-2 text-[0.9375rem] text-ink-soft">{description}</p>}
      <div className="mt-7">{children}</div>
    </section>
  );
}
