import type { Assignment } from '@contracts/assignments';
import { formatIsoDate } from '../../../lib/format-date';

/** The line of key facts under an assignment's address. */
export function AssignmentFacts({ assignment }: { assignment: Assignment }) {
  const facts: Array<[string, string, boolean]> = [
    ['Client', assignment.clientOrganisationName, false],
    ['Appraiser', assignment.appraiserName, false],
    ['Effective date', formatIsoDate(assignment.effectiveDate), true],
    ['Due', assignment.dueDate ? formatIsoDate(assignment.dueDate) : 'not set', true],
  ];
  if (assignment.loanReference) facts.push(['Loan', assignment.loanReference, true]);
  return (
    <dl className="flex flex-wrap gap-x-6 gap-y-1 text-[0.9375rem]">
      {facts.map(([label, value, isFigure]) => (
        <div key={label} className="flex gap-1.5">
          <dt className="text-ink-faint">{label}</dt>
          <dd className={isFigure ? 'figures text-[0.875rem] leading-6 text-ink' : 'text-ink'}>{value}</dd>
        </div>
      ))}
    </dl>
  );
}
