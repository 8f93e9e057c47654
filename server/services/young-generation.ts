/**
 * A young-generation collection on demand, for code that streams big buffers through (the
 * package build). Every read buffer is memory outside the JS heap that V8 frees only when a
 * collection runs; with large buffers and few JS objects, that is when tens of megabytes of dead
 * buffers have piled up (V8 waits for its external-memory limit), and the process keeps the pages.
 * A gigabyte's package build peaked about 20 MB lower with a scavenge every 4 MB streamed, which
 * costs well under a millisecond each when almost nothing in the young generation is alive
 * (`npm run bench -- "package build"`).
 *
 * --expose-gc given at run time installs gc() only in contexts created afterwards, so it is taken
 * from a fresh vm context (as Jest's leak detector does); the app's own global stays as it was.
 */
import v8 from 'node:v8';
import vm from 'node:vm';

type GcFunction = (options?: { type?: 'minor' | 'major' }) => void;

let gc: GcFunction | null | undefined;

function gcFunction(): GcFunction | null {
  if (gc !== undefined) return gc;
  const existing = (globalThis as { gc?: GcFunction }).gc;
  if (typeof existing === 'function') return (gc = existing);
  v8.setFlagsFromString('--expose-gc');
  const fromContext: unknown = vm.runInNewContext('typeof gc === "function" ? gc : null');
  return (gc = typeof fromContext === 'function' ? (fromContext as GcFunction) : null);
}

/** Runs a scavenge (young generation only); does nothing where V8 offers no gc(). */
export function collectYoungGeneration(): void {
  gcFunction()?.({ type: 'minor' });
}

/** Calls `collect` (a scavenge) each time `everyBytes` more bytes have been counted. */
export function youngCollectionEvery(everyBytes: number, collect: () => void = collectYoungGeneration): (bytes: number) => void {
  let since = 0;
  return (bytes) => {
    since += bytes;
    if (since < everyBytes) return;
    since = 0;
    collect();
  };
}
