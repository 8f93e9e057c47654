/**
 * system-check — source: IEEE Std 1528-2013 / IEC/IEEE 62209-1528:2020 system check and FCC KDB 865664
 * D01: measured psSAR within ±10 % of target (IEC/IEEE 62209-1528:2020 system check and power drift, from memory).
 */
import { describe, expect, it } from 'vitest';
import { systemCheck } from '../../calc/lab/system-check';

describe('system-check (±10 %, from memory)', () => {
  it('52.4 W/kg against a 50.0 W/kg target (normalised to 1 W): +4.8 %, pass', () => {
    const r = systemCheck({ measuredSarWPerKg: 52.4, targetSarWPerKg: 50.0 });
    expect(r.deviationPct).toBeCloseTo(4.8, 10);
    expect(r.tolerancePct).toBe(10);
    expect(r.pass).toBe(true);
  });

  it('exactly −10 % passes; −10.2 % fails', () => {
    expect(systemCheck({ measuredSarWPerKg: 45.0, targetSarWPerKg: 50.0 }).pass).toBe(true);
    const r = systemCheck({ measuredSarWPerKg: 44.9, targetSarWPerKg: 50.0 });
    expect(r.deviationPct).toBeCloseTo(-10.2, 10);
    expect(r.pass).toBe(false);
  });

  it('a tighter tolerance can be given', () => {
    expect(systemCheck({ measuredSarWPerKg: 52.4, targetSarWPerKg: 50.0, tolerancePct: 4 }).pass).toBe(false);
  });

  it('rejects a zero target', () => {
    expect(() => systemCheck({ measuredSarWPerKg: 1, targetSarWPerKg: 0 })).toThrow(/targetSarWPerKg/);
  });
});
