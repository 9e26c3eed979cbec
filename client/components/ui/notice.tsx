import type { ReactNode } from 'react';

type Tone = 'info' | 'success' | 'error' | 'warning';

const tones: Record<Tone, { box: string; mark: string }> = {
  info: { box: 'border-rule-strong bg-paper-raised', mark: 'bg-ink-soft' },
  success: { box: 'border-teal/35 bg-teal-wash', mark: 'bg-teal' },
  error: { box: 'border-rust/35 bg-rust-wash', mark: 'bg-rust' },
  warning: { box: 'border-ochre/50 bg-ochre-wash', mark: 'bg-ochre-deep' },
};

/** A message in the flow of the page. Errors are announced to screen readers as they appear. */
export function Notice({ tone = 'info', title, children, actions }: { tone?: Tone; title?: string; children?: ReactNode; actions?: ReactNode }) {
  const style = tones[tone];
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} className={`relative overflow-hidden rounded-md border py-3 pr-4 pl-5 ${style.box}`}>
      <span aria-hidden className={`absolute inset-y-0 left-0 w-1 ${style.mark}`} />
      {title && <p className="font-semibold text-ink">{title}</p>}
      {children && <div className={`text-[0.9375rem] text-ink-soft ${title ? 'mt-0.5' : ''}`}>{children}</div>}
      {actions && <div className="mt-3 flex flex-wrap gap-2">{actions}</div>}
    </div>
  );
}
