/**
 * When a save comes back 409 'stale_version', someone else saved the record first. These helpers
 * compare what the person edited with what the server holds now, so that the page can show the
 * difference and carry the person's typing over onto the fresh version: nothing typed is lost.
 * Values are compared as the form holds them (strings), trimmed.
 */
export type FormValues = Record<string, string>;

export interface EditConflictRow<K extends string = string> {
  field: K;
  /** The value the person's form started from. */
  started: string;
  /** What the person typed. */
  yours: string;
  /** What the server holds now. */
  now: string;
  /** The other save changed this field too (it no longer matches what the form started from). */
  changedSince: boolean;
}

const same = (a: string | undefined, b: string | undefined) => (a ?? '').trim() === (b ?? '').trim();

/** One row per field the person edited (and left different from where they started). */
export function compareEditsWithServer<K extends string>(edited: readonly K[], started: Record<K, string>, yours: Record<K, string>, now: Record<K, string>): EditConflictRow<K>[] {
  return edited
    .filter((field) => !same(started[field], yours[field]))
    .map((field) => ({ field, started: started[field] ?? '', yours: yours[field] ?? '', now: now[field] ?? '', changedSince: !same(started[field], now[field]) }));
}

/** The fields the other save changed that the person did not touch (they are taken as saved). */
export function fieldsChangedElsewhere<K extends string>(fields: readonly K[], edited: readonly K[], started: Record<K, string>, now: Record<K, string>): K[] {
  return fields.filter((field) => !edited.includes(field) && !same(started[field], now[field]));
}

/** The server's values with the person's edits laid over them: the form to show after a reload. */
export function rebaseEdits<T extends FormValues>(edited: readonly (keyof T & string)[], yours: T, now: T): T {
  const next = { ...now };
  for (const field of edited) next[field] = yours[field];
  return next;
}
