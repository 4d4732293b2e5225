/**
 * A small least-recently-used store for results that depend only on immutable inputs (revisions, releases and
 * reference sets never change once stored), so a key made of their ids gives the same result for ever.
 */
export class RecentResults<T> {
  private readonly entries = new Map<string, T>();

  constructor(private readonly limit: number) {}

  get(key: string, compute: () => T): T {
    const hit = this.entries.get(key);
    if (hit !== undefined) {
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit;
    }
    const value = compute();
    this.entries.set(key, value);
    if (this.entries.size > this.limit) this.entries.delete(this.entries.keys().next().value as string);
    return value;
  }

  /** Drops a remembered result, e.g. a computation that failed and should be tried again next time. */
  forget(key: string): void {
    this.entries.delete(key);
  }

  get size(): number {
    return this.entries.size;
  }
}
