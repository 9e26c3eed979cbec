import { Link } from 'react-router-dom';

export interface WorkStep {
  key: string;
  label: string;
  href: string;
  /** A step whose work is finished shows a tick; the default is not started. */
  complete?: boolean;
}

/**
 * The ruler across the top of an assignment's workspace: one segment per step, in order. The current
 * step's segment is drawn in ink; finished steps carry a tick. Each segment is a link, so a step can
 * be opened directly and shared as an address.
 */
export function StepBar({ steps, current, label = 'Assignment steps' }: { steps: readonly WorkStep[]; current: string; label?: string }) {
  return (
    <nav aria-label={label} className="overflow-x-auto">
      <ol className="grid min-w-[40rem] grid-flow-col auto-cols-fr gap-1.5">
        {steps.map((step, index) => {
          const isCurrent = step.key === current;
          return (
            <li key={step.key}>
              <Link
                to={step.href}
                aria-current={isCurrent ? 'step' : undefined}
                className={`group flex h-full flex-col gap-1 border-t-[3px] px-1 pt-2.5 pb-1 transition-colors ${
                  isCurrent ? 'border-ink' : step.complete ? 'border-teal/70 hover:border-teal' : 'border-rule-strong/70 hover:border-ink-soft'
                }`}
              >
                <span className={`figures text-xs ${isCurrent ? 'text-ink' : 'text-ink-faint'}`}>
                  {String(index + 1).padStart(2, '0')}
                  {step.complete && (
                    <span className="ml-1.5 text-teal" aria-label="finished">
                      ✓
                    </span>
                  )}
                </span>
                <span className={`text-sm leading-snug ${isCurrent ? 'font-semibold text-ink' : 'text-ink-soft group-hover:text-ink'}`}>{step.label}</span>
              </Link>
            </li>
          );
        })}
      </ol>
    </nav>
  );
}
