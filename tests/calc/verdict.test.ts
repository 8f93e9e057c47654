/**
 * Verdict against a threshold: every exemption rule in calc/limits reads "exempt if value ≤ threshold"
 * (47 CFR §1.1307(b)(3)(i), RSS-102 Issue 5 §2.5, KDB 447498 §4.3.1, EN 62479); margin in dB is
 * 10·log10(threshold/value) (common practice).
 */
import { describe, expect, it } from 'vitest';
import { compareToThreshold } from '../../calc/limits';

describe('compareToThreshold', () => {
  it('compareToThreshold: equality is exempt; margin 10·log10(threshold/value)', () => {
    expect(compareToThreshold(10, 10)).toEqual({ exempt: true, marginDb: 0 });
    expect(compareToThreshold(20, 10).marginDb).toBeCloseTo(-3.0103, 4);
    expect(compareToThreshold(0, 10).marginDb).toBeNull();
  });
});
