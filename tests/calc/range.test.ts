/**
 * Band helpers for the screening (common practice: evaluate a band at both edges and every
 * breakpoint of the rule). Cross-checked against the FCC §1.1307(b)(3)(i)(C) Table 1 breakpoints
 *.
 */
import { describe, expect, it } from 'vitest';
import { candidateFrequenciesHz, fccMpeBreakpointsHz, fccMpeThresholdErpW, mostRestrictiveInBand, requireInRange } from '../../calc/limits';
import { CalcRangeError } from '../../calc/types';

describe('range helpers', () => {
  it('candidateFrequenciesHz: edges plus breakpoints strictly inside, ascending', () => {
    expect(candidateFrequenciesHz(1e9, 2e9, [1.5e9, 3e9, 1e9])).toEqual([1e9, 1.5e9, 2e9]);
    expect(() => candidateFrequenciesHz(2e9, 1e9, [])).toThrow(/minimum/);
  });
  it('mostRestrictiveInBand: FCC MPE 700–2000 MHz at 1 m is most restrictive at 700 MHz (0.0128·700 = 8.96 W)', () => {
    const r = mostRestrictiveInBand(700e6, 2000e6, fccMpeBreakpointsHz, (f) => fccMpeThresholdErpW(f, 1));
    expect(r.frequencyHz).toBe(700e6);
    expect(r.threshold).toBeCloseTo(8.96, 2);
    expect(r.evaluatedHz).toEqual([700e6, 1.5e9, 2000e6]);
  });
  it('requireInRange names the rule and the valid range', () => {
    const call = () => requireInRange('frequencyHz', 7e9, { min: 0.3e9, max: 6e9 }, 'frequency', 'rule X');
    expect(call).toThrow(CalcRangeError);
    expect(call).toThrow('frequencyHz = 7 GHz is outside the range of rule X: valid 300 MHz to 6 GHz inclusive.');
  });
});
