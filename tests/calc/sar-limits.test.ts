/**
 * Sources:
 * - 47 CFR §1.1310(a)–(c);
 * - RSS-102 Issue 5 §4 Table 3 (1.6 W/kg from a secondary source, the rest from memory);
 * - ICNIRP 1998 basic restrictions (ICNIRP 1998 Table 4);
 * - ICNIRP 2020 Table 2 (values from memory, averaging time and mass from a secondary source);
 * - 1999/519/EC Annex II and 2013/35/EU ELVs (Directive 2013/35/EU Annex III).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { computeSarLimit, sarLimit, sarRegimes, sarRegions } from '../../calc/limits';
import { CalcRangeError } from '../../calc/types';

describe('sar-limit', () => {
  it('47 CFR §1.1310: general 1.6 W/kg (1 g), extremities 4 W/kg (10 g), whole body 0.08 W/kg; 30 min', () => {
    expect(sarLimit('fcc', 'general', 'head-trunk')).toMatchObject({ limitWPerKg: 1.6, averagingMassG: 1, averagingTimeS: 1800 });
    expect(sarLimit('fcc', 'general', 'limbs')).toMatchObject({ limitWPerKg: 4, averagingMassG: 10 });
    expect(sarLimit('fcc', 'general', 'whole-body')).toMatchObject({ limitWPerKg: 0.08, averagingMassG: null });
  });
  it('47 CFR §1.1310: occupational 8 W/kg (1 g), 20 W/kg (10 g), 0.4 W/kg; 6 min', () => {
    expect(sarLimit('fcc', 'occupational', 'head-trunk')).toMatchObject({ limitWPerKg: 8, averagingMassG: 1, averagingTimeS: 360 });
    expect(sarLimit('fcc', 'occupational', 'limbs').limitWPerKg).toBe(20);
    expect(sarLimit('fcc', 'occupational', 'whole-body').limitWPerKg).toBe(0.4);
  });
  it('RSS-102 Issue 5 Table 3: 1.6 W/kg over 1 g (S); 6 min (M)', () => {
    expect(sarLimit('ised', 'general', 'head-trunk')).toMatchObject({ limitWPerKg: 1.6, averagingMassG: 1, averagingTimeS: 360 });
    expect(computeSarLimit({ regime: 'ised', tier: 'occupational', region: 'limbs' }).derivation.notes.join(' ')).toMatch(/from memory/);
  });
  it('ICNIRP 1998 / 1999/519/EC Annex II: 2 W/kg head & trunk, 4 W/kg limbs over 10 g, 0.08 W/kg whole body; 100 kHz–10 GHz', () => {
    for (const regime of ['icnirp-1998', 'eu'] as const) {
      expect(sarLimit(regime, 'general', 'head-trunk')).toMatchObject({ limitWPerKg: 2, averagingMassG: 10, averagingTimeS: 360 });
      expect(sarLimit(regime, 'general', 'limbs').limitWPerKg).toBe(4);
      expect(sarLimit(regime, 'general', 'whole-body').limitWPerKg).toBe(0.08);
    }
    expect(sarLimit('icnirp-1998', 'occupational', 'head-trunk').limitWPerKg).toBe(10);
    expect(() => sarLimit('eu', 'general', 'head-trunk', 9e9)).not.toThrow();
  });
  it('2013/35/EU ELVs (EU occupational): 10 / 20 / 0.4 W/kg, 100 kHz–6 GHz', () => {
    expect(sarLimit('eu', 'occupational', 'head-trunk').limitWPerKg).toBe(10);
    expect(sarLimit('eu', 'occupational', 'limbs').limitWPerKg).toBe(20);
    expect(sarLimit('eu', 'occupational', 'whole-body').limitWPerKg).toBe(0.4);
    expect(() => sarLimit('eu', 'occupational', 'head-trunk', 8e9)).toThrow(/6 GHz/);
  });
  it('ICNIRP 2020 Table 2 (values from memory): whole-body 30 min to 300 GHz; local 10 g, 6 min, to 6 GHz', () => {
    expect(sarLimit('icnirp-2020', 'general', 'whole-body')).toMatchObject({ limitWPerKg: 0.08, averagingTimeS: 1800 });
    expect(sarLimit('icnirp-2020', 'general', 'head-trunk')).toMatchObject({ limitWPerKg: 2, averagingMassG: 10, averagingTimeS: 360 });
    expect(() => sarLimit('icnirp-2020', 'general', 'whole-body', 100e9)).not.toThrow();
    expect(() => sarLimit('icnirp-2020', 'general', 'head-trunk', 10e9)).toThrow(CalcRangeError);
  });
  it('FCC SAR limits apply 100 kHz–6 GHz (§1.1310(a)); outside → CalcRangeError naming the range', () => {
    expect(() => sarLimit('fcc', 'general', 'head-trunk', 7e9)).toThrow(/100 kHz to 6 GHz/);
  });
  it('property: occupational ≥ general, limbs ≥ head-trunk ≥ whole-body, for every regime', () => {
    fc.assert(
      fc.property(fc.constantFrom(...sarRegimes), (regime) => {
        for (const region of sarRegions) {
          expect(sarLimit(regime, 'occupational', region).limitWPerKg).toBeGreaterThanOrEqual(sarLimit(regime, 'general', region).limitWPerKg);
        }
        const g = (r: (typeof sarRegions)[number]) => sarLimit(regime, 'general', r).limitWPerKg;
        expect(g('limbs')).toBeGreaterThanOrEqual(g('head-trunk'));
        expect(g('head-trunk')).toBeGreaterThan(g('whole-body'));
      }),
    );
  });
});
