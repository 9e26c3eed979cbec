/** The two steps of ordering, shown above the form and the payment. */
export function OrderSteps({ current }: { current: 1 | 2 }) {
  const steps = ['Order details', 'Payment'];
  return (
    <ol aria-label="Ordering steps" className="flex gap-1.5">
      {steps.map((label, i) => {
        const n = (i + 1) as 1 | 2;
        const state = n === current ? 'current' : n < current ? 'done' : 'todo';
        return (
          <li key={label} aria-current={state === 'current' ? 'step' : undefined} className={`flex min-w-40 flex-1 flex-col gap-1 border-t-[3px] pt-2 sm:flex-none ${state === 'todo' ? 'border-rule-strong/70' : state === 'done' ? 'border-teal/70' : 'border-ink'}`}>
            <span className="figures text-xs text-ink-faint">
              {String(n).padStart(2, '0')}
              {state === 'done' && <span className="ml-1.5 text-teal">✓</span>}
            </span>
            <span className={`text-sm ${state === 'current' ? 'font-semibold text-ink' : 'text-ink-soft'}`}>{label}</span>
          </li>
        );
      })}
    </ol>
  );
}
