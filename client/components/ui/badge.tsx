import type { ReactNode } from 'react';

type Tone = 'neutral' | 'positive' | 'pending' | 'negative' | 'muted';

const tones: Record<Tone, string> = {
  neutral: 'border-rule-strong bg-paper-raised text-ink-soft',
  positive: 'border-teal/30 bg-teal-wash text-teal',
  pending: 'border-ochre/45 bg-ochre-wash text-ochre-deep',
  negative: 'border-rust/35 bg-rust-wash text-rust',
  muted: 'border-rule bg-paper-sunk text-ink-faint',
};

/** A short state word, always written out (never colour alone). */
export function Badge({ tone = 'neutral', children }: { tone?: Tone; children: ReactNode }) {
  return (
    <span className={`inline-flex items-center gap-1.5 rounded-full border px-2.5 py-0.5 text-xs font-semibold whitespace-nowrap ${tones[tone]}`}>
      <span aria-hidden className="size-1.5 rounded-full bg-current" />
      {children}
    </span>
  );
}
