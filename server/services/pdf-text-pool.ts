/**
 * Runs PDF text extraction (pdf-text.ts) in one worker thread: a 100-page report is a few hundred
 * milliseconds of parsing that would otherwise hold the event loop, and pdfjs's polyfills stay in
 * that thread. The thread keeps pdfjs loaded between reports (loading it costs more than reading
 * a long report) and is ended when idle for a while. A PDF that takes longer than the time limit,
 * or more memory than the cap, is reported unreadable rather than stalling or taking the server.
 */
import path from 'node:path';
import { Piscina } from 'piscina';
import type { PdfText } from './pdf-text';

const TIME_LIMIT_MS = 120_000;
const IDLE_MS = 10 * 60_000;

let pool: Piscina | undefined;
const poolOf = () =>
  (pool ??= new Piscina({
    filename: path.join(__dirname, '..', 'pdf-text-worker.cjs'),
    minThreads: 0,
    // One thread: read-backs are rare (one per uploaded report) and the calc pool needs the cores.
    maxThreads: 1,
    idleTimeout: IDLE_MS,
    resourceLimits: { maxOldGenerationSizeMb: 768 },
  }));

/** Reads every page's text (in the worker thread). An encrypted, damaged or runaway PDF is unreadable, with why. */
export async function extractPdfText(data: Uint8Array): Promise<PdfText> {
  // The worker gets its own copy, moved rather than copied again (the caller keeps `data`).
  const copy = new Uint8Array(data);
  try {
    return (await poolOf().run(Piscina.move(copy), { signal: AbortSignal.timeout(TIME_LIMIT_MS) })) as PdfText;
  } catch (err) {
    const e = err as { name?: string; cause?: { name?: string }; code?: string; message?: string };
    if (e?.name === 'AbortError' || e?.cause?.name === 'TimeoutError') return { status: 'unreadable', reason: `The PDF could not be read within ${TIME_LIMIT_MS / 1000} s.`, pages: [] };
    if (e?.code === 'ERR_WORKER_OUT_OF_MEMORY') return { status: 'unreadable', reason: 'The PDF could not be read (it needs more memory than a read-back may use).', pages: [] };
    throw err;
  }
}

/** Ends the worker thread (tests and shutdown; it also ends by itself when idle). */
export async function closePdfTextPool() {
  const p = pool;
  pool = undefined;
  await p?.destroy();
}
