import { CAUTIONS } from '@contracts/report-text';

/** The three cautions of the product design (single source: server/contracts/report-text.ts). */
export function Cautions({ className = '' }: { className?: string }) {
  return (
    <aside aria-labelledby="cautions-title" className={`rounded-lg border border-rule-strong bg-paper-raised px-5 py-4 ${className}`}>
      <h2 id="cautions-title" className="text-sm font-semibold tracking-wide text-ink uppercase">
        Cautions
      </h2>
      <ol className="mt-3 flex flex-col gap-2.5">
        {CAUTIONS.map((text, index) => (
          <li key={index} className="flex gap-3 text-[0.9375rem] leading-relaxed text-ink-soft">
            <span aria-hidden className="figures mt-px text-sm text-ink-faint">
              {index + 1}.
            </span>
            <span>{text}</span>
          </li>
        ))}
      </ol>
    </aside>
  );
}
