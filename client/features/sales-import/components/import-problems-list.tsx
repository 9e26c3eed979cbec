import type { ImportProblem } from '@contracts/sales-import';
import { countWords } from '../lib/count-words';

interface ImportProblemsListProps {
  problems: readonly ImportProblem[];
  /** Every problem the server found; it lists at most the first 500. */
  problemCount: number;
  invalidRows: number;
  title?: string;
}

/** Row number (header = row 1), field and message for each problem, in a scrolling list. */
export function ImportProblemsList({ problems, problemCount, invalidRows, title = 'Rows with problems' }: ImportProblemsListProps) {
  if (problems.length === 0) return null;
  const unlisted = problemCount - problems.length;
  return (
    <section aria-label={title} className="flex flex-col gap-2">
      <h4 className="font-semibold text-ink">
        {title} <span className="figures text-sm font-normal text-ink-soft">· {countWords(invalidRows, 'row')}, {countWords(problemCount, 'problem')}</span>
      </h4>
      <ol tabIndex={0} aria-label={`${title}: row, field and problem`} className="max-h-72 overflow-y-auto rounded-lg border border-rust/30 bg-paper-raised">
        {problems.map((problem, index) => (
          <li key={index} className="grid grid-cols-[5.5rem_9.5rem_1fr] gap-3 border-b border-rule px-3 py-2 text-[0.9375rem] last:border-b-0">
            <span className="figures text-sm text-rust">Row {problem.row}</span>
            <span className="font-medium text-ink">{problem.field}</span>
            <span className="text-ink-soft">{problem.message}</span>
          </li>
        ))}
      </ol>
      {unlisted > 0 && (
        <p className="text-[0.875rem] text-ink-soft">
          The first {problems.length} are listed; {countWords(unlisted, 'more problem')} {unlisted === 1 ? 'is' : 'are'} not. Fix these, upload the file again, and the
          rest appear.
        </p>
      )}
    </section>
  );
}
