/** The "In grid" switch of one sale. A real switch for screen readers, named by the sale's address. */
export function GridToggle({ address, on, busy, disabled, disabledReason, onToggle }: { address: string; on: boolean; busy: boolean; disabled: boolean; disabledReason?: string; onToggle: () => void }) {
  return (
    <button
      type="button"
      role="switch"
      aria-checked={on}
      aria-label={`In grid: ${address}`}
      title={disabled ? disabledReason : on ? 'In the adjustment grid' : 'Not in the grid'}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      onClick={(event) => {
        event.stopPropagation();
        onToggle();
      }}
      className={`group relative inline-flex h-[18px] w-8 shrink-0 items-center rounded-full border transition-colors disabled:cursor-not-allowed ${
        on ? 'border-ink bg-ink' : 'border-rule-strong bg-paper-sunk hover:border-ink-soft'
      } ${disabled ? 'opacity-45' : ''} ${busy ? 'opacity-70' : ''}`}
    >
      <span
        aria-hidden
        className={`absolute top-1/2 size-3 -translate-y-1/2 rounded-full shadow-[0_1px_1px_rgb(29_42_68/0.25)] transition-[left] ${on ? 'left-[15px] bg-paper-raised' : 'left-[2px] bg-paper-raised'}`}
      />
    </button>
  );
}
