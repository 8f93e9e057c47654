/**
 * The demo device: a fictional rugged handheld tracker by the fictional Halden Ridge Instruments,
 * with LTE (a low band, a band that straddles 1.5 GHz and a mid band that switches between two
 * antennas), Wi-Fi 2.4 and 5 GHz and Bluetooth, and its grant identifiers. Its filing is partly
 * done for two markets: LTE band 12 runs at a reduced power on the belt clip (proximity sensor),
 * and the use positions still lack the Bluetooth antenna's separation at the wrist strap, so the
 * wizard shows what remains.
 */
import { DEVICE_FILE_FORMAT, type DeviceFileInput } from '../constants/schemas/device-file';

export const DEMO_TRACKER: DeviceFileInput = {
  format: DEVICE_FILE_FORMAT,
  device: {
    name: 'Trailhound TH-4 rugged tracker',
    model: 'TH4-LW2',
    applicant: 'Halden Ridge Instruments',
    productType: 'tracker',
    hardwareVersion: 'EVT3 rev C',
    firmwareVersion: '2.4.1',
    // Fictional identifiers in the published formats (47 CFR §2.926; ISED RSP-100).
    fccGranteeCode: '2BHRW',
    fccProductCode: 'TH4LW2',
    isedCompanyNumber: '27861H',
    isedUpn: 'TH4LW2',
    hvin: 'TH4-LW2-C',
    pmn: 'Trailhound TH-4',
    fvin: '2.4',
    modelVariants: [
      { model: 'TH4-LW2-K', difference: 'Kit edition: same radio board and antennas, orange housing and lanyard.' },
      { model: 'TH4-LW2-F', difference: 'Fleet edition: no display backlight; radios identical.' },
    ],
    integration: 'host',
  },
  markets: [
    { regime: 'fcc', tier: 'general', fccSarScreening: 'exemption' },
    { regime: 'eu', tier: 'general' },
  ],
  antennas: [
    { id: 'ANT-MAIN', gainDbi: 1.2, location: 'Top edge, behind the rubber bumper' },
    { id: 'ANT-DIV', gainDbi: -1.5, location: 'Bottom edge, diversity receive / LTE mid band' },
    { id: 'ANT-WLAN', gainDbi: 2.1, location: 'Back cover, upper left' },
  ],
  transmitters: [
    {
      id: 'LTE-B12',
      technology: 'LTE',
      band: 'Band 12',
      frequencyMinHz: 699e6,
      frequencyMaxHz: 716e6,
      maxTuneUpPowerDbm: 24,
      tuneUpTargetDbm: 23,
      tuneUpToleranceDb: 1,
      mode: 'QPSK, 1 RB',
      modulation: 'QPSK',
      bandwidth: '1.4–10 MHz',
      dutyCycle: 1,
      antennaId: 'ANT-MAIN',
    },
    { id: 'LTE-B11', technology: 'LTE', band: 'Band 11/21 (1.43–1.51 GHz)', frequencyMinHz: 1427.9e6, frequencyMaxHz: 1510.9e6, maxTuneUpPowerDbm: 23, dutyCycle: 1, antennaId: 'ANT-MAIN' },
    {
      id: 'LTE-B2',
      technology: 'LTE',
      band: 'Band 2',
      frequencyMinHz: 1850e6,
      frequencyMaxHz: 1910e6,
      maxTuneUpPowerDbm: 23.5,
      tuneUpTargetDbm: 22.5,
      tuneUpToleranceDb: 1,
      mode: 'QPSK, 1 RB',
      modulation: 'QPSK',
      bandwidth: '1.4–20 MHz',
      dutyCycle: 1,
      // Transmit antenna switching: the modem moves the uplink to the main antenna when the
      // bottom edge is covered, so both antennas are screened and tested.
      antennaId: 'ANT-DIV',
      moreAntennaIds: ['ANT-MAIN'],
      antennaUse: 'switched',
    },
    {
      id: 'WLAN-2G4',
      technology: 'Wi-Fi 802.11b/g/n',
      band: '2.4 GHz',
      frequencyMinHz: 2412e6,
      frequencyMaxHz: 2472e6,
      maxTuneUpPowerDbm: 17,
      tuneUpTargetDbm: 16,
      tuneUpToleranceDb: 1,
      mode: '802.11b, 1 Mbit/s',
      modulation: 'DSSS',
      bandwidth: '20 MHz',
      dutyCycle: 0.98,
      antennaId: 'ANT-WLAN',
    },
    { id: 'WLAN-5G', technology: 'Wi-Fi 802.11a/n/ac', band: 'U-NII-1 to U-NII-3', frequencyMinHz: 5180e6, frequencyMaxHz: 5825e6, maxTuneUpPowerDbm: 14, dutyCycle: 0.95, antennaId: 'ANT-WLAN' },
    { id: 'BT-LE', technology: 'Bluetooth LE', band: '2.4 GHz ISM', frequencyMinHz: 2402e6, frequencyMaxHz: 2480e6, maxTuneUpPowerDbm: 4, dutyCycle: 0.35, antennaId: 'ANT-WLAN' },
  ],
  usePositions: [
    {
      id: 'belt-clip',
      kind: 'body-worn',
      separations: [
        { antennaId: 'ANT-MAIN', separationM: 0.01 },
        { antennaId: 'ANT-DIV', separationM: 0.01 },
        { antennaId: 'ANT-WLAN', separationM: 0.012 },
      ],
      // The belt clip covers the proximity sensor beside ANT-MAIN: the modem backs LTE band 12 off
      // by 4 dB while it is triggered (our fictional scenario).
      powerModes: [{ transmitterId: 'LTE-B12', reducedTuneUpPowerDbm: 20, trigger: 'proximity-sensor' }],
    },
    {
      id: 'in-hand',
      kind: 'extremity',
      separations: [
        { antennaId: 'ANT-MAIN', separationM: 0 },
        { antennaId: 'ANT-DIV', separationM: 0.003 },
        { antennaId: 'ANT-WLAN', separationM: 0 },
      ],
    },
    {
      id: 'wrist-strap',
      kind: 'extremity',
      separations: [
        { antennaId: 'ANT-MAIN', separationM: 0.004 },
        { antennaId: 'ANT-DIV', separationM: 0.02 },
      ],
    },
    {
      id: 'vehicle-dock',
      kind: 'far-field',
      separations: [
        { antennaId: 'ANT-MAIN', separationM: 0.2 },
        { antennaId: 'ANT-DIV', separationM: 0.2 },
        { antennaId: 'ANT-WLAN', separationM: 0.2 },
      ],
    },
  ],
  simultaneous: [
    ['LTE-B2', 'WLAN-2G4'],
    ['LTE-B12', 'WLAN-5G', 'BT-LE'],
  ],
};

/** A second, just-started filing, so the list has more than one entry. */
export const DEMO_DOCK_DEVICE = {
  name: 'Trailhound charging dock with LTE backhaul',
  model: 'TH4-DK1',
  applicant: 'Halden Ridge Instruments',
  productType: 'iot-module' as const,
  hardwareVersion: 'DVT1',
  firmwareVersion: '',
};
