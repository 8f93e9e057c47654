/**
 * The engine's quantities in the words of a filing's reader: each derivation key gets a label, the
 * symbol the standard uses, and where its value came from. The engine keeps its structured keys
 * (the exhibit prints from the same data); nothing on screen shows a key itself.
 */
import { USE_POSITION_LABELS, type UsePositionKind } from '../../constants/schemas/device-file';
import { REGIME_SHORT, RESULT_LOOK } from './labels';

export interface QuantityWords {
  label: string;
  /** As the standard writes it (P, d, f, P_th …). */
  symbol?: string;
  /** Where an input's value came from, in the filing. */
  origin?: string;
}

const RADIOS = 'from the Radios step';
const POSITIONS = 'from the Use positions step';

export const QUANTITY_WORDS: Record<string, QuantityWords> = {
  maxTuneUpPowerDbm: { label: 'Maximum tune-up power', symbol: 'P_dBm', origin: `the transmitter’s tune-up power, ${RADIOS}` },
  dutyCycle: { label: 'Duty cycle', origin: `the transmitter’s largest share of time on, ${RADIOS}` },
  antennaGainDbi: { label: 'Antenna gain', symbol: 'G_dBi', origin: `the antenna this transmitter feeds, ${RADIOS}` },
  gainDbi: { label: 'Antenna gain', symbol: 'G_dBi', origin: `the antenna this transmitter feeds, ${RADIOS}` },
  antennaId: { label: 'Antenna', origin: `the antenna evaluated (with several, the least favourable), ${RADIOS}` },
  reducedTuneUpPowerDbm: { label: 'Reduced tune-up power in this position', symbol: 'P_reduced', origin: `the transmitter’s reduced power, ${POSITIONS}` },
  powerMode: { label: 'Power mode', origin: `what triggers the reduction, ${POSITIONS}` },
  mimoStreams: { label: 'MIMO streams on the band', symbol: 'N', origin: `the transmitter’s antennas used at once, ${RADIOS}` },
  streamPowerMw: { label: 'Tune-up power of one stream', symbol: 'P_stream' },
  frequencyMinHz: { label: 'Lowest frequency of the band', origin: RADIOS },
  frequencyMaxHz: { label: 'Highest frequency of the band', origin: RADIOS },
  separationM: { label: 'Separation distance', symbol: 'd', origin: `the use position’s separation for this antenna, ${POSITIONS}` },
  usePositionKind: { label: 'Use position', origin: POSITIONS },
  regime: { label: 'Market', origin: 'from the Markets step' },
  tier: { label: 'Exposure tier', origin: 'from the Markets step' },
  tuneUpPowerMw: { label: 'Tune-up power', symbol: 'P_tune' },
  timeAveragedPowerMw: { label: 'Time-averaged power', symbol: 'P_avg' },
  antennaGainLinear: { label: 'Antenna gain, as a ratio', symbol: 'G' },
  eirpMw: { label: 'Equivalent isotropically radiated power', symbol: 'EIRP' },
  eirpW: { label: 'Equivalent isotropically radiated power', symbol: 'EIRP' },
  erpMw: { label: 'Effective radiated power', symbol: 'ERP' },
  erpW: { label: 'Effective radiated power', symbol: 'ERP' },
  halfWaveDipoleGainDbi: { label: 'Gain of a half-wave dipole' },
  evaluatedQuantity: { label: 'Quantity compared with the threshold' },
  evaluatedValue: { label: 'Evaluated value', symbol: 'P' },
  mostRestrictiveFrequencyHz: { label: 'Most restrictive frequency in the band', symbol: 'f' },
  candidateFrequenciesHz: { label: 'Frequencies checked in the band' },
  frequencyHz: { label: 'Frequency', symbol: 'f' },
  fGHz: { label: 'Frequency', symbol: 'f' },
  fMHz: { label: 'Frequency', symbol: 'f' },
  powerMw: { label: 'Power compared', symbol: 'P' },
  dCm: { label: 'Separation distance', symbol: 'd' },
  distanceM: { label: 'Distance', symbol: 'R' },
  distanceUsedM: { label: 'Distance used', symbol: 'R' },
  minimumDistanceM: { label: 'Smallest distance the formula covers', symbol: 'λ/2π' },
  erp20cmMw: { label: 'Threshold at 20 cm', symbol: 'ERP_20cm' },
  exponentX: { label: 'Exponent', symbol: 'x' },
  thresholdMw: { label: 'Exemption threshold', symbol: 'P_th' },
  thresholdErpW: { label: 'Exemption threshold (ERP)', symbol: 'ERP_th' },
  thresholdEirpW: { label: 'Exemption threshold (EIRP)', symbol: 'EIRP_th' },
  threshold: { label: 'Threshold', symbol: 'P_th' },
  pMaxMw: { label: 'Largest power that meets the basic restriction', symbol: 'P_max' },
  exempt: { label: 'Exempt' },
  excluded: { label: 'Excluded from SAR testing' },
  marginDb: { label: 'Margin', symbol: '10·log10(P_th / P)' },
  result: { label: 'Result' },
  limbWorn: { label: 'Worn on a limb' },
  tableFrequencyMHz: { label: 'Table frequency used', symbol: 'f' },
  tableSeparationMm: { label: 'Table separation used', symbol: 'd' },
  region: { label: 'Body region' },
  sarBasicRestrictionWPerKg: { label: 'SAR basic restriction', symbol: 'SAR_BR' },
  averagingMassG: { label: 'Averaging mass', symbol: 'm_avg' },
  exposure: { label: 'Exposure averaged over' },
  powerDensityWPerM2: { label: 'Power density at the distance', symbol: 'S' },
  powerDensityMwPerCm2: { label: 'Power density at the distance', symbol: 'S' },
  averagingTimeMin: { label: 'Averaging time' },
  averagingTimeS: { label: 'Averaging time' },
  referenceLevelWPerM2: { label: 'Reference level', symbol: 'S_RL' },
};

