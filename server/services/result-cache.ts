/**
 * A small least-recently-used cache bounded by bytes, for computed answers that belong to one app
 * instance (keyed by content hash, never by row ids, so two instances never share or mix them).
 */
export class ByteLru<V> {
  private readonly entries = new Map<string, { value: V; bytes: number }>();
  private total = 0;

  constructor(
    private readonly maxBytes: number,
    private readonly sizeOf: (value: V) => number,
  ) {}

  get(key: string): V | undefined {
    const hit = this.entries.get(key);
    if (!hit) return undefined;
    // Re-insert: a Map iterates in insertion order, so the first entry is the least recent.
    this.entries.delete(key);
    this.entries.set(key, hit);
    return hit.value;
  }

  set(key: string, value: V): V {
    const bytes = this.sizeOf(value);
    const old = this.entries.get(key);
    if (old) {
      this.total -= old.bytes;
      this.entries.delete(key);
    }
    if (bytes > this.maxBytes) return value;
    this.entries.set(key, { value, bytes });
    this.total += bytes;
    for (const [k, e] of this.entries) {
      if (this.total <= this.maxBytes) break;
      this.entries.delete(k);
      this.total -= e.bytes;
    }
    return value;
  }

  clear(): void {
    this.entries.clear();
    this.total = 0;
  }

  get sizeBytes() {
    return this.total;
  }
}
