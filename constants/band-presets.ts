/**
 * Band presets for a transmitter: where the device itself transmits, in MHz, with the source of
 * each table. The range stays editable after a preset is picked. Cellular presets carry their
 * downlink (where the device receives) so that a typed range that looks like a downlink, or that
 * spans a duplex gap, can be pointed out.
 *
 * Sources:
 * - LTE: 3GPP TS 36.101, Table 5.5-1 "E-UTRA operating bands" (UL = UE transmit).
 * - NR FR1: 3GPP TS 38.101-1, Table 5.2-1 "NR operating bands in FR1"; FR2: TS 38.101-2, Table 5.2-1.
 * - Wi-Fi 2.4 GHz: IEEE Std 802.11-2020, DSSS/HR-DSSS channel plan, centre = 2407 + 5·n MHz
 *   (n = 1…13); 5 GHz: centre = 5000 + 5·n MHz; 6 GHz (IEEE Std 802.11ax-2021): centre =
 *   5950 + 5·n MHz. The clause numbers of the channel-plan tables are from memory.
 *   Sub-band edges: 47 CFR §15.407 (U-NII-1 to U-NII-3, U-NII-5 to U-NII-8).
 * - Bluetooth: Bluetooth Core Specification v5.x, Vol 6 Part B §1.4.1 (LE: 2402 + 2·k MHz,
 *   k = 0…39) and Vol 2 Part A §2 (BR/EDR: 2402 + k MHz, k = 0…78); section numbers from memory.
 * - Two-way radio and other licensed/ISM ranges: 47 CFR Part 90 (VHF 150–174 MHz, UHF 450–470 MHz,
 *   470–512 MHz), 47 CFR §95.1763 (FRS channels) and §95.1763/§95.1767 (GMRS), ETSI EN 303 405
 *   (PMR446), 47 CFR §15.247 (902–928 MHz), ERC Recommendation 70-03 Annex 1 (863–870 MHz);
 *   section numbers from memory. The wider 136–174 MHz VHF tuning range is common practice.
 */

export const BAND_FAMILIES = ['lte', 'nr', 'wifi', 'bluetooth', 'two-way-radio', 'other'] as const;
export type BandFamily = (typeof BAND_FAMILIES)[number];
export const BAND_FAMILY_LABELS: Record<BandFamily, string> = {
  lte: 'LTE (3GPP TS 36.101)',
  nr: '5G NR (3GPP TS 38.101-1/-2)',
  wifi: 'Wi-Fi (IEEE 802.11)',
  bluetooth: 'Bluetooth',
  'two-way-radio': 'Two-way radio (licensed)',
  other: 'Other',
};

export interface BandPreset {
  /** Stable key, e.g. "lte-b12". */
  key: string;
  family: BandFamily;
  /** What the band field gets, e.g. "Band 12". */
  band: string;
  /** What the technology field gets. */
  technology: string;
  /** Where the device transmits. */
  ulMinMhz: number;
  ulMaxMhz: number;
  /** Where the device receives (paired FDD bands only). */
  dlMinMhz?: number;
  dlMaxMhz?: number;
  duplex: 'FDD' | 'TDD' | 'SDL' | 'SUL' | 'simplex';
  source: string;
}

const LTE_SOURCE = '3GPP TS 36.101 Table 5.5-1';
const NR_SOURCE = '3GPP TS 38.101-1 Table 5.2-1';
const NR2_SOURCE = '3GPP TS 38.101-2 Table 5.2-1';

/** [band, UL min, UL max, DL min, DL max, duplex]; for TDD the DL is the same range. */
type CellRow = [string, number, number, number | null, number | null, BandPreset['duplex']];

