import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import type { SaveProblem } from '../hooks/use-grid-save';

/** Says why a save did not go through. After a stale version it lists what the other person
 * changed and reassures that the typed text is still there. */
export function SaveProblemNotice({ problem, onDismiss }: { problem: SaveProblem | null; onDismiss: () => void }) {
  if (!problem) return null;
  if (problem.kind === 'refused') {
    return (
      <Notice tone="error" title="Not saved" actions={<Button size="sm" onClick={onDismiss}>Dismiss</Button>}>
        {problem.message}
      </Notice>
    );
  }
  return (
    <Notice
      tone="warning"
      title="Someone else saved first"
      actions={
        <Button size="sm" onClick={onDismiss}>
          Dismiss
        </Button>
      }
    >
      <p>The grid has been reloaded with their change. What you typed is still here: check it against theirs and save again.</p>
      {problem.changes.length > 0 ? (
        <ul className="mt-2 list-disc pl-5">
          {problem.changes.map((change) => (
            <li key={change}>{change}</li>
          ))}
        </ul>
      ) : (
        <p className="mt-1">Their change did not alter any figure shown here.</p>
      )}
    </Notice>
  );
}
