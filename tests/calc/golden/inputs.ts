/**
 * Fixed inputs whose full engine outputs are stored beside this file (outputs.json) and guarded by
 * tests/calc/golden.test.ts. The devices are fictional; they are chosen to reach every screening
 * rule and branch: FCC (A)/(B)/(C) and the KDB 447498 §4.3.1 a)/b)/c) branches with their rounding,
 * RSS-102 §2.5.1/§2.5.2, EN 62479 / 1999/519/EC / ICNIRP 2020, bands across rule edges, contact and
 * far-field positions. Change them only together with a regenerated outputs.json.
 */
import type { ScreeningInputRaw } from '../../../calc/screening';

const all = [
  { regime: 'fcc', tier: 'general' },
  { regime: 'ised', tier: 'general' },
  { regime: 'eu', tier: 'general' },
  { regime: 'icnirp-2020', tier: 'general' },
] as const;

const antennas = [
  { id: 'ant-a', gainDbi: -1.5 },
  { id: 'ant-b', gainDbi: 2.5 },
];
const transmitters: ScreeningInputRaw['transmitters'] = [
  { id: 'nfc', frequencyMinHz: 13.56e6, frequencyMaxHz: 13.56e6, maxTuneUpPowerDbm: 20, dutyCycle: 1, antennaId: 'ant-a' },
  { id: 'lte-low', frequencyMinHz: 699e6, frequencyMaxHz: 787e6, maxTuneUpPowerDbm: 24, dutyCycle: 1, antennaId: 'ant-a' },
  { id: 'lte-mid', frequencyMinHz: 1427.9e6, frequencyMaxHz: 1785e6, maxTuneUpPowerDbm: 23.5, dutyCycle: 1, antennaId: 'ant-a' },
  { id: 'wifi-2g4', frequencyMinHz: 2412e6, frequencyMaxHz: 2472e6, maxTuneUpPowerDbm: 9.8, dutyCycle: 1, antennaId: 'ant-b' },
  { id: 'ble', frequencyMinHz: 2402e6, frequencyMaxHz: 2480e6, maxTuneUpPowerDbm: 0, dutyCycle: 0.7, antennaId: 'ant-b' },
  { id: 'mmw', frequencyMinHz: 27.5e9, frequencyMaxHz: 28.35e9, maxTuneUpPowerDbm: 10, dutyCycle: 0.5, antennaId: 'ant-b' },
];
const both = (separationM: number) => [
  { antennaId: 'ant-a', separationM },
  { antennaId: 'ant-b', separationM },
];
const usePositions: ScreeningInputRaw['usePositions'] = [
  { id: 'body-5', kind: 'body-worn', separations: both(0.005) },
  { id: 'hand-3', kind: 'extremity', separations: both(0.003) },
  { id: 'lap-100', kind: 'body-worn', separations: both(0.1) },
  { id: 'desk-300', kind: 'far-field', separations: both(0.3) },
];

export const GOLDEN_SCREENING: Record<string, ScreeningInputRaw> = {
  'every-market': { markets: [...all], antennas, transmitters, usePositions },
  'fcc-kdb-occupational': {
    markets: [
      { regime: 'fcc', tier: 'general', fccSarScreening: 'kdb-test-exclusion' },
      { regime: 'eu', tier: 'occupational' },
    ],
    antennas,
    transmitters,
    usePositions,
  },
  // 9.55 mW at 5 mm, 2.45 GHz: the §4.3.1 rounding decides (10 mW → ratio 3.1 > 3.0).
  'kdb-rounding': {
    markets: [{ regime: 'fcc', tier: 'general', fccSarScreening: 'kdb-test-exclusion' }],
    antennas: [{ id: 'a', gainDbi: 0 }],
    transmitters: [{ id: 't', frequencyMinHz: 2.45e9, frequencyMaxHz: 2.45e9, maxTuneUpPowerDbm: 10 * Math.log10(9.55), dutyCycle: 1, antennaId: 'a' }],
    usePositions: [{ id: 'p', kind: 'head', separations: [{ antennaId: 'a', separationM: 0.005 }] }],
  },
  // Several antennas on one transmitter: 2×2 MIMO Wi-Fi (powers add) and switched LTE, each at
  // every antenna; the row names the least favourable one.
  'several-antennas': {
    markets: [
      { regime: 'fcc', tier: 'general' },
      { regime: 'eu', tier: 'general' },
    ],
    antennas,
    transmitters: [
      { id: 'wifi-mimo', frequencyMinHz: 5180e6, frequencyMaxHz: 5825e6, maxTuneUpPowerDbm: 12, dutyCycle: 0.95, antennaId: 'ant-a', moreAntennaIds: ['ant-b'], antennaUse: 'mimo' },
      { id: 'lte-switched', frequencyMinHz: 1850e6, frequencyMaxHz: 1910e6, maxTuneUpPowerDbm: 23, dutyCycle: 1, antennaId: 'ant-a', moreAntennaIds: ['ant-b'], antennaUse: 'switched' },
    ],
    usePositions: [
      {
        id: 'near-b',
        kind: 'body-worn',
        separations: [
          { antennaId: 'ant-a', separationM: 0.02 },
          { antennaId: 'ant-b', separationM: 0.005 },
        ],
      },
      { id: 'no-b', kind: 'body-worn', separations: [{ antennaId: 'ant-a', separationM: 0.01 }] },
    ],
  },
  // Power modes: a hotspot back-off and a proximity-sensor reduction in two positions, full power in the third.
  'power-modes': {
    markets: [
      { regime: 'fcc', tier: 'general' },
      { regime: 'eu', tier: 'general' },
    ],
    antennas,
    transmitters: [{ id: 'lte', frequencyMinHz: 1850e6, frequencyMaxHz: 1910e6, maxTuneUpPowerDbm: 23, dutyCycle: 1, antennaId: 'ant-a' }],
    usePositions: [
      { id: 'hotspot-back', kind: 'hotspot', separations: [{ antennaId: 'ant-a', separationM: 0.01 }], powerModes: [{ transmitterId: 'lte', reducedTuneUpPowerDbm: 17, trigger: 'hotspot-back-off' }] },
      { id: 'body', kind: 'body-worn', separations: [{ antennaId: 'ant-a', separationM: 0.015 }], powerModes: [{ transmitterId: 'lte', reducedTuneUpPowerDbm: 20, trigger: 'proximity-sensor' }] },
      { id: 'far', kind: 'far-field', separations: [{ antennaId: 'ant-a', separationM: 0.2 }] },
    ],
  },
};

/** Depth profiles (calc/screening/depth-profile.ts) at fixed figures. */
export const GOLDEN_DEPTH = {
  'wifi-5mm-head': { frequencyHz: 2.45e9, eirpW: 0.0178, separationM: 0.005, usePositionKind: 'head' },
  'lte-20mm-body': { frequencyHz: 835e6, eirpW: 0.2, separationM: 0.02, usePositionKind: 'body-worn' },
  'wifi-40mm-hotspot': { frequencyHz: 2.45e9, eirpW: 0.1, separationM: 0.04, usePositionKind: 'hotspot' },
  'bt-30mm-limb': { frequencyHz: 2.44e9, eirpW: 0.005, separationM: 0.03, usePositionKind: 'extremity' },
} as const;
