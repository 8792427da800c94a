/**
 * A small in-process cache for what recommendations read on every request (a fitment, its springs).
 * Writes in this process clear it at once. Another app server's write is seen within two TTLs: for one
 * TTL past its time an entry still answers while a single reload replaces it, so riders never queue
 * behind a reload; and each entry lives 80–100 % of the TTL, so entries loaded together do not all
 * reload in the same moment.
 */
export class TtlCache<V> {
  private readonly entries = new Map<string, Entry<V>>();
  private readonly maxEntries: number;
  private readonly now: () => number;
  private readonly random: () => number;
  constructor(
    private readonly ttlMs: number,
    options: { maxEntries?: number; now?: () => number; random?: () => number } = {},
  ) {
    this.maxEntries = options.maxEntries ?? 5000;
    this.now = options.now ?? Date.now;
    this.random = options.random ?? Math.random;
  }

  private freshUntil(): number {
    return this.now() + this.ttlMs * (0.8 + 0.2 * this.random());
  }

  getOrLoad(key: string, load: () => Promise<V>): Promise<V> {
    const e = this.entries.get(key);
    if (e && e.version === catalogueVersion) {
      const t = this.now();
      if (t < e.freshUntil) return e.value;
      if (e.loaded && t < e.freshUntil + this.ttlMs) {
        if (!e.reloading) this.reload(key, load, e);
        return e.value;
      }
    }
    return this.store(key, load);
  }

  private store(key: string, load: () => Promise<V>): Promise<V> {
    // The version is taken before loading, so a read that races a write is never kept past it.
    const entry: Entry<V> = { value: load(), freshUntil: this.freshUntil(), version: catalogueVersion, loaded: false, reloading: false };
    if (this.entries.size >= this.maxEntries) this.entries.clear();
    this.entries.set(key, entry);
    entry.value.then(
      () => (entry.loaded = true),
      () => this.entries.get(key) === entry && this.entries.delete(key),
    );
    return entry.value;
  }

  private reload(key: string, load: () => Promise<V>, stale: Entry<V>): void {
    stale.reloading = true;
    const version = catalogueVersion;
    load().then(
      (value) => {
        // Replaced meanwhile (a write cleared it, or a fresh load began): that copy wins.
        if (this.entries.get(key) !== stale) return;
        this.entries.set(key, { value: Promise.resolve(value), freshUntil: this.freshUntil(), version, loaded: true, reloading: false });
      },
      // The old copy keeps answering until its window closes; the next request tries again.
      () => (stale.reloading = false),
    );
  }
}

interface Entry<V> {
  value: Promise<V>;
  freshUntil: number;
  version: number;
  loaded: boolean;
  reloading: boolean;
}

let catalogueVersion = 0;

/** Called by every catalogue write after its transaction commits. */
export function catalogueChanged(): void {
  catalogueVersion += 1;
}