const LTE: CellRow[] = [
  ['1', 1920, 1980, 2110, 2170, 'FDD'],
  ['2', 1850, 1910, 1930, 1990, 'FDD'],
  ['3', 1710, 1785, 1805, 1880, 'FDD'],
  ['4', 1710, 1755, 2110, 2155, 'FDD'],
  ['5', 824, 849, 869, 894, 'FDD'],
  ['7', 2500, 2570, 2620, 2690, 'FDD'],
  ['8', 880, 915, 925, 960, 'FDD'],
  ['11', 1427.9, 1447.9, 1475.9, 1495.9, 'FDD'],
  ['12', 699, 716, 729, 746, 'FDD'],
  ['13', 777, 787, 746, 756, 'FDD'],
  ['14', 788, 798, 758, 768, 'FDD'],
  ['17', 704, 716, 734, 746, 'FDD'],
  ['18', 815, 830, 860, 875, 'FDD'],
  ['19', 830, 845, 875, 890, 'FDD'],
  ['20', 832, 862, 791, 821, 'FDD'],
  ['21', 1447.9, 1462.9, 1495.9, 1510.9, 'FDD'],
  ['25', 1850, 1915, 1930, 1995, 'FDD'],
  ['26', 814, 849, 859, 894, 'FDD'],
  ['28', 703, 748, 758, 803, 'FDD'],
  ['29', 0, 0, 717, 728, 'SDL'],
  ['30', 2305, 2315, 2350, 2360, 'FDD'],
  ['34', 2010, 2025, null, null, 'TDD'],
  ['38', 2570, 2620, null, null, 'TDD'],
  ['39', 1880, 1920, null, null, 'TDD'],
  ['40', 2300, 2400, null, null, 'TDD'],
  ['41', 2496, 2690, null, null, 'TDD'],
  ['42', 3400, 3600, null, null, 'TDD'],
  ['46', 5150, 5925, null, null, 'TDD'],
  ['48', 3550, 3700, null, null, 'TDD'],
  ['66', 1710, 1780, 2110, 2200, 'FDD'],
  ['70', 1695, 1710, 1995, 2020, 'FDD'],
  ['71', 663, 698, 617, 652, 'FDD'],
  ['85', 698, 716, 728, 746, 'FDD'],
];

const NR: CellRow[] = [
  ['n1', 1920, 1980, 2110, 2170, 'FDD'],
  ['n2', 1850, 1910, 1930, 1990, 'FDD'],
  ['n3', 1710, 1785, 1805, 1880, 'FDD'],
  ['n5', 824, 849, 869, 894, 'FDD'],
  ['n7', 2500, 2570, 2620, 2690, 'FDD'],
  ['n8', 880, 915, 925, 960, 'FDD'],
  ['n12', 699, 716, 729, 746, 'FDD'],
  ['n13', 777, 787, 746, 756, 'FDD'],
  ['n14', 788, 798, 758, 768, 'FDD'],
  ['n20', 832, 862, 791, 821, 'FDD'],
  ['n25', 1850, 1915, 1930, 1995, 'FDD'],
  ['n26', 814, 849, 859, 894, 'FDD'],
  ['n28', 703, 748, 758, 803, 'FDD'],
  ['n30', 2305, 2315, 2350, 2360, 'FDD'],
  ['n38', 2570, 2620, null, null, 'TDD'],
  ['n40', 2300, 2400, null, null, 'TDD'],
  ['n41', 2496, 2690, null, null, 'TDD'],
  ['n48', 3550, 3700, null, null, 'TDD'],
  ['n66', 1710, 1780, 2110, 2200, 'FDD'],
  ['n70', 1695, 1710, 1995, 2020, 'FDD'],
  ['n71', 663, 698, 617, 652, 'FDD'],
  ['n77', 3300, 4200, null, null, 'TDD'],
  ['n78', 3300, 3800, null, null, 'TDD'],
  ['n79', 4400, 5000, null, null, 'TDD'],
  ['n96', 5925, 7125, null, null, 'TDD'],
];

const NR_FR2: CellRow[] = [
  ['n257', 26500, 29500, null, null, 'TDD'],
  ['n258', 24250, 27500, null, null, 'TDD'],
  ['n260', 37000, 40000, null, null, 'TDD'],
  ['n261', 27500, 28350, null, null, 'TDD'],
];

const cellular = (family: 'lte' | 'nr', technology: string, source: string, rows: CellRow[]): BandPreset[] =>
  rows
    .filter(([, , , , , duplex]) => duplex !== 'SDL')
    .map(([band, ulMin, ulMax, dlMin, dlMax, duplex]) => ({
      key: `${family}-${band}`.toLowerCase(),
      family,
      band: family === 'lte' ? `Band ${band}` : band,
      technology,
      ulMinMhz: ulMin,
      ulMaxMhz: ulMax,
      ...(dlMin !== null && dlMax !== null ? { dlMinMhz: dlMin, dlMaxMhz: dlMax } : {}),
      duplex,
      source,
    }));

/** Downlink-only (SDL) bands: the device never transmits in them; kept to recognise a typed downlink. */
export const DOWNLINK_ONLY: { band: string; dlMinMhz: number; dlMaxMhz: number; source: string }[] = [
  { band: 'LTE Band 29', dlMinMhz: 717, dlMaxMhz: 728, source: LTE_SOURCE },
  { band: 'LTE Band 32', dlMinMhz: 1452, dlMaxMhz: 1496, source: LTE_SOURCE },
  { band: 'NR n75', dlMinMhz: 1432, dlMaxMhz: 1517, source: NR_SOURCE },
];

