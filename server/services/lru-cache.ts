/**
 * A small least-recently-used map for results that are a pure function of their key (the key is
 * a hash of the whole input with the engine's versions), so a hit is exactly what a fresh
 * computation would return. Callers never mutate what they get back.
 */
import { createHash } from 'node:crypto';

export class LruCache<V> {
  private readonly map = new Map<string, V>();
  constructor(private readonly capacity: number) {}

  get(key: string, compute: () => V): V {
    const hit = this.map.get(key);
    if (hit !== undefined) {
      // Most recently used last, so the oldest is the first key.
      this.map.delete(key);
      this.map.set(key, hit);
      return hit;
    }
    const value = compute();
    this.map.set(key, value);
    if (this.map.size > this.capacity) this.map.delete(this.map.keys().next().value!);
    return value;
  }

  clear(): void {
    this.map.clear();
  }
}

export const sha256Of = (...parts: string[]) => {
  const h = createHash('sha256');
  for (const p of parts) h.update(p).update('\u0000');
  return h.digest('hex');
};
