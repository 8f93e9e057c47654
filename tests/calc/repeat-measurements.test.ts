/**
 * repeat-measurements — source: FCC KDB 865664 D01 v01r04 §2.8.1 repeated measurements, as given in
 * FCC KDB 865664 D01 v01r04 (from memory): repeat once at ≥ 0.80 W/kg; second repeat when
 * largest/smallest > 1.20 or any value ≥ 1.45 W/kg; third when any value ≥ 1.5 W/kg and the ratio of
 * the three > 1.20. Thresholds ×2.5 for 10-g extremity, ×5 occupational (from memory, unsure).
 */
import { describe, expect, it } from 'vitest';
import { repeatMeasurements } from '../../calc/lab/repeat-measurements';

describe('repeat-measurements (KDB 865664 D01 §2.8.1, from memory)', () => {
  it('step 1: below 0.80 W/kg no repeat', () => {
    const r = repeatMeasurements({ sarWPerKg: [0.79] });
    expect(r.repeatsRequired).toBe(0);
    expect(r.decided).toBe(true);
    expect(r.nextRepeatRequired).toBe(false);
  });

  it('step 2: exactly 0.80 W/kg needs one repeat; undecided until the repeat is known', () => {
    const r = repeatMeasurements({ sarWPerKg: [0.8] });
    expect(r.repeatsRequired).toBe(1);
    expect(r.decided).toBe(false);
    expect(r.nextRepeatRequired).toBe(true);
  });

  it('step 3: ratio ≤ 1.20 and both < 1.45 W/kg → one repeat only', () => {
    const r = repeatMeasurements({ sarWPerKg: [1.0, 1.2] });
    expect(r.repeatsRequired).toBe(1);
    expect(r.decided).toBe(true);
    expect(r.nextRepeatRequired).toBe(false);
  });

  it('step 3: ratio > 1.20 → second repeat', () => {
    const r = repeatMeasurements({ sarWPerKg: [1.0, 1.25] });
    expect(r.repeatsRequired).toBe(2);
    expect(r.decided).toBe(false);
    expect(r.why.join(' ')).toMatch(/1\.25 > 1\.2/);
  });

  it('step 3: a value ≥ 1.45 W/kg → second repeat even with close values', () => {
    expect(repeatMeasurements({ sarWPerKg: [1.45, 1.44] }).repeatsRequired).toBe(2);
  });

  it('step 4: no third repeat when all < 1.5 W/kg, even if the ratio is > 1.20', () => {
    const r = repeatMeasurements({ sarWPerKg: [1.46, 1.1, 1.2] });
    expect(r.repeatsRequired).toBe(2);
    expect(r.decided).toBe(true);
    expect(r.nextRepeatRequired).toBe(false);
  });

  it('step 4: a value ≥ 1.5 W/kg and ratio of three > 1.20 → third repeat', () => {
    const r = repeatMeasurements({ sarWPerKg: [1.5, 1.2, 1.3] });
    expect(r.repeatsRequired).toBe(3);
    expect(r.nextRepeatRequired).toBe(true);
    expect(repeatMeasurements({ sarWPerKg: [1.5, 1.2, 1.3, 1.4] }).nextRepeatRequired).toBe(false);
  });

  it('step 4: ≥ 1.5 W/kg but ratio of three ≤ 1.20 → no third repeat', () => {
    expect(repeatMeasurements({ sarWPerKg: [1.55, 1.5, 1.45] }).repeatsRequired).toBe(2);
  });

  it('10-g extremity thresholds are ×2.5: 2.0 / 3.625 / 3.75 W/kg (KDB 865664, from memory, unsure)', () => {
    const r = repeatMeasurements({ sarWPerKg: [1.99], exposure: 'extremity-10g' });
    expect(r.repeatsRequired).toBe(0);
    expect(r.thresholdsWPerKg.firstRepeat).toBeCloseTo(2.0, 10);
    expect(r.thresholdsWPerKg.secondRepeat).toBeCloseTo(3.625, 10);
    expect(r.thresholdsWPerKg.thirdRepeat).toBeCloseTo(3.75, 10);
    expect(repeatMeasurements({ sarWPerKg: [2.0], exposure: 'extremity-10g' }).repeatsRequired).toBe(1);
  });

  it('occupational thresholds are ×5: 4.0 W/kg first repeat (from memory, unsure)', () => {
    expect(repeatMeasurements({ sarWPerKg: [3.9], exposure: 'occupational-1g' }).repeatsRequired).toBe(0);
    expect(repeatMeasurements({ sarWPerKg: [4.0], exposure: 'occupational-1g' }).repeatsRequired).toBe(1);
  });

  it('flags extra repeats the rule did not need', () => {
    const r = repeatMeasurements({ sarWPerKg: [0.5, 0.52] });
    expect(r.repeatsRequired).toBe(0);
    expect(r.why.join(' ')).toMatch(/not needed/);
  });

  it('rejects more than four values', () => {
    expect(() => repeatMeasurements({ sarWPerKg: [1, 1, 1, 1, 1] })).toThrow();
  });
});
