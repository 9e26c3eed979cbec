/**
 * Compline's own six-step scales for condition and quality, 1 best (the same words as the Port
 * Ellery demo model). The server stores the number; these are the words people read.
 */
export const conditionWords: Record<number, string> = {
  1: 'New or as new',
  2: 'Well kept, little wear',
  3: 'Ordinary wear, minor repairs due',
  4: 'Worn, several parts need repair',
  5: 'Substantial repairs needed',
  6: 'Not habitable as is',
};

export const qualityWords: Record<number, string> = {
  1: 'Architect-designed, finest materials',
  2: 'High',
  3: 'Good standard',
  4: 'Plain standard',
  5: 'Basic, economy materials',
  6: 'Minimal, below building norms',
};

export const ratingSteps = [1, 2, 3, 4, 5, 6] as const;
