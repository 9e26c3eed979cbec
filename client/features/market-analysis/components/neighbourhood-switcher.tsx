import { useRef, type KeyboardEvent } from 'react';
import type { GroupAnalysis } from '@contracts/analysis';

export function groupTabId(name: string): string {
  return `group-tab-${name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}`;
}
export const GROUP_PANEL_ID = 'market-analysis-group';

interface Props {
  groups: readonly GroupAnalysis[];
  chosen: string;
  subjectGroup: string | null;
  onChoose: (name: string) => void;
}

/**
 * The neighbourhoods as a row of index cards: the subject's first (marked), the others, then the
 * pooled fit, set apart by a rule. Arrow keys move between them, as in any tab list.
 */
export function NeighbourhoodSwitcher({ groups, chosen, subjectGroup, onChoose }: Props) {
  const tabs = useRef<Array<HTMLButtonElement | null>>([]);

  function onKeyDown(event: KeyboardEvent, index: number) {
    const last = groups.length - 1;
    const next = { ArrowRight: index + 1, ArrowLeft: index - 1, Home: 0, End: last }[event.key];
    if (next === undefined) return;
    event.preventDefault();
    const target = next < 0 ? last : next > last ? 0 : next;
    onChoose(groups[target].neighbourhood);
    tabs.current[target]?.focus();
  }

  return (
    <div role="tablist" aria-label="Neighbourhood" className="-mx-1 flex items-stretch gap-1.5 overflow-x-auto px-1 pb-1">
      {groups.map((group, index) => {
        const selected = group.neighbourhood === chosen;
        const isSubject = group.neighbourhood === subjectGroup;
        return (
          <div key={group.neighbourhood} className={`flex ${group.pooled ? 'sm:ml-auto' : ''}`}>
            {group.pooled && <span aria-hidden className="mr-1.5 hidden w-px self-stretch bg-rule-strong sm:block" />}
            <button
              ref={(el) => {
                tabs.current[index] = el;
              }}
              id={groupTabId(group.neighbourhood)}
              type="button"
              role="tab"
              aria-selected={selected}
              aria-controls={GROUP_PANEL_ID}
              tabIndex={selected ? 0 : -1}
              onClick={() => onChoose(group.neighbourhood)}
              onKeyDown={(event) => onKeyDown(event, index)}
              className={`group flex flex-col items-start gap-0.5 rounded-md border px-3 py-2 text-left whitespace-nowrap transition-colors lg:min-w-[9.5rem] lg:px-3.5 ${
                selected
                  ? 'border-ink bg-paper-raised shadow-[inset_0_-3px_0_var(--color-ink)]'
                  : 'border-rule bg-paper-sunk/50 hover:border-rule-strong hover:bg-paper-raised'
              }`}
            >
              <span className={`flex items-center gap-2 text-[0.9375rem] leading-snug ${selected ? 'font-semibold text-ink' : 'text-ink-soft group-hover:text-ink'}`}>
                {group.neighbourhood}
                {/* The subject's own mark in the scatter, a diamond, names its neighbourhood here. */}
                {isSubject && <span aria-hidden title="The subject’s neighbourhood" className="size-[0.4375rem] rotate-45 bg-ink" />}
              </span>
              <span className="text-xs text-ink-faint">
                <span className="figures">{group.n === 1 ? '1 sale' : `${group.n} sales`}</span>
                {group.pooled && ', pooled'}
                {isSubject && <span className="sr-only">, the subject’s neighbourhood</span>}
              </span>
            </button>
          </div>
        );
      })}
    </div>
  );
}
