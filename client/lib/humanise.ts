/** 'in-review' → 'In review', 'user_invited' → 'User invited'. For codes the server sends as words. */
export function humaniseCode(code: string): string {
  const words = code.replace(/[-_]+/g, ' ').trim();
  return words.charAt(0).toUpperCase() + words.slice(1);
}
