/**
 * Sources:
 * - FCC OET Bulletin 65 (Edition 97-01) Eq. (3), S = EIRP/(4πR²);
 * - worked value of FCC OET Bulletin 65 Eq. (3): 1 W EIRP at 20 cm → 0.199 mW/cm².
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { complianceDistanceM, computeComplianceDistance, computeFarFieldPowerDensity, farFieldPowerDensityWPerM2 } from '../../calc/limits';
import { runCalculation } from '../../calc/registry';

describe('far-field-power-density — OET 65 Eq. (3)', () => {
  it('FCC OET Bulletin 65 Eq. (3), worked: 1 W EIRP at 20 cm → 0.199 mW/cm² (1.989 W/m²)', () => {
    const r = computeFarFieldPowerDensity({ eirpW: 1, distanceM: 0.2 });
    expect(r.powerDensityWPerM2 / 10).toBeCloseTo(0.199, 3);
    expect(r.derivation.source).toMatch(/OET Bulletin 65/);
  });
  it('{powerW, gainDbi}: 0.5 W into 3.0103 dBi equals 1 W EIRP', () => {
    const r = computeFarFieldPowerDensity({ powerW: 0.5, gainDbi: 10 * Math.log10(2), distanceM: 0.2 });
    expect(r.eirpW).toBeCloseTo(1, 12);
    expect(r.powerDensityWPerM2).toBeCloseTo(farFieldPowerDensityWPerM2(1, 0.2), 12);
  });
  it('giving both EIRP and power+gain is refused by the schema', () => {
    expect(runCalculation('far-field-power-density', { eirpW: 1, powerW: 1, gainDbi: 0, distanceM: 1 }).ok).toBe(false);
  });
});

describe('compliance-distance — OET 65 Eq. (3) solved for R', () => {
  it('FCC OET Bulletin 65 Eq. (3), worked inverted: 1 W EIRP, limit 1.989 W/m² → 0.2 m; 10 W/m² (FCC GP at 2.45 GHz) → 8.92 cm', () => {
    expect(complianceDistanceM(1, farFieldPowerDensityWPerM2(1, 0.2))).toBeCloseTo(0.2, 12);
    expect(computeComplianceDistance({ eirpW: 1, limitWPerM2: 10 }).distanceM).toBeCloseTo(0.0892, 4);
  });
  it('property: S(R(EIRP, S_lim)) = S_lim, and S falls with distance', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e4, noNaN: true }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }), (eirpW, limit) => {
        const r = complianceDistanceM(eirpW, limit);
        expect(farFieldPowerDensityWPerM2(eirpW, r)).toBeCloseTo(limit, 6);
        expect(farFieldPowerDensityWPerM2(eirpW, r * 2)).toBeLessThan(farFieldPowerDensityWPerM2(eirpW, r));
      }),
    );
  });
});
