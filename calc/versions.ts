/**
 * Versions stamped on every stored result, so a signed filing recomputes to the same numbers.
 * Bump ENGINE_VERSION when a formula's code changes results; bump RULE_SET_VERSION when a
 * limit, threshold or table value (data) changes.
 */
export const ENGINE_VERSION = '1.0.0';

/** The rule-set edition: the documents and editions the limit tables were taken from. */
export const RULE_SET_VERSION = '2026.12';
export const RULE_SET_DOCUMENTS = [
  '47 CFR §1.1307(b)(3) and §1.1310 (as amended by FCC 19-126, 85 FR 18131)',
  'FCC KDB 447498 D01 v06; KDB 865664 D01 v01r04',
  'ISED RSS-102 Issue 5 (with Amendment 1, 2021)',
  'Council Recommendation 1999/519/EC; EN 62479:2010',
  'ICNIRP 1998 (Health Phys. 74:494); ICNIRP 2020 (Health Phys. 118:483)',
  'IEC/IEEE 62209-1528:2020',
] as const;
