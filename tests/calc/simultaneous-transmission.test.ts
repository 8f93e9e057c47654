/**
 * simultaneous-transmission — source: FCC KDB 447498 D01 v06 §4.3.2 (from memory): Σ SAR ≤ limit; else SPLSR = (SAR₁+SAR₂)^1.5 / R_i, R_i in mm, rounded to
 * two decimals, ≤ 0.04 (1-g), ≤ 0.10 (10-g, unsure). Worked value: KDB 447498 §4.3.2 SPLSR, worked (from memory)
 * (SAR 1.2 + 0.6 W/kg: 0.060 at 40 mm, 0.037 at 65 mm).
 */
import { describe, expect, it } from 'vitest';
import { simultaneousTransmission } from '../../calc/lab/simultaneous-transmission';

const pair = (distanceM: number) => [
  { id: 'wwan', sarWPerKg: 1.2, peakLocationM: [0, 0, 0] as [number, number, number] },
  { id: 'wlan', sarWPerKg: 0.6, peakLocationM: [0, distanceM, 0] as [number, number, number] },
];

describe('simultaneous-transmission (KDB 447498 D01 v06 §4.3.2, from memory)', () => {
  it('sum within the limit passes without SPLSR', () => {
    const r = simultaneousTransmission({
      limitWPerKg: 1.6,
      transmitters: [
        { id: 'a', sarWPerKg: 1.0 },
        { id: 'b', sarWPerKg: 0.6 },
      ],
    });
    expect(r.sumWPerKg).toBeCloseTo(1.6, 12);
    expect(r.pass).toBe(true);
    expect(r.pairs).toEqual([]);
  });

  it('KDB 447498 D01 v06 §4.3.2 SPLSR (from memory), worked: 1.2 + 0.6 W/kg at 40 mm → SPLSR 0.060 > 0.04, measurement required', () => {
    const r = simultaneousTransmission({ limitWPerKg: 1.6, transmitters: pair(0.04) });
    expect(r.sumWPerKg).toBeCloseTo(1.8, 12);
    expect(r.pairs).toHaveLength(1);
    expect(r.pairs[0].distanceMm).toBeCloseTo(40, 9);
    expect(r.pairs[0].splsr).toBeCloseTo(0.0604, 4);
    expect(r.pairs[0].splsrRounded).toBe(0.06);
    expect(r.pairs[0].pass).toBe(false);
    expect(r.pass).toBe(false);
    expect(r.measurementRequired).toBe(true);
  });

  it('KDB 447498 D01 v06 §4.3.2 SPLSR (from memory), worked: same pair at 65 mm → SPLSR 0.037 ≤ 0.04, excluded', () => {
    const r = simultaneousTransmission({ limitWPerKg: 1.6, transmitters: pair(0.065) });
    expect(r.pairs[0].splsr).toBeCloseTo(0.0372, 4);
    expect(r.pairs[0].splsrRounded).toBe(0.04);
    expect(r.pass).toBe(true);
  });

  it('uses the 3-D distance √(Δx²+Δy²+Δz²) in mm (KDB 447498 §4.3.2)', () => {
    const r = simultaneousTransmission({
      limitWPerKg: 1.6,
      transmitters: [
        { id: 'a', sarWPerKg: 1.0, peakLocationM: [0, 0, 0] },
        { id: 'b', sarWPerKg: 1.0, peakLocationM: [0.03, 0.04, 0] },
      ],
    });
    expect(r.pairs[0].distanceMm).toBeCloseTo(50, 9);
    expect(r.pairs[0].splsr).toBeCloseTo(2 ** 1.5 / 50, 12);
  });

  it('a pair missing a peak location fails with a reason', () => {
    const r = simultaneousTransmission({
      limitWPerKg: 1.6,
      transmitters: [
        { id: 'a', sarWPerKg: 1.0, peakLocationM: [0, 0, 0] },
        { id: 'b', sarWPerKg: 1.0 },
      ],
    });
    expect(r.pairs[0].pass).toBe(false);
    expect(r.pairs[0].splsr).toBeNull();
    expect(r.pairs[0].reason).toMatch(/peak location missing for b/);
    expect(r.pass).toBe(false);
  });

  it('coincident peaks fail (R = 0)', () => {
    const r = simultaneousTransmission({
      limitWPerKg: 1.6,
      transmitters: [
        { id: 'a', sarWPerKg: 1.0, peakLocationM: [0.01, 0, 0] },
        { id: 'b', sarWPerKg: 1.0, peakLocationM: [0.01, 0, 0] },
      ],
    });
    expect(r.pairs[0].pass).toBe(false);
    expect(r.pairs[0].reason).toMatch(/coincide/);
  });

  it('three transmitters over the limit: every pair evaluated (3 pairs)', () => {
    const r = simultaneousTransmission({
      limitWPerKg: 1.6,
      transmitters: [
        { id: 'a', sarWPerKg: 0.7, peakLocationM: [0, 0, 0] },
        { id: 'b', sarWPerKg: 0.7, peakLocationM: [0.1, 0, 0] },
        { id: 'c', sarWPerKg: 0.7, peakLocationM: [0, 0.1, 0] },
      ],
    });
    expect(r.pairs.map((p) => `${p.a}-${p.b}`)).toEqual(['a-b', 'a-c', 'b-c']);
    // (1.4)^1.5 / 100 mm = 0.0166 → 0.02 ≤ 0.04
    expect(r.pairs[0].splsrRounded).toBe(0.02);
    expect(r.pass).toBe(true);
  });

  it('10-g uses the 0.10 SPLSR limit (from memory, unsure)', () => {
    const r = simultaneousTransmission({ limitWPerKg: 1.6, sarAveraging: '10g', transmitters: pair(0.04) });
    expect(r.splsrLimit).toBe(0.1);
    expect(r.pass).toBe(true);
  });

  it('a single transmitter over the limit fails (no pair can clear it)', () => {
    const r = simultaneousTransmission({ limitWPerKg: 1.6, transmitters: [{ id: 'a', sarWPerKg: 1.7 }] });
    expect(r.pass).toBe(false);
  });

  it('rejects duplicate ids', () => {
    expect(() =>
      simultaneousTransmission({
        limitWPerKg: 1.6,
        transmitters: [
          { id: 'a', sarWPerKg: 1 },
          { id: 'a', sarWPerKg: 1 },
        ],
      }),
    ).toThrow(/unique/);
  });
});
