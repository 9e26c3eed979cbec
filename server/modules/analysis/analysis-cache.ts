/** Analyses keyed by assignment and data revision, one revision per assignment: the newest one
 * stored. A change to the subject, the sales or the time-adjustment switch raises the revision, so
 * a stale entry is never read; assignments nobody reads fall out as the least recently used.
 * Per process: each app instance warms its own. */
export class AnalysisCache<T = string> {
  /** By assignment id, in order of last use (a Map iterates in insertion order). */
  private readonly entries = new Map<number, { dataRevision: number; value: T }>();
  constructor(private readonly capacity = 200) {}

  get(assignmentId: number, dataRevision: number): T | undefined {
    const entry = this.entries.get(assignmentId);
    if (entry === undefined || entry.dataRevision !== dataRevision) return undefined;
    this.entries.delete(assignmentId);
    this.entries.set(assignmentId, entry);
    return entry.value;
  }

  /** Stores an assignment's analysis unless a newer revision is already stored: a computation of
   * an older revision that finishes last must not push out the newer one. */
  set(assignmentId: number, dataRevision: number, value: T): void {
    const current = this.entries.get(assignmentId);
    if (current !== undefined && current.dataRevision > dataRevision) return;
    this.entries.delete(assignmentId);
    this.entries.set(assignmentId, { dataRevision, value });
    while (this.entries.size > this.capacity) this.entries.delete(this.entries.keys().next().value!);
  }

  clear(): void {
    this.entries.clear();
  }
}