const WIFI_SOURCE = 'IEEE Std 802.11-2020 channel plan (centre = 2407 + 5·n / 5000 + 5·n MHz); sub-bands 47 CFR §15.407';
const WIFI6_SOURCE = 'IEEE Std 802.11ax-2021 6 GHz channel plan (centre = 5950 + 5·n MHz); sub-bands 47 CFR §15.407';
const BT_SOURCE = 'Bluetooth Core Specification v5.x (LE: 2402 + 2·k MHz, k = 0…39; BR/EDR: 2402 + k MHz, k = 0…78)';

const simplex = (key: string, family: BandFamily, technology: string, band: string, ulMinMhz: number, ulMaxMhz: number, source: string): BandPreset => ({
  key,
  family,
  technology,
  band,
  ulMinMhz,
  ulMaxMhz,
  duplex: 'simplex',
  source,
});

export const BAND_PRESETS: readonly BandPreset[] = [
  ...cellular('lte', 'LTE', LTE_SOURCE, LTE),
  ...cellular('nr', '5G NR', NR_SOURCE, NR),
  ...cellular('nr', '5G NR (FR2)', NR2_SOURCE, NR_FR2),
  // Wi-Fi ranges are the 20 MHz channel centres, which is where the rules evaluate a band's edges.
  simplex('wifi-2g4-us', 'wifi', 'Wi-Fi 802.11b/g/n/ax', '2.4 GHz, channels 1–11', 2412, 2462, WIFI_SOURCE),
  simplex('wifi-2g4-13', 'wifi', 'Wi-Fi 802.11b/g/n/ax', '2.4 GHz, channels 1–13', 2412, 2472, WIFI_SOURCE),
  simplex('wifi-unii-1', 'wifi', 'Wi-Fi 802.11a/n/ac/ax', 'U-NII-1, channels 36–48', 5180, 5240, WIFI_SOURCE),
  simplex('wifi-unii-2a', 'wifi', 'Wi-Fi 802.11a/n/ac/ax', 'U-NII-2A, channels 52–64', 5260, 5320, WIFI_SOURCE),
  simplex('wifi-unii-2c', 'wifi', 'Wi-Fi 802.11a/n/ac/ax', 'U-NII-2C, channels 100–144', 5500, 5720, WIFI_SOURCE),
  simplex('wifi-unii-3', 'wifi', 'Wi-Fi 802.11a/n/ac/ax', 'U-NII-3, channels 149–165', 5745, 5825, WIFI_SOURCE),
  simplex('wifi-5g-all', 'wifi', 'Wi-Fi 802.11a/n/ac/ax', 'U-NII-1 to U-NII-3, channels 36–165', 5180, 5825, WIFI_SOURCE),
  simplex('wifi-6g', 'wifi', 'Wi-Fi 6E 802.11ax', '6 GHz U-NII-5 to U-NII-8, channels 1–233', 5955, 7115, WIFI6_SOURCE),
  simplex('bt-le', 'bluetooth', 'Bluetooth LE', '2.4 GHz ISM, 40 channels', 2402, 2480, BT_SOURCE),
  simplex('bt-bredr', 'bluetooth', 'Bluetooth BR/EDR', '2.4 GHz ISM, 79 channels', 2402, 2480, BT_SOURCE),
  simplex('lmr-vhf', 'two-way-radio', 'Land mobile radio', 'VHF 136–174 MHz', 136, 174, '47 CFR Part 90 (150–174 MHz); 136–174 MHz tuning range common practice'),
  simplex('lmr-uhf', 'two-way-radio', 'Land mobile radio', 'UHF 450–470 MHz', 450, 470, '47 CFR Part 90 (450–470 MHz), from memory'),
  simplex('lmr-uhf-t', 'two-way-radio', 'Land mobile radio', 'UHF T-band 470–512 MHz', 470, 512, '47 CFR Part 90 (470–512 MHz, some US metro areas), from memory'),
  simplex('frs', 'two-way-radio', 'FRS', 'FRS channels 1–22', 462.5625, 467.7125, '47 CFR §95.1763 (FRS channels), from memory'),
  simplex('gmrs', 'two-way-radio', 'GMRS', 'GMRS 462/467 MHz', 462.55, 467.725, '47 CFR §95.1763 (GMRS channels), from memory'),
  simplex('pmr446', 'two-way-radio', 'PMR446', 'PMR446 446.0–446.2 MHz', 446.0, 446.2, 'ETSI EN 303 405; ECC/DEC/(15)05, from memory'),
  simplex('ism-915', 'other', 'LoRa / ISM', '902–928 MHz ISM (US)', 902, 928, '47 CFR §15.247'),
  simplex('srd-868', 'other', 'LoRa / SRD', '863–870 MHz SRD (EU)', 863, 870, 'ERC Recommendation 70-03 Annex 1, from memory'),
];

