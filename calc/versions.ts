/**
 * Versions stamped on every stored result, so a signed filing recomputes to the same numbers.
 * Bump ENGINE_VERSION when a formula's code changes results; bump RULE_SET_VERSION when a
 * limit, threshold or table value (data) changes.
 */
export const ENGINE_VERSION = '1.4.1';

/**
 * The rule-set edition: the documents and editions the limit tables were taken from. The suffix
 * names what the Canadian rules rest on: RSS-102 Issue 5 (March 2015), which Issue 6 (15 Dec 2023,
 * mandatory for new certifications after a one-year transition) superseded; Issue 6's exemption
 * tables are not in this rule set.
 */
export const RULE_SET_VERSION = '2026.12.1+rss102-issue5';
export const RULE_SET_DOCUMENTS = [
  '47 CFR §1.1307(b)(3) and §1.1310 (as amended by FCC 19-126, 85 FR 18131)',
  'FCC KDB 447498 D01 v06; KDB 865664 D01 v01r04',
  'ISED RSS-102 Issue 5 (with Amendment 1, 2021)',
  'Council Recommendation 1999/519/EC; EN 62479:2010',
  'ICNIRP 1998 (Health Phys. 74:494); ICNIRP 2020 (Health Phys. 118:483)',
  'IEC/IEEE 62209-1528:2020',
] as const;

/** The edition every ISED screening result rests on, said in each ISED row. */
export const ISED_RULE_EDITION = 'RSS-102 Issue 5 (March 2015)';

/** Why an ISED exemption is provisional until the RSS-102 Issue 6 tables are in the rule set. */
export const ISED_PROVISIONAL_REASON =
  'Provisional: rests on RSS-102 Issue 5 §2.5 (Table 1 largely from memory). Issue 6 (15 Dec 2023; mandatory for new certifications after a one-year transition) revised the exemption limits, and its tables are not in this rule set — confirm the exemption against RSS-102 Issue 6 before relying on it.';

export interface RuleSetWarning {
  code: 'ised-rss102-issue5';
  regime: 'ised';
  message: string;
}

/**
 * Warnings a filing's checks carry for the markets it names (pure, for the step list and the
 * readiness rules): Canada's screening rests on a superseded RSS-102 issue.
 */
export function ruleSetWarnings(regimes: readonly string[]): RuleSetWarning[] {
  if (!regimes.includes('ised')) return [];
  return [
    {
      code: 'ised-rss102-issue5',
      regime: 'ised',
      message:
        'Canada (ISED): screening rests on RSS-102 Issue 5, which Issue 6 superseded; its exemption tables are not in this rule set yet, so every ISED exemption is provisional — confirm it against Issue 6.',
    },
  ];
}
