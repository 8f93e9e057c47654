/**
 * The calculation pool (server/calc-pool.ts). Its threads run at the lowest scheduling priority (nice 19), so on a small
 * machine reads and saves get the CPU first while a heavy calculation runs. Linux keeps a nice
 * value per thread; this reads it from /proc for every thread of this process.
 */
import fs from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { createCalcPool } from '../../server/calc-pool';
import { MAX_TRANSMITTERS, MAX_USE_POSITIONS } from '../../calc/input-limits';

/** Field 19 of /proc/<pid>/task/<tid>/stat is the thread's nice value (proc(5)). */
function niceOfThreads(): Map<number, number> {
  const nice = new Map<number, number>();
  for (const tid of fs.readdirSync('/proc/self/task')) {
    const stat = fs.readFileSync(`/proc/self/task/${tid}/stat`, 'utf8');
    // The command name (field 2) may hold spaces: count fields after its closing parenthesis.
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    nice.set(Number(tid), Number(fields[16]));
  }
  return nice;
}

const pool = createCalcPool({ timeLimitMs: 20_000, maxThreads: 1 });
afterAll(() => pool.close());

describe.runIf(process.platform === 'linux')('calculation pool priority', () => {
  it('runs calculations on a thread at nice 19 while the event loop thread stays at its own priority', async () => {
    const before = niceOfThreads();
    const outcome = await pool.run('far-field-power-density', { eirpW: 1, distanceM: 0.2 });
    expect(outcome.ok).toBe(true);
    const after = niceOfThreads();
    const newLowThreads = [...after].filter(([tid, nice]) => nice === 19 && before.get(tid) !== 19);
    expect(newLowThreads.length).toBe(1);
    expect(after.get(process.pid)).toBe(before.get(process.pid));
    expect(after.get(process.pid)).not.toBe(19);
  });
});

describe('calculation pool shutdown', () => {
  it('a calculation in flight when the server stops ends as "shutting down", not as an unhandled error', async () => {
    const stopping = createCalcPool({ timeLimitMs: 20_000, maxThreads: 1 });
    const heaviest = {
      markets: [{ regime: 'fcc' }, { regime: 'ised' }, { regime: 'eu' }, { regime: 'icnirp-2020' }],
      antennas: [{ id: 'A', gainDbi: 2 }],
      transmitters: Array.from({ length: MAX_TRANSMITTERS }, (_, i) => ({ id: `T${i}`, frequencyMinHz: 0.7e9 + i * 50e6, frequencyMaxHz: 0.72e9 + i * 50e6, maxTuneUpPowerDbm: 20, antennaId: 'A' })),
      usePositions: Array.from({ length: MAX_USE_POSITIONS }, (_, i) => ({ id: `P${i}`, kind: 'body-worn', separations: [{ antennaId: 'A', separationM: 0.001 * i }] })),
    };
    const inFlight = stopping.run('screening', heaviest);
    await new Promise((r) => setTimeout(r, 200));
    await stopping.close();
    expect(await inFlight).toEqual({ ok: false, shuttingDown: true });
    expect(await stopping.run('far-field-power-density', { eirpW: 1, distanceM: 0.2 })).toEqual({ ok: false, shuttingDown: true });
  });
});
