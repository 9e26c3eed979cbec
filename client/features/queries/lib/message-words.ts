import type { ReviewQuery } from '@contracts/review';

type Kind = ReviewQuery['messages'][number]['kind'];

export const messageKindLabels: Record<Kind, string> = {
  question: 'Question',
  comment: 'Comment',
  kept: 'Kept the sale',
  excluded: 'Excluded the sale',
  resolved: 'Resolved',
  reopened: 'Reopened',
};

export const queryStatusLabels: Record<ReviewQuery['status'], string> = { open: 'Open', answered: 'Answered', resolved: 'Resolved' };
export const queryStatusTone: Record<ReviewQuery['status'], 'pending' | 'neutral' | 'positive'> = { open: 'pending', answered: 'neutral', resolved: 'positive' };
