/**
 * Caches for hot reads (the signed-in user of a session, the assembled filing answer) that never
 * serve a stale answer. The one clear point is the database's own write count, looked up on every
 * cache lookup: `total_changes()` counts every row this connection inserted, updated or deleted
 * (statements run by triggers and by any code path included: services, the session store, a
 * test's raw SQL), and `PRAGMA data_version` moves whenever another connection commits (a
 * package build's child process, the sqlite3 shell). When either has moved since the last
 * lookup, every cache of the app is emptied before it answers. Inside a transaction nothing is
 * read from or put into a cache: what the transaction reads may still be rolled back.
 */
import type Database from 'better-sqlite3';
import { ByteLru } from './services/result-cache';

export interface ReadCache<V> {
  /** The cached value for key, or compute() it (and keep it while the database is unchanged). */
  get(key: string, compute: () => V): V;
}

export interface ReadCaches {
  /** A new cache, bounded by the summed sizeOf of its values (default: 1 per value). */
  create<V>(maxSize: number, sizeOf?: (value: V) => number): ReadCache<V>;
  /** How many lookups were answered from a cache and how many computed (for the bench). */
  readonly stats: { hits: number; misses: number; clears: number };
}

export function createReadCaches(sqlite: Database.Database): ReadCaches {
  const writeCount = sqlite.prepare('select total_changes(), data_version from pragma_data_version').raw();
  const caches: ByteLru<unknown>[] = [];
  const stats = { hits: 0, misses: 0, clears: 0 };
  let changes = -1;
  let dataVersion = -1;

  /** True when the database is as it was at the last lookup; empties every cache when it is not. */
  const unchanged = (): boolean => {
    const [c, v] = writeCount.get() as [number, number];
    if (c === changes && v === dataVersion) return true;
    changes = c;
    dataVersion = v;
    for (const cache of caches) cache.clear();
    stats.clears++;
    return false;
  };

  return {
    stats,
    create<V>(maxSize: number, sizeOf: (value: V) => number = () => 1): ReadCache<V> {
      const lru = new ByteLru<V>(maxSize, sizeOf);
      caches.push(lru as ByteLru<unknown>);
      return {
        get(key, compute) {
          if (sqlite.inTransaction) return compute();
          if (unchanged()) {
            const hit = lru.get(key);
            if (hit !== undefined) {
              stats.hits++;
              return hit;
            }
          }
          stats.misses++;
          const value = compute();
          // Kept only if nothing was written while it was computed (another process may commit
          // between two of its statements).
          if (unchanged()) lru.set(key, value);
          return value;
        },
      };
    },
  };
}
