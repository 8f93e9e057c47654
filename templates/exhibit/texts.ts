/**
 * The exhibit's words: section titles, explanations, column headings and the cautions. The
 * layouts (pdf.ts, docx.ts) take every string from here, so wording is changed in one place and
 * both documents say the same thing.
 */
import { POWER_MODE_TRIGGER_LABELS, type PowerModeTrigger } from '../../constants/schemas/device-file';
import type { ExhibitModel } from './model';

export const EXHIBIT_TITLE = 'RF-exposure exhibit';

export const SECTION = {
  contents: 'Contents',
  summary: '1  Summary of results',
  device: '2  Device and applicant',
  radios: '3  Antennas and transmitters',
  positions: '4  Use positions and separation distances',
  screening: '5  Exposure screening per market',
  lab: '6  SAR measurements and reported SAR',
  coTransmission: '7  Simultaneous transmission',
  checks: '8  Measurement checks and instruments',
  uncertainty: '9  Measurement uncertainty',
  readiness: '10  Readiness checklist',
  evidence: '11  Evidence files',
  cautions: '12  Cautions',
  appendix: 'Appendix A  How each figure was computed',
} as const;

export const INTRO = {
  summary:
    'Each combination of transmitter, use position and market was screened against the exemption or test-exclusion rule that applies to it. The table counts the outcomes; section 5 lists every combination with its margin.',
  device: 'The device as declared by the applicant for this filing version.',
  radios: 'Every antenna and transmitter with its declared maximum tune-up power; the screening uses these values.',
  positions: 'The positions in which the device is used, and the separation between each antenna and the body in each of them.',
  powerModes:
    'Transmitters that hold their power below the maximum in a use position: the reduced tune-up power (tolerance included), what triggers the reduction, and the reduction from the maximum. Screening uses the reduced power in that position and the maximum everywhere else.',
  powerModesNone: 'No transmitter reduces its power in any use position: screening uses each transmitter’s maximum tune-up power everywhere.',
  screening:
    'For every transmitter, use position and market: the rule that applies, the power screened (the maximum tune-up power, or the reduced power that applies in that position, with its trigger; see section 4), the compared power at the band’s most restrictive frequency, the threshold, the result and the margin (10·log10 of threshold over evaluated value, in dB; negative means over the threshold). The reference in the last column points to the derivation in Appendix A.',
  marginChart: 'Smallest margin of each transmitter over all use positions, per market (dB). Bars left of zero are over the threshold.',
  depthChart: 'SAR against depth in layered tissue for the combination with the smallest margin: a screening estimate from a plane-wave model that explains the margin; it is not a measured SAR.',
  lab: 'Every SAR scan the lab reported, scaled to the maximum tune-up power (never scaled down): reported SAR = scaling × measured SAR, at 1 g and 10 g. The reference in the last column points to the derivation in Appendix A.',
  labUnits:
    'SAR in W/kg; separation as tested; scaling = reported over measured SAR. A dash means the lab gave no value for that averaging mass. The exposure condition of each use position is in the coverage table below.',
  coverage: 'Every transmitter and use position the screening sends to SAR evaluation, and the scans that cover it.',
  coTransmission:
    'For each group of transmitters on together, in every use position and market: the sum of each one’s highest reported SAR (or its estimate where it is exempt from testing) against the limit; in the far field, the sum of each one’s share of its exposure limit.',
  checks:
    'The lab’s liquid, system and calibration checks and the checks of each scan, each with the tolerance it is held to and the source of that tolerance (numbered at the end of this section). Coverage and simultaneous transmission are checked in sections 6 and 7.',
  scanChecks: '✓ within tolerance, ! to look at, × outside tolerance, – not checked. Every mark other than ✓ is explained in the table below.',
  readinessDraft: 'This version is not signed: the checklist as it stands now.',
  labMissing: 'No lab measurements are recorded for this version. Where the screening asks for a SAR or MPE evaluation, the accredited lab’s results belong here.',
  coTransmissionMissing: 'No simultaneous-transmission evaluation is recorded for this version.',
  coTransmissionGroups: 'Transmitters declared as able to transmit at the same time:',
  checksMissing: 'No measurement checks or instruments are recorded for this version.',
  uncertaintyMissing: 'No measurement uncertainty budget is recorded for this version.',
  readinessMissing: 'This version has not been through the readiness review; the checklist is recorded when it is signed.',
  evidence: 'Files delivered in this package with their SHA-256; manifest.json lists the same values for every file.',
  evidenceMissing: 'No evidence files are attached to this version.',
  appendix: 'Every figure in this exhibit, with its formula, the inputs used, intermediate values, the result and the published source.',
  draftNotice: 'DRAFT — this version is not signed. This preview is not for submission.',
  unsigned: 'Not signed. The signature block is completed when an approver signs this version.',
} as const;

