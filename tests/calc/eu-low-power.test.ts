/**
 * Sources:
 * - EN 62479:2010 Annex A principle P_max = SAR_BR × m_avg and its value table (EN 62479:2010 Annex A, from
 *   memory, from memory; 20 mW corroborated by EN 50371, secondary source);
 * - SAR basic restrictions from 1999/519/EC Annex II (§7.1), 2013/35/EU (§7.5), 47 CFR §1.1310 (§1.1).
 */
import { describe, expect, it } from 'vitest';
import { computeEuLowPowerExclusion, euLowPowerExclusion } from '../../calc/limits';
import { CalcRangeError } from '../../calc/types';

describe('eu-low-power-exclusion — EN 62479:2010', () => {
  it('EN 62479:2010 Annex A: 2 W/kg × 10 g = 20 mW (public head/trunk); 4 W/kg × 10 g = 40 mW (limbs)', () => {
    expect(euLowPowerExclusion(2.45e9, 'eu', 'general', 'head-trunk').pMaxMw).toBe(20);
    expect(euLowPowerExclusion(2.45e9, 'eu', 'general', 'limbs').pMaxMw).toBe(40);
  });
  it('EN 62479:2010 Annex A: occupational 10 W/kg × 10 g = 100 mW; 20 W/kg × 10 g = 200 mW', () => {
    expect(euLowPowerExclusion(2.45e9, 'eu', 'occupational', 'head-trunk').pMaxMw).toBe(100);
    expect(euLowPowerExclusion(2.45e9, 'icnirp-1998', 'occupational', 'limbs').pMaxMw).toBe(200);
  });
  it('EN 62479:2010 Annex A: 1.6 W/kg × 1 g = 1.6 mW (FCC 1 g); 8 W/kg × 1 g = 8 mW', () => {
    expect(euLowPowerExclusion(2.45e9, 'fcc', 'general', 'head-trunk').pMaxMw).toBeCloseTo(1.6, 9);
    expect(euLowPowerExclusion(2.45e9, 'fcc', 'occupational', 'head-trunk').pMaxMw).toBe(8);
  });
  it('EN 62479:2010 Annex A: 10 W/m² over 20 cm² = 20 mW above 10 GHz (1999/519/EC)', () => {
    const r = euLowPowerExclusion(28e9, 'eu', 'general', 'head-trunk');
    expect(r.basis).toBe('power-density');
    expect(r.pMaxMw).toBeCloseTo(20, 9);
  });
  it('compares power: 15 mW at 2.45 GHz (EU public) is excluded with 1.249 dB margin; the source is named', () => {
    const r = computeEuLowPowerExclusion({ frequencyHz: 2.45e9, regime: 'eu', tier: 'general', region: 'head-trunk', powerMw: 15 });
    expect(r.excluded).toBe(true);
    expect(r.marginDb).toBeCloseTo(1.249, 3);
    expect(r.derivation.source).toMatch(/EN 62479/);
    expect(r.derivation.source).toMatch(/1999\/519\/EC/);
  });
  it('range: EN 62479 covers 10 MHz–300 GHz; FCC SAR above 6 GHz has no power-density case here', () => {
    expect(() => euLowPowerExclusion(5e6, 'eu', 'general', 'head-trunk')).toThrow(/10 MHz/);
    expect(() => euLowPowerExclusion(8e9, 'fcc', 'general', 'head-trunk')).toThrow(CalcRangeError);
  });
});
