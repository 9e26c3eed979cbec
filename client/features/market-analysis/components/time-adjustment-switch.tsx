import { useId } from 'react';
import { Notice } from '../../../components/ui/notice';

interface Props {
  on: boolean;
  busy: boolean;
  /** Why the person may not change it (a reviewer, an assignment with the reviewer); null if they may. */
  lockedBecause: string | null;
  refusal: string | null;
  onChange: (on: boolean) => void;
}

/** The time-adjustment switch: turning it on fits the floor-area line to time-adjusted prices. */
export function TimeAdjustmentSwitch({ on, busy, lockedBecause, refusal, onChange }: Props) {
  const labelId = useId();
  const descriptionId = useId();
  return (
    <div className="flex flex-col gap-3 rounded-md border border-rule bg-paper px-4 py-3">
      <div className="flex items-start gap-3.5">
        <button
          type="button"
          role="switch"
          aria-checked={on}
          aria-labelledby={labelId}
          aria-describedby={descriptionId}
          aria-busy={busy || undefined}
          disabled={busy || lockedBecause !== null}
          onClick={() => onChange(!on)}
          className={`relative mt-0.5 inline-flex h-6 w-11 shrink-0 items-center rounded-full border transition-colors disabled:cursor-not-allowed disabled:opacity-60 ${
            on ? 'border-ink bg-ink' : 'border-rule-strong bg-paper-sunk'
          }`}
        >
          <span
            aria-hidden
            className={`inline-block size-4.5 rounded-full bg-paper-raised shadow-[0_1px_2px_rgb(29_42_68/0.3)] transition-transform ${on ? 'translate-x-[1.3rem]' : 'translate-x-[0.2rem]'}`}
          />
        </button>
        <div className="min-w-0">
          <p id={labelId} className="text-[0.9375rem] font-semibold text-ink">
            Time-adjust sale prices <span className="figures ml-1 text-sm font-normal text-ink-soft">{busy ? 'saving…' : on ? 'on' : 'off'}</span>
          </p>
          <p id={descriptionId} className="mt-0.5 text-[0.875rem] leading-relaxed text-ink-soft">
            Turning it on brings each sale price to the effective date at its neighbourhood’s monthly rate (simple, not compounded), and
            fits the floor-area line, its figures and its flags to those time-adjusted prices.
            {lockedBecause && <span className="mt-1 block text-ink-faint">{lockedBecause}</span>}
          </p>
        </div>
      </div>
      {refusal && <Notice tone="error">{refusal}</Notice>}
    </div>
  );
}