export const CAUTIONS = [
  'The figures in this exhibit are engineering estimates from published formulas or summaries of laboratory measurements.',
  'Where the rules require a measurement, only an accredited laboratory’s measurement counts.',
  'The certifying body decides on every filing.',
  'Follow the applicable regulations and local codes; where this exhibit and a regulation differ, the regulation governs.',
] as const;

/** The power a screening row used: the maximum, or a reduced power and its trigger. */
export function powerModeWords(powerMode: string): string {
  return powerMode === 'full' ? 'Maximum' : `Reduced: ${POWER_MODE_TRIGGER_LABELS[powerMode as PowerModeTrigger] ?? powerMode}`;
}

export const RESULT_WORDS: Record<string, string> = {
  exempt: 'Exempt',
  'evaluate-sar': 'SAR evaluation needed',
  'evaluate-mpe': 'MPE evaluation needed',
};

/** Plain ASCII markers beside the result words, so a result never depends on colour. */
export const RESULT_MARKS: Record<string, string> = {
  exempt: '✓',
  'evaluate-sar': '!',
  'evaluate-mpe': '!',
};

export const REGIME_SHORT: Record<string, string> = {
  fcc: 'US FCC',
  ised: 'Canada ISED',
  eu: 'EU RED',
  'icnirp-2020': 'ICNIRP 2020',
};

/** Exposure conditions (a use position's kind) as the exhibit names them. */
export const CONDITION_LABELS: Record<string, string> = {
  head: 'Head',
  'body-worn': 'Body-worn',
  hotspot: 'Hotspot',
  extremity: 'Extremity (hand, limb)',
  'far-field': 'Far field',
};

export const CHECK_KIND_LABELS: Record<string, string> = {
  power: 'Measured power',
  limit: 'SAR limit',
  separation: 'Test separation',
  band: 'Frequency in band',
  drift: 'Power drift',
  liquid: 'Liquid',
  'liquid-temperature': 'Liquid temperature',
  'system-check': 'System check',
  calibration: 'Calibration',
  repeats: 'Repeated scans',
  mass: 'Averaging mass',
  uncertainty: 'Uncertainty budget',
  coverage: 'Coverage',
  'co-transmission': 'Simultaneous transmission',
};

export const CHECK_STATUS_WORDS: Record<string, string> = { pass: '✓ Within', fail: '× Outside', warning: '! Look' };

export const COTX_OUTCOME_WORDS: Record<string, string> = {
  'sum-within-limit': 'Sum within the limit',
  'splsr-within-limit': 'Peak-location ratio within the limit',
  'needs-simultaneous-measurement': 'Needs a simultaneous measurement',
  'over-limit': 'Over the limit',
  incomplete: 'Incomplete: a part is missing',
};

export const READINESS_STATUS_WORDS: Record<string, string> = { pass: '✓ Met', fail: '× Open', 'not-applicable': '– n/a' };

export function documentSubject(m: ExhibitModel): string {
  return `RF-exposure exhibit for ${m.device.name} (${m.device.model}), filing ${m.filingId} version ${m.versionNumber}`;
}

export function coverLines(m: ExhibitModel): [string, string][] {
  return [
    ['Device', m.device.name],
    ['Model', m.device.model],
    ['Applicant', m.device.applicant],
    ['Prepared by', m.organisation],
    ['Filing / version', `Filing ${m.filingId}, version ${m.versionNumber}`],
    ['Status', m.draft ? 'Draft preview — not signed' : 'Signed'],
    ['Date', formatDateTime(m.documentDate)],
    ['Markets', m.markets.map((x) => REGIME_SHORT[x.regime] ?? x.regime).join(', ') || '—'],
    ['Engine / rule set', `${m.screening.engineVersion} / ${m.screening.ruleSetVersion}`],
  ];
}

/** "2026-12-04 15:40 UTC" — exhibits state times in UTC so they read the same everywhere. */
export function formatDateTime(iso: string): string {
  return `${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`;
}
