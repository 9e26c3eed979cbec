import { statusLabels, type AssignmentStatus } from '@contracts/assignments';

/** What each status means for the people on the file, in a sentence. */
export const statusMeaning: Record<AssignmentStatus, string> = {
  in_progress: 'The appraiser is working on the file; the reviewer sees it read-only.',
  in_review: 'Submitted: the reviewer checks the flagged sales and the grid, raises queries, then approves or asks for revisions.',
  revisions_requested: 'Back with the appraiser: revise, answer the queries, and submit again.',
  approved: 'Approved by the reviewer: the appraiser may sign and deliver the report.',
  signed: 'Signed by the appraiser and delivered to the client.',
};

export const statusTone: Record<AssignmentStatus, 'neutral' | 'pending' | 'negative' | 'positive'> = {
  in_progress: 'neutral',
  in_review: 'pending',
  revisions_requested: 'negative',
  approved: 'positive',
  signed: 'positive',
};

/** The sentence of a timeline entry: what happened, in words. */
export function changeWords(from: AssignmentStatus | null, to: AssignmentStatus): string {
  if (from === null) return 'Opened';
  if (to === 'in_review') return from === 'revisions_requested' ? 'Submitted again for review' : 'Submitted for review';
  if (to === 'revisions_requested') return 'Revisions requested';
  if (to === 'approved') return 'Approved';
  if (to === 'signed') return 'Signed and delivered';
  return `Moved to “${statusLabels[to]}”`;
}
