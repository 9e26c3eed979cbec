/** '1 row', '29,969 sales': a count with thousands separators in the reader's locale, and the word
 * in the singular or plural. Import files run to tens of thousands of rows. */
export function countWords(count: number, singular: string, plural = `${singular}s`): string {
  return `${count.toLocaleString()} ${count === 1 ? singular : plural}`;
}
