/** Dates and times in the reader's own locale and time zone. */
const dateTime = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });
const dateOnly = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' });

export function formatDateTime(value: Date): string {
  return dateTime.format(value);
}

export function formatDate(value: Date): string {
  return dateOnly.format(value);
}

/** A calendar date sent as 'YYYY-MM-DD' (an effective or due date), shown as that same day in
 * every time zone. */
export function formatIsoDate(value: string): string {
  const [year, month, day] = value.split('-').map(Number);
  if (!year || !month || !day) return value;
  return dateOnly.format(new Date(year, month - 1, day));
}