const TABLE_ENTRY = /^table_(\d+(?:\.\d+)?)MHz_(\d+(?:\.\d+)?)mm$/;
const UNIT_SUFFIX = /(Dbm|Dbi|Db|Hz|MHz|GHz|Mw|W|WPerM2|WPerKg|MwPerCm2|M|Mm|Cm|G|S|Min|Pct)$/;

/** camelCase → "Words in a sentence", without a unit suffix: the last resort for a key not listed. */
export function humanise(key: string): string {
  const words = key
    .replace(UNIT_SUFFIX, '')
    .replace(/_/g, ' ')
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .toLowerCase()
    .trim();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

export function quantityWords(key: string): QuantityWords {
  const known = QUANTITY_WORDS[key];
  if (known) return known;
  const entry = TABLE_ENTRY.exec(key);
  if (entry) return { label: `Table entry at ${entry[1]} MHz, ${entry[2]} mm` };
  return { label: humanise(key) };
}

const TEXT_VALUES: Record<string, string> = {
  general: 'general population',
  occupational: 'occupational',
  'head-trunk': 'head and trunk',
  limbs: 'limbs',
  'whole-body': 'whole body',
  ...Object.fromEntries(Object.entries(RESULT_LOOK).map(([k, v]) => [k, v.label.toLowerCase()])),
};

/** A text or yes/no value in words (codes such as "evaluate-sar" or "body-worn" never reach the screen). */
export function valueWords(key: string, value: string | boolean | number | null): string | null {
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value !== 'string') return null;
  if (key === 'usePositionKind' && value in USE_POSITION_LABELS) return USE_POSITION_LABELS[value as UsePositionKind].toLowerCase();
  if (key === 'regime' && value in REGIME_SHORT) return REGIME_SHORT[value as keyof typeof REGIME_SHORT];
  return TEXT_VALUES[value] ?? value;
}

/** Which derivation quantities explain each figure of a row, most direct first. */
export const FIGURE_QUANTITIES: Record<string, readonly string[]> = {
  frequency: ['mostRestrictiveFrequencyHz', 'candidateFrequenciesHz', 'frequencyMinHz', 'frequencyMaxHz'],
  separation: ['separationM', 'dCm', 'distanceM', 'tableSeparationMm'],
  evaluated: ['evaluatedValue', 'evaluatedQuantity', 'maxTuneUpPowerDbm', 'tuneUpPowerMw', 'dutyCycle', 'timeAveragedPowerMw', 'antennaGainDbi', 'eirpMw', 'erpMw', 'powerDensityWPerM2'],
  threshold: ['threshold', 'thresholdMw', 'thresholdErpW', 'thresholdEirpW', 'pMaxMw', 'referenceLevelWPerM2', 'erp20cmMw', 'exponentX', 'sarBasicRestrictionWPerKg', 'averagingMassG'],
  margin: ['marginDb', 'threshold', 'evaluatedValue'],
  result: ['result', 'exempt', 'excluded', 'marginDb'],
  method: ['result'],
};
