/**
 * Sources: 47 CFR §1.1307(b)(3)(ii)(B) (Σ ratios ≤ 1; wording from memory) and ICNIRP 1998 / 1999/519/EC Annex IV
 * summation Σ S_i/S_L,i ≤ 1 (1999/519/EC Annexes III–IV); the worked FCC OET Bulletin 65 Eq. (3) value gives the 0.199 ratio of 1 W
 * EIRP at 20 cm against the FCC general-population limit at 2.45 GHz.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { computeMpeSumOfRatios, exposureLimit, farFieldPowerDensityWPerM2, mpeSumOfRatios } from '../../calc/limits';
import { runCalculation } from '../../calc/registry';

describe('mpe-sum-of-ratios', () => {
  it('FCC OET Bulletin 65 Eq. (3), worked: 1 W EIRP at 20 cm vs FCC GP at 2.45 GHz → ratio 0.199; with a second source at 0.6 → 0.799, pass', () => {
    const s = farFieldPowerDensityWPerM2(1, 0.2);
    const limit = exposureLimit(2.45e9, 'fcc', 'general').powerDensityWPerM2!;
    const r = computeMpeSumOfRatios({
      sources: [
        { id: 'wifi', powerDensityWPerM2: s, limitWPerM2: limit },
        { id: 'lte', powerDensityWPerM2: 3.4, limitWPerM2: 5.667 },
      ],
    });
    expect(r.ratios[0].ratio).toBeCloseTo(0.199, 3);
    expect(r.sum).toBeCloseTo(0.799, 3);
    expect(r.pass).toBe(true);
  });
  it('sum exactly 1 passes (≤ 1); above 1 fails', () => {
    expect(
      mpeSumOfRatios([
        { id: 'a', powerDensityWPerM2: 5, limitWPerM2: 10 },
        { id: 'b', powerDensityWPerM2: 1, limitWPerM2: 2 },
      ]).pass,
    ).toBe(true);
    expect(
      mpeSumOfRatios([
        { id: 'a', powerDensityWPerM2: 6, limitWPerM2: 10 },
        { id: 'b', powerDensityWPerM2: 1, limitWPerM2: 2 },
      ]).pass,
    ).toBe(false);
  });
  it('duplicate ids are refused with the path of the duplicate', () => {
    const out = runCalculation('mpe-sum-of-ratios', {
      sources: [
        { id: 'a', powerDensityWPerM2: 1, limitWPerM2: 10 },
        { id: 'a', powerDensityWPerM2: 1, limitWPerM2: 10 },
      ],
    });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.error.issues[0].path).toEqual(['sources', 1, 'id']);
  });
  it('property: the sum equals the sum of the ratios and pass ⇔ sum ≤ 1', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.double({ min: 0, max: 100, noNaN: true }), fc.double({ min: 0.01, max: 100, noNaN: true })), { minLength: 1, maxLength: 8 }), (list) => {
        const r = mpeSumOfRatios(list.map(([s, l], i) => ({ id: `s${i}`, powerDensityWPerM2: s, limitWPerM2: l })));
        expect(r.sum).toBeCloseTo(
          list.reduce((a, [s, l]) => a + s / l, 0),
          9,
        );
        expect(r.pass).toBe(r.sum <= 1);
      }),
    );
  });
});
