/**
 * A small in-process cache for what recommendations read on every request (a fitment, its springs).
 * Writes in this process clear it at once; the TTL bounds how stale another app server's copy can be.
 */
export class TtlCache<V> {
  private readonly entries = new Map<string, { value: Promise<V>; expires: number; version: number }>();
  constructor(private readonly ttlMs: number, private readonly maxEntries = 5000) {}

  getOrLoad(key: string, load: () => Promise<V>): Promise<V> {
    const e = this.entries.get(key);
    if (e && e.expires >= Date.now() && e.version === catalogueVersion) return e.value;
    // The version is taken before loading, so a read that races a write is never kept past it.
    const version = catalogueVersion;
    const value = load();
    if (this.entries.size >= this.maxEntries) this.entries.clear();
    this.entries.set(key, { value, expires: Date.now() + this.ttlMs, version });
    value.catch(() => this.entries.delete(key));
    return value;
  }
}

let catalogueVersion = 0;

/** Called by every catalogue write after its transaction commits. */
export function catalogueChanged(): void {
  catalogueVersion += 1;
}
