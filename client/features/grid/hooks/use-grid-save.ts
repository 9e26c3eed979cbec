import { useState } from 'react';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { GridResponse } from '@contracts/grid';
import { describeError, isApiError } from '../../../lib/api-error';
import { gridQueries, gridRequests, type GridEntryChange, type GridSettingsChange } from '../api/grid-queries';
import { gridChanges } from '../lib/grid-changes';
import type { Figures } from '../lib/grid-figures';

export type GridWrite = { kind: 'settings'; change: GridSettingsChange } | { kind: 'entry'; saleId: number; change: GridEntryChange };

export interface SaveProblem {
  /** 'stale': someone saved first (the page has reloaded the grid); 'refused': any other refusal. */
  kind: 'stale' | 'refused';
  message: string;
  /** For 'stale': what the other person changed, in words. */
  changes: string[];
}

/**
 * Writes to the grid with the version the page holds. The answer (the recomputed grid) replaces the
 * cached one. A stale version (409) reloads the grid and reports what changed; the caller keeps what
 * was typed, so saving again puts it on top of the fresh copy. `onRefused` lets the page refresh the
 * assignment when the server says the file is no longer editable.
 */
export function useGridSave(assignmentId: number, figures: Figures, onRefused?: (error: unknown) => void) {
  const queryClient = useQueryClient();
  const key = gridQueries.detail(assignmentId).queryKey;
  const [problem, setProblem] = useState<SaveProblem | null>(null);
  const mutation = useMutation({
    mutationFn: (write: GridWrite) =>
      write.kind === 'settings' ? gridRequests.updateSettings(assignmentId, write.change) : gridRequests.updateEntry(assignmentId, write.saleId, write.change),
    onSuccess: (grid) => queryClient.setQueryData(key, grid),
  });

  /** Runs the writes in order; stops at the first refusal. True when every one was saved. */
  async function save(writes: GridWrite[]): Promise<boolean> {
    let before = queryClient.getQueryData<GridResponse>(key);
    setProblem(null);
    try {
      for (const write of writes) before = await mutation.mutateAsync(write);
      return true;
    } catch (error) {
      if (isApiError(error) && error.code === 'stale_version') {
        const after = await queryClient.fetchQuery({ ...gridQueries.detail(assignmentId), staleTime: 0 });
        const changes = gridChanges(before, after, figures);
        setProblem({ kind: 'stale', message: error.message, changes });
      } else {
        setProblem({ kind: 'refused', message: describeError(error), changes: [] });
        onRefused?.(error);
      }
      return false;
    }
  }

  return { save, saving: mutation.isPending, problem, clearProblem: () => setProblem(null) };
}
