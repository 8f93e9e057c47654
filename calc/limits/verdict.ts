/**
 * Comparing an evaluated power (or exposure) with a threshold: the verdict and the margin in dB.
 * Every exemption rule here reads "exempt if value ≤ threshold" (47 CFR §1.1307(b)(3)(i),
 * RSS-102 §2.5, KDB 447498 §4.3.1, EN 62479), so equality is exempt.
 */
export interface Verdict {
  exempt: boolean;
  /** 10·log10(threshold / value), dB; positive = headroom; null when value is 0. */
  marginDb: number | null;
}

export function compareToThreshold(value: number, threshold: number): Verdict {
  return {
    exempt: value <= threshold,
    marginDb: value > 0 ? 10 * Math.log10(threshold / value) : null,
  };
}
