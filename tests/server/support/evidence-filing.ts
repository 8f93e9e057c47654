/** A complete filing for the evidence tests: FCC and ISED, a hotspot position, LTE at 24 dBm. */
import { DEVICE_FILE_FORMAT, type DeviceFileInput } from '../../../constants/schemas/device-file';

export const EVIDENCE_DEVICE: DeviceFileInput = {
  format: DEVICE_FILE_FORMAT,
  device: { name: 'Kestrel KH-2 field hotspot', model: 'KH2-LTE', applicant: 'Halden Ridge Instruments', productType: 'hotspot', hardwareVersion: 'EVT2', firmwareVersion: '1.0.3' },
  markets: [
    { regime: 'fcc', tier: 'general', fccSarScreening: 'exemption' },
    { regime: 'ised', tier: 'general' },
  ],
  antennas: [{ id: 'ANT1', gainDbi: 1, location: 'Top edge' }],
  transmitters: [{ id: 'LTE-B12', technology: 'LTE', band: 'Band 12', frequencyMinHz: 699e6, frequencyMaxHz: 716e6, maxTuneUpPowerDbm: 24, dutyCycle: 1, antennaId: 'ANT1' }],
  usePositions: [
    { id: 'hotspot-top', kind: 'hotspot', separations: [{ antennaId: 'ANT1', separationM: 0.01 }] },
    { id: 'belt', kind: 'body-worn', separations: [{ antennaId: 'ANT1', separationM: 0.005 }] },
  ],
  simultaneous: [],
};
