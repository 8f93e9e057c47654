/**
 * A calculation worker thread (piscina). The engine is TypeScript, so the worker registers tsx's
 * require hook before loading it; it serialises the result itself so the size cap is measured on
 * the bytes that would be sent.
 */
require('tsx/cjs/api').register();
const os = require('node:os');
const zlib = require('node:zlib');
const { runCalculation } = require('../calc/registry.ts');

// The lowest scheduling priority for this thread only (Linux keeps a nice value per thread): on a
// small machine the kernel then gives the event loop's reads and saves the CPU first, and a heavy
// calculation uses what is left. Raising niceness needs no privilege; where it is refused, the
// calculation still runs, at normal priority.
try {
  os.setPriority(os.constants.priority.PRIORITY_LOW);
} catch {
  /* not permitted here: run at normal priority */
}

module.exports = function runInWorker({ name, input, maxResultBytes, gzip }) {
  const outcome = runCalculation(name, input);
  if (!outcome.ok) return { ok: false, error: outcome.error };
  const json = JSON.stringify(outcome.result);
  const bytes = Buffer.byteLength(json);
  if (bytes > maxResultBytes) return { ok: false, tooLarge: bytes };
  // Compressing here keeps a large answer's cost off the event loop (bytes cross as one copy).
  const body = gzip ? zlib.gzipSync(json, { level: 1 }) : Buffer.from(json);
  return { ok: true, body, encoding: gzip ? 'gzip' : 'identity' };
};