export const findBandPreset = (key: string) => BAND_PRESETS.find((b) => b.key === key);

const overlaps = (aMin: number, aMax: number, bMin: number, bMax: number) => aMin < bMax && bMin < aMax;
const fmt = (mhz: number) => `${Number(mhz.toFixed(4))}`;
const cellName = (b: BandPreset) => `${b.family === 'lte' ? 'LTE ' : 'NR '}${b.band}`;

/** The parts of [min, max] that none of the intervals cover. */
function uncovered(min: number, max: number, intervals: [number, number][]): [number, number][] {
  let parts: [number, number][] = [[min, max]];
  for (const [lo, hi] of intervals) {
    parts = parts.flatMap(([a, b]): [number, number][] => {
      if (hi <= a || lo >= b) return [[a, b]];
      return [...(lo > a ? [[a, lo] as [number, number]] : []), ...(hi < b ? [[hi, b] as [number, number]] : [])];
    });
  }
  return parts.filter(([a, b]) => b - a > 1e-6);
}

/** The cellular preset a band label names ("Band 12", "B12", "n77"), if any. */
export function presetForBandLabel(label: string): BandPreset | undefined {
  const m = /^\s*(?:lte\s*)?(?:band\s*|b)(\d+)\b/i.exec(label) ?? null;
  if (m) return findBandPreset(`lte-${m[1]}`);
  const n = /^\s*(?:nr\s*)?(n\d+)\b/i.exec(label);
  return n ? findBandPreset(`nr-${n[1].toLowerCase()}`) : undefined;
}

/**
 * Words for a typed transmit range (in MHz) that looks wrong against the cellular tables: wholly
 * inside a downlink (where the device receives), or reaching out of an uplink into a duplex gap
 * or downlink. When the band label names a cellular band, the range is held to that band's
 * uplink. Ranges the presets do not know (satellite, UWB, …) get no warning.
 */
export function bandRangeWarnings(minMhz: number, maxMhz: number, bandLabel = ''): string[] {
  if (!(Number.isFinite(minMhz) && Number.isFinite(maxMhz)) || minMhz > maxMhz) return [];
  const named = presetForBandLabel(bandLabel);
  if (named) {
    const outside = uncovered(minMhz, maxMhz, [[named.ulMinMhz, named.ulMaxMhz]]);
    if (!outside.length) return [];
    const dl = named.dlMinMhz !== undefined && overlaps(minMhz, maxMhz, named.dlMinMhz, named.dlMaxMhz!) ? ', into its downlink (where the device receives)' : '';
    return [`${cellName(named)} transmits at ${fmt(named.ulMinMhz)}–${fmt(named.ulMaxMhz)} MHz (${named.source}); this range reaches outside it${dl}.`];
  }
  const transmit = BAND_PRESETS.map((b): [number, number] => [b.ulMinMhz, b.ulMaxMhz]);
  const downlinks = [...BAND_PRESETS.filter((b) => b.dlMinMhz !== undefined).map((b) => ({ band: cellName(b), dlMinMhz: b.dlMinMhz!, dlMaxMhz: b.dlMaxMhz! })), ...DOWNLINK_ONLY];
  const outside = uncovered(minMhz, maxMhz, transmit);
  const whole = outside.length === 1 && outside[0][0] === minMhz && outside[0][1] === maxMhz;
  if (whole) {
    const dl = downlinks.filter((d) => minMhz >= d.dlMinMhz && maxMhz <= d.dlMaxMhz);
    if (!dl.length) return [];
    const names = [...new Set(dl.map((d) => d.band))].slice(0, 3).join(', ');
    return [`${fmt(minMhz)}–${fmt(maxMhz)} MHz is a downlink (the device receives there): ${names}. Enter the uplink, where the device transmits.`];
  }
  const inGap = outside.filter(([a, b]) =>
    BAND_PRESETS.some((p) => p.dlMinMhz !== undefined && overlaps(minMhz, maxMhz, p.ulMinMhz, p.ulMaxMhz) && overlaps(a, b, Math.min(p.ulMinMhz, p.dlMinMhz!), Math.max(p.ulMaxMhz, p.dlMaxMhz!))),
  );
  if (!inGap.length) return [];
  const gaps = inGap.map(([a, b]) => `${fmt(a)}–${fmt(b)}`).join(', ');
  return [`${gaps} MHz of this range is no uplink: the range spans a duplex gap or a downlink. Split it into the uplinks it covers.`];
}
