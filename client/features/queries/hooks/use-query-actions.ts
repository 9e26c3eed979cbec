import { useMutation, useQueryClient } from '@tanstack/react-query';
import { queryRequests, queryThreads, type AnswerAction } from '../api/query-queries';

type Action =
  | { kind: 'raise'; saleId: number | null; body: string }
  | { kind: 'comment'; queryId: number; body: string }
  | { kind: 'answer'; queryId: number; version: number; action: AnswerAction; explanation: string }
  | { kind: 'resolve' | 'reopen'; queryId: number; version: number; body?: string };

function run(assignmentId: number, action: Action): Promise<unknown> {
  switch (action.kind) {
    case 'raise':
      return queryRequests.raise(assignmentId, { saleId: action.saleId, body: action.body });
    case 'comment':
      return queryRequests.comment(action.queryId, action.body);
    case 'answer':
      return queryRequests.answer(action.queryId, { action: action.action, explanation: action.explanation, version: action.version });
    case 'resolve':
      return queryRequests.resolve(action.queryId, { version: action.version, body: action.body });
    case 'reopen':
      return queryRequests.reopen(action.queryId, { version: action.version, body: action.body });
  }
}

/**
 * Every action on the query threads of one assignment. After any answer, success or refusal, the
 * threads are reloaded (a refusal is most often someone else's newer change). `onSaleChanged` runs
 * after an answer, which may exclude or keep a sale: the page reloads the analysis and the grid.
 */
export function useQueryActions(assignmentId: number, onSaleChanged: () => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (action: Action) => run(assignmentId, action),
    onSettled: async (_data, _error, action) => {
      await queryClient.invalidateQueries({ queryKey: queryThreads.list(assignmentId).queryKey });
      if (action.kind === 'answer' || action.kind === 'raise') await onSaleChanged();
    },
  });
}

export type QueryActions = ReturnType<typeof useQueryActions>;
export type { Action as QueryAction };
