/** '1 message', '3 messages'. English plurals with an optional irregular form. */
export function countOf(count: number, singular: string, plural = `${singular}s`): string {
  return `${count} ${count === 1 ? singular : plural}`;
}
