/** Serialized analyses keyed by assignment and data revision. A change to the subject, the sales or
 * the time-adjustment switch raises the revision, so a stale entry is never read; old revisions
 * fall out as the least recently used. Per process: each app instance warms its own. */
export class AnalysisCache<T = string> {
  private readonly entries = new Map<string, T>();
  constructor(private readonly capacity = 200) {}

  get(assignmentId: number, dataRevision: number): T | undefined {
    const key = `${assignmentId}:${dataRevision}`;
    const hit = this.entries.get(key);
    if (hit !== undefined) {
      this.entries.delete(key);
      this.entries.set(key, hit);
    }
    return hit;
  }

  set(assignmentId: number, dataRevision: number, value: T): void {
    for (const key of this.entries.keys()) if (key.startsWith(`${assignmentId}:`)) this.entries.delete(key);
    this.entries.set(`${assignmentId}:${dataRevision}`, value);
    while (this.entries.size > this.capacity) this.entries.delete(this.entries.keys().next().value!);
  }

  clear(): void {
    this.entries.clear();
  }
}
