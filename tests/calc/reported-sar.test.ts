/**
 * reported-sar — sources:
 * - FCC KDB 447498 D01 v06 / KDB 865664 D01 v01r04: reported SAR = measured SAR scaled to the
 *   maximum tune-up power (FCC KDB 447498 D01 v06, from memory).
 * - Duty-cycle scaling maximum/measured: common practice (KDB 248227 D01 for 802.11, from memory).
 * - Default limit 1.6 W/kg: 47 CFR §1.1310(c), 1-g general population (47 CFR §1.1310(a)–(c), confirmed).
 * Expected numbers are hand-computed from those formulas (10^(1/10) = 1.258925…).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { reportedSar } from '../../calc/lab/reported-sar';
import { runCalculation } from '../../calc/registry';

describe('reported-sar', () => {
  it('scales 1.0 W/kg measured at 23 dBm to a 24 dBm tune-up: ×1.2589 (KDB 447498 practice, hand-computed)', () => {
    const r = reportedSar({ measuredSarWPerKg: 1.0, measuredPowerDbm: 23, tuneUpPowerDbm: 24 });
    expect(r.scalingFactor).toBeCloseTo(1.258925, 6);
    expect(r.reportedSarWPerKg).toBeCloseTo(1.258925, 6);
    expect(r.powerScalingApplied).toBe(true);
    // Margin to the 1.6 W/kg default limit (47 CFR §1.1310(c)).
    expect(r.marginToLimit.marginWPerKg).toBeCloseTo(0.341075, 6);
    expect(r.marginToLimit.marginPercentOfLimit).toBeCloseTo(21.3172, 4);
    expect(r.marginToLimit.marginDb).toBeCloseTo(1.0412, 4);
    expect(r.withinLimit).toBe(true);
    expect(r.derivation.source).toMatch(/KDB 447498/);
    expect(r.derivation.inputs.limitWPerKg.value).toBe(1.6);
  });

  it('multiplies in the duty-cycle factor maximum/measured (common practice)', () => {
    const r = reportedSar({
      measuredSarWPerKg: 0.5,
      measuredPowerDbm: 20,
      tuneUpPowerDbm: 21,
      dutyCycle: { measured: 0.5, maximum: 1 },
    });
    expect(r.dutyCycleScalingFactor).toBe(2);
    expect(r.scalingFactor).toBeCloseTo(2.517851, 6);
    expect(r.reportedSarWPerKg).toBeCloseTo(1.258925, 6);
  });

  it('never scales down when tune-up is below the measured power, and says so (common practice)', () => {
    const r = reportedSar({ measuredSarWPerKg: 1.2, measuredPowerDbm: 24.5, tuneUpPowerDbm: 24 });
    expect(r.powerScalingApplied).toBe(false);
    expect(r.scalingFactor).toBe(1);
    expect(r.reportedSarWPerKg).toBe(1.2);
    expect(r.derivation.notes.join(' ')).toMatch(/not applied/);
  });

  it('reports a negative margin over the limit (10-g extremity limit 4 W/kg, 47 CFR §1.1310(c))', () => {
    const r = reportedSar({ measuredSarWPerKg: 3.5, measuredPowerDbm: 20, tuneUpPowerDbm: 21, limitWPerKg: 4 });
    expect(r.reportedSarWPerKg).toBeCloseTo(4.406239, 6);
    expect(r.withinLimit).toBe(false);
    expect(r.marginToLimit.marginWPerKg).toBeCloseTo(-0.406239, 6);
    expect(r.marginToLimit.marginDb).toBeCloseTo(-0.4201, 4);
  });

  it('property: reported SAR ≥ measured whenever tune-up ≥ measured power (issue 3 invariant)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 20, noNaN: true }), fc.double({ min: -10, max: 40, noNaN: true }), fc.double({ min: 0, max: 10, noNaN: true }), (sar, measuredDbm, headroomDb) => {
        const r = reportedSar({ measuredSarWPerKg: sar, measuredPowerDbm: measuredDbm, tuneUpPowerDbm: measuredDbm + headroomDb });
        return r.reportedSarWPerKg >= sar && r.scalingFactor >= 1;
      }),
    );
  });

  it('rejects a non-positive measured SAR through the registry, naming the field', () => {
    const out = runCalculation('reported-sar', { measuredSarWPerKg: 0, measuredPowerDbm: 20, tuneUpPowerDbm: 21 });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.error.issues[0].path).toEqual(['measuredSarWPerKg']);
  });
});
