/** Words, icons and tones for filing states, markets and screening results (never colour alone). */
import type { ScreeningResult } from '../../calc/screening/rule';
import { POWER_MODE_TRIGGER_LABELS, type MarketRegime, type PowerModeTrigger } from '../../constants/schemas/device-file';
import { VERSION_STATE_LABELS, type VersionState } from '../../constants/schemas/filings';
import type { IconName } from '../icons';
import type { BadgeTone } from '../ui/status-badge';

export const STATE_LOOK: Record<VersionState, { icon: IconName; tone: BadgeTone; label: string }> = {
  draft: { icon: 'pending', tone: 'neutral', label: VERSION_STATE_LABELS.draft },
  'in-review': { icon: 'info', tone: 'caution', label: VERSION_STATE_LABELS['in-review'] },
  returned: { icon: 'warning', tone: 'caution', label: VERSION_STATE_LABELS.returned },
  signed: { icon: 'lock', tone: 'pass', label: VERSION_STATE_LABELS.signed },
};

/** Short market names for lists and table cells; the long ones are REGIME_LABELS. */
export const REGIME_SHORT: Record<MarketRegime, string> = { fcc: 'FCC', ised: 'ISED', eu: 'EU', 'icnirp-2020': 'ICNIRP 2020' };
export const regimeShort = (r: string) => REGIME_SHORT[r as MarketRegime] ?? r;

export const RESULT_LOOK: Record<ScreeningResult, { icon: IconName; tone: BadgeTone; label: string }> = {
  exempt: { icon: 'check', tone: 'pass', label: 'Exempt' },
  'evaluate-sar': { icon: 'warning', tone: 'caution', label: 'Needs SAR' },
  'evaluate-mpe': { icon: 'warning', tone: 'caution', label: 'Needs MPE' },
};

/** Short method names for table cells; the panel shows the full label and source. */
export const METHOD_SHORT: Record<string, string> = {
  'fcc-1mw': 'FCC 1 mW blanket',
  'fcc-sar-exemption': 'FCC SAR-based exemption',
  'fcc-mpe-exemption': 'FCC MPE-based exemption',
  'kdb-447498-exclusion': 'KDB 447498 test exclusion',
  'ised-sar-exemption': 'RSS-102 SAR exemption',
  'ised-rf-exemption': 'RSS-102 RF exemption',
  'en62479-low-power': 'EN 62479 low power',
  'icnirp-2020-low-power': 'ICNIRP 2020 low power',
  'eu-reference-level': 'EU reference level',
  'icnirp-2020-reference-level': 'ICNIRP 2020 reference level',
  'no-applicable-rule': 'No exemption rule',
};
export const methodShort = (m: string) => METHOD_SHORT[m] ?? m;

/** A screening row's power mode in words: full power, or the reduction and its trigger. Rows computed before power modes were all at full power. */
export function powerModeText(mode: string | undefined): string {
  if (!mode || mode === 'full') return 'Full power';
  return `Reduced: ${POWER_MODE_TRIGGER_LABELS[mode as PowerModeTrigger]?.toLowerCase() ?? mode}`;
}
