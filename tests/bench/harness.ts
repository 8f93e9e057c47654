/**
 * A small timing harness for `npm run bench` (tinybench is not installed): warm-up, then one
 * process.hrtime.bigint() reading per call, reporting mean and p95 against each case's target.
 * Speed targets live here, never in timed tests.
 */

export interface BenchCase {
  name: string;
  /** Target per call, ms (the case passes when p95 — or the mean, see judgeBy — is under it). */
  targetMs: number;
  /** Which figure the target applies to: p95 (latency targets, the default) or the mean (throughput targets). */
  judgeBy?: 'p95' | 'mean';
  /** A second target for the mean, ms, where a case has both (the engine: ≤ 5 ms mean and ≤ 8 ms p95). */
  meanTargetMs?: number;
  /**
   * Builds the function to time, or returns a string saying why the case is skipped. The
   * function may return a promise (an HTTP round trip, say); it is awaited inside the timing.
   */
  prepare(): (() => unknown) | string | Promise<(() => unknown) | string>;
  /** Releases what prepare() set up (servers, temp folders). */
  teardown?(): void | Promise<void>;
  /** Lines printed under the result (what was measured, what was absent). */
  describe?(): string[];
  warmupIterations?: number;
  iterations?: number;
}

export interface BenchResult {
  name: string;
  skipped?: string;
  iterations?: number;
  meanMs?: number;
  p95Ms?: number;
  /** Process CPU time per call (user + system, all threads), ms: steadier than wall time on a shared machine. */
  cpuMs?: number;
  targetMs: number;
  judgeBy?: 'p95' | 'mean';
  meanTargetMs?: number;
  underTarget?: boolean;
}

function percentile(sortedMs: number[], p: number): number {
  const rank = Math.ceil((p / 100) * sortedMs.length) - 1;
  return sortedMs[Math.min(sortedMs.length - 1, Math.max(0, rank))];
}

const isPromise = (v: unknown): v is Promise<unknown> => typeof (v as Promise<unknown> | null)?.then === 'function';

export async function runCase(c: BenchCase): Promise<BenchResult> {
  const fn = await c.prepare();
  if (typeof fn === 'string') return { name: c.name, skipped: fn, targetMs: c.targetMs };
  const warmup = c.warmupIterations ?? 50;
  const iterations = c.iterations ?? 500;
  for (let i = 0; i < warmup; i++) {
    const r = fn();
    if (isPromise(r)) await r;
  }
  const samplesMs = new Array<number>(iterations);
  const cpu0 = process.cpuUsage();
  for (let i = 0; i < iterations; i++) {
    const t0 = process.hrtime.bigint();
    const r = fn();
    if (isPromise(r)) await r;
    samplesMs[i] = Number(process.hrtime.bigint() - t0) / 1e6;
  }
  const cpu = process.cpuUsage(cpu0);
  await c.teardown?.();
  samplesMs.sort((a, b) => a - b);
  const meanMs = samplesMs.reduce((s, x) => s + x, 0) / iterations;
  const p95Ms = percentile(samplesMs, 95);
  const cpuMs = (cpu.user + cpu.system) / 1000 / iterations;
  const judgeBy = c.judgeBy ?? 'p95';
  const underTarget = (judgeBy === 'mean' ? meanMs : p95Ms) < c.targetMs && (c.meanTargetMs === undefined || meanMs <= c.meanTargetMs);
  return { name: c.name, iterations, meanMs, p95Ms, cpuMs, targetMs: c.targetMs, judgeBy, meanTargetMs: c.meanTargetMs, underTarget };
}

export function formatResult(r: BenchResult): string {
  if (r.skipped) return `SKIP  ${r.name}: ${r.skipped}`;
  const verdict = r.underTarget ? 'OK  ' : 'SLOW';
  const under = (ms: number) => (ms < r.targetMs ? 'under' : 'over');
  const meanTarget = r.meanTargetMs === undefined ? '' : ` and ≤ ${r.meanTargetMs} ms mean (${r.meanMs! <= r.meanTargetMs ? 'met' : 'over'})`;
  return (
    `${verdict}  ${r.name}: mean ${r.meanMs!.toFixed(3)} ms (${under(r.meanMs!)}), p95 ${r.p95Ms!.toFixed(3)} ms ` +
    `(${under(r.p95Ms!)}); target < ${+r.targetMs.toFixed(3)} ms ${r.judgeBy === 'mean' ? 'mean' : 'at p95'}${meanTarget}, ${r.iterations} runs; CPU ${r.cpuMs!.toFixed(3)} ms per run`
  );
}

export interface SteadyState {
  runs: number;
  meanMs: number;
  medianMs: number;
  /** Process CPU time per run (all threads, JIT and GC helpers included), ms. */
  cpuMs: number;
  /** Garbage-collection pauses during the runs, per run: count and ms. */
  gcPerRun: number;
  gcMsPerRun: number;
}

/**
 * A synchronous function's figures once the JIT has settled (after `warmup` calls), with the
 * garbage-collection pauses V8 reports during the runs: on a shared machine p95 is mostly GC and
 * scheduling, so these say what the code itself costs.
 */
export async function steadyState(fn: () => unknown, runs = 300, warmup = 300): Promise<SteadyState> {
  const { PerformanceObserver } = await import('node:perf_hooks');
  for (let i = 0; i < warmup; i++) fn();
  const gcMs: number[] = [];
  const observer = new PerformanceObserver((list) => {
    for (const e of list.getEntries()) gcMs.push(e.duration);
  });
  observer.observe({ entryTypes: ['gc'] });
  const samples = new Array<number>(runs);
  const cpu0 = process.cpuUsage();
  for (let i = 0; i < runs; i++) {
    const t0 = process.hrtime.bigint();
    fn();
    samples[i] = Number(process.hrtime.bigint() - t0) / 1e6;
  }
  const cpu = process.cpuUsage(cpu0);
  await new Promise((resolve) => setTimeout(resolve, 20)); // GC entries arrive on the event loop, after a timer turn
  observer.disconnect();
  samples.sort((a, b) => a - b);
  return {
    runs,
    meanMs: samples.reduce((s, x) => s + x, 0) / runs,
    medianMs: samples[Math.floor(runs / 2)],
    cpuMs: (cpu.user + cpu.system) / 1000 / runs,
    gcPerRun: gcMs.length / runs,
    gcMsPerRun: gcMs.reduce((s, x) => s + x, 0) / runs,
  };
}

export function formatSteadyState(s: SteadyState): string {
  return (
    `steady state (${s.runs} runs after the JIT settled): mean ${s.meanMs.toFixed(3)} ms, median ${s.medianMs.toFixed(3)} ms, CPU ${s.cpuMs.toFixed(3)} ms per run; ` +
    `GC pauses ${s.gcMsPerRun.toFixed(3)} ms per run (${(s.gcPerRun * 100).toFixed(0)} per 100 runs)`
  );
}
