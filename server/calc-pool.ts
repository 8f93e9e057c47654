/**
 * Runs calculations off the event loop, in a small pool of worker threads with a time limit, so
 * a heavy calculation never stalls sign-in, saves or health checks. A calculation that runs past
 * the limit has its thread ended (and replaced); its caller gets a clear 503.
 */
import os from 'node:os';
import path from 'node:path';
import { Piscina } from 'piscina';
import type { CalcIssue } from '../calc/types';

/** The result's JSON above this is refused (413): no calculation a person needs is that large. */
export const MAX_CALC_RESULT_BYTES = 32 * 1024 * 1024;

export type PoolOutcome =
  | { ok: true; body: Buffer; encoding: 'gzip' | 'identity' }
  | { ok: false; error: { message: string; issues: CalcIssue[]; problemCount?: number } }
  | { ok: false; tooLarge: number }
  | { ok: false; timedOut: true; limitMs: number }
  /** The server is stopping: calculations still in flight are ended, not reported as crashes. */
  | { ok: false; shuttingDown: true };

export interface CalcPool {
  /** `gzip`: the caller accepts a gzip-encoded body (compressed in the worker). */
  run(name: string, input: unknown, options?: { gzip?: boolean }): Promise<PoolOutcome>;
  close(): Promise<void>;
}

export function createCalcPool({ timeLimitMs, maxThreads = Math.max(1, Math.min(2, os.availableParallelism() - 1)) }: { timeLimitMs: number; maxThreads?: number }): CalcPool {
  const pool = new Piscina({
    filename: path.join(__dirname, 'calc-worker.cjs'),
    minThreads: 0,
    maxThreads,
    idleTimeout: 30_000,
    // A runaway input cannot take the process's memory with it.
    resourceLimits: { maxOldGenerationSizeMb: 512 },
  });
  let closing = false;
  return {
    async run(name, input, { gzip = false } = {}) {
      if (closing) return { ok: false, shuttingDown: true };
      try {
        const outcome = (await pool.run({ name, input, maxResultBytes: MAX_CALC_RESULT_BYTES, gzip }, { signal: AbortSignal.timeout(timeLimitMs) })) as PoolOutcome;
        // A Buffer arrives from the worker as a plain Uint8Array; Express wants a Buffer.
        if (outcome.ok) return { ...outcome, body: Buffer.from(outcome.body.buffer, outcome.body.byteOffset, outcome.body.byteLength) };
        return outcome;
      } catch (err) {
        const e = err as { name?: string; cause?: { name?: string } };
        if (e?.name === 'AbortError' || e?.cause?.name === 'TimeoutError') return { ok: false, timedOut: true, limitMs: timeLimitMs };
        if (closing) return { ok: false, shuttingDown: true };
        throw err;
      }
    },
    close: () => {
      closing = true;
      return pool.destroy();
    },
  };
}
