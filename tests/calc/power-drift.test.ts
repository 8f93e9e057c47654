/**
 * power-drift — source: IEEE Std 1528-2013 / IEC/IEEE 62209-1528:2020 and FCC KDB 865664 D01: drift
 * within ±5 % = +0.212 dB / −0.223 dB (IEC/IEEE 62209-1528:2020 system check and power drift, from memory; dB values computed
 * there [X]: 10·log10(1.05) = 0.2119, 10·log10(0.95) = −0.2228).
 */
import { describe, expect, it } from 'vitest';
import { powerDrift } from '../../calc/lab/power-drift';
import { runCalculation } from '../../calc/registry';

describe('power-drift (±5 %, from memory)', () => {
  it('tolerance in dB is +0.212 / −0.223 (§4.4)', () => {
    const r = powerDrift({ startSarWPerKg: 1, endSarWPerKg: 1 });
    expect(r.toleranceDb.upper).toBeCloseTo(0.212, 3);
    expect(r.toleranceDb.lower).toBeCloseTo(-0.223, 3);
  });

  it('SAR 1.00 → 0.96 W/kg: −0.177 dB, −4 %, pass', () => {
    const r = powerDrift({ startSarWPerKg: 1.0, endSarWPerKg: 0.96 });
    expect(r.driftDb).toBeCloseTo(-0.177, 3);
    expect(r.driftPct).toBeCloseTo(-4, 10);
    expect(r.pass).toBe(true);
  });

  it('SAR 1.00 → 0.94 W/kg: −6 %, fail', () => {
    expect(powerDrift({ startSarWPerKg: 1.0, endSarWPerKg: 0.94 }).pass).toBe(false);
  });

  it('dB input: −0.22 dB passes, −0.23 dB fails; +0.21 passes, +0.22 fails (asymmetric, §4.4)', () => {
    expect(powerDrift({ startPowerDb: 0, endPowerDb: -0.22 }).pass).toBe(true);
    expect(powerDrift({ startPowerDb: 0, endPowerDb: -0.23 }).pass).toBe(false);
    expect(powerDrift({ startPowerDb: 20, endPowerDb: 20.21 }).pass).toBe(true);
    const r = powerDrift({ startPowerDb: 20, endPowerDb: 20.22 });
    expect(r.driftDb).toBeCloseTo(0.22, 10);
    expect(r.driftPct).toBeCloseTo(5.196, 3);
    expect(r.pass).toBe(false);
  });

  it('needs exactly one pair of inputs, with a message naming them', () => {
    const both = runCalculation('power-drift', { startSarWPerKg: 1, endSarWPerKg: 1, startPowerDb: 0, endPowerDb: 0 });
    expect(both.ok).toBe(false);
    if (!both.ok) expect(both.error.message).toMatch(/one pair/);
    const half = runCalculation('power-drift', { startPowerDb: 0 });
    expect(half.ok).toBe(false);
    if (!half.ok) expect(half.error.issues[0].path).toEqual(['endPowerDb']);
  });
});
