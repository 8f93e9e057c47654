/**
 * A filing that can be signed, for the package tests, made the way people make it through the
 * API: the specialist imports the device, the test engineer enters the lab's results (every
 * check in tolerance) and uploads the evidence, the specialist asks for review and the approver
 * signs with a fresh password. A fictional asset tag of the fictional Halden Ridge Instruments:
 * Bluetooth LE and Wi-Fi on one antenna, FCC and EU, exempt from testing in every position, and
 * measured by the lab anyway, so its exhibit carries both the screening and the lab results.
 */
import { createHash } from 'node:crypto';
import type request from 'supertest';
import { expect } from 'vitest';
import { DEVICE_FILE_FORMAT, type DeviceFileInput } from '../../../constants/schemas/device-file';
import type { BudgetComponent, Instrument, LiquidCheck, MeasurementInput, SystemCheck } from '../../../constants/schemas/lab';
import { SIGNING_STATEMENT } from '../../../constants/schemas/review';
import { makePdf } from '../../../seeds/documents';
import { DEMO_BUDGET } from '../../../seeds/demo-lab';
import { TEST_PASSWORD } from './test-app';

type Agent = request.Agent;

export const TAG_DEVICE: DeviceFileInput = {
  format: DEVICE_FILE_FORMAT,
  device: { name: 'Wren W2 asset tag', model: 'WR2-T', applicant: 'Halden Ridge Instruments', productType: 'wearable', hardwareVersion: 'DVT', firmwareVersion: '0.9.4' },
  markets: [
    { regime: 'fcc', tier: 'general', fccSarScreening: 'exemption' },
    { regime: 'eu', tier: 'general' },
  ],
  antennas: [{ id: 'ANT-2G4', gainDbi: 0.5, location: 'Chip antenna, top edge' }],
  transmitters: [
    { id: 'BT-LE', technology: 'Bluetooth LE', band: '2.4 GHz ISM', frequencyMinHz: 2402e6, frequencyMaxHz: 2480e6, maxTuneUpPowerDbm: 4, dutyCycle: 0.35, antennaId: 'ANT-2G4' },
    { id: 'WLAN-2G4', technology: 'Wi-Fi 802.11b/g/n', band: '2.4 GHz', frequencyMinHz: 2412e6, frequencyMaxHz: 2462e6, maxTuneUpPowerDbm: 6, dutyCycle: 0.5, antennaId: 'ANT-2G4' },
  ],
  usePositions: [
    { id: 'lanyard', kind: 'body-worn', separations: [{ antennaId: 'ANT-2G4', separationM: 0.015 }] },
    { id: 'wrist', kind: 'extremity', separations: [{ antennaId: 'ANT-2G4', separationM: 0.005 }] },
  ],
  simultaneous: [],
};

const scan = (id: string, transmitterId: string, usePositionId: string, mhz: number, sepMm: number, powerDbm: number, sar1g: number, sar10g: number, drift: number): MeasurementInput => ({
  id,
  transmitterId,
  usePositionId,
  testPosition: usePositionId === 'lanyard' ? 'back, 15 mm' : 'strap side, 5 mm',
  channel: mhz === 2440 ? '19' : '6',
  frequencyHz: mhz * 1e6,
  testSeparationM: sepMm / 1000,
  measuredPowerDbm: powerDbm,
  sar1gWPerKg: sar1g,
  sar10gWPerKg: sar10g,
  driftDb: drift,
  testDate: '2026-11-18',
  peakXMm: 4,
  peakYMm: 12,
  liquidCheckId: 'L-2450',
  systemCheckId: 'S-2450',
});

export const TAG_LAB: { measurements: MeasurementInput[]; liquidChecks: LiquidCheck[]; systemChecks: SystemCheck[]; instruments: Instrument[]; components: BudgetComponent[] } = {
  measurements: [
    scan('T01', 'BT-LE', 'lanyard', 2440, 15, 3.7, 0.0213, 0.0098, -0.03),
    scan('T02', 'BT-LE', 'wrist', 2440, 5, 3.7, 0.0647, 0.0301, 0.02),
    scan('T03', 'WLAN-2G4', 'lanyard', 2437, 15, 5.7, 0.0518, 0.0244, 0.04),
    scan('T04', 'WLAN-2G4', 'wrist', 2437, 5, 5.7, 0.161, 0.0752, -0.05),
  ],
  liquidChecks: [{ id: 'L-2450', date: '2026-11-18', liquid: 'head', frequencyHz: 2450e6, relativePermittivity: 39.4, conductivitySPerM: 1.82, temperatureC: 22.1 }],
  systemChecks: [{ id: 'S-2450', date: '2026-11-18', frequencyHz: 2450e6, dipoleSerial: 'HR-D2450-0871', averagingMass: '1g', measuredSarWPerKgPerW: 53.9, targetSarWPerKgPerW: 52.4 }],
  instruments: [
    { id: 'PROBE-1', kind: 'probe', model: 'Isotropic E-field probe', serial: 'EP-7462', calibrationDate: '2026-05-18', dueDate: '2027-05-18' },
    { id: 'DAE-1', kind: 'dae', model: 'Data acquisition unit', serial: 'DA-1583', calibrationDate: '2026-02-10', dueDate: '2027-02-10' },
    { id: 'DIP-2450', kind: 'dipole', model: '2450 MHz validation dipole', serial: 'HR-D2450-0871', calibrationDate: '2026-01-12', dueDate: '2027-01-12' },
    { id: 'PM-1', kind: 'power-meter', model: 'Dual-channel power meter', serial: 'PM-30917', calibrationDate: '2026-06-22', dueDate: '2027-06-22' },
  ],
  components: DEMO_BUDGET,
};

export interface UploadedEvidence {
  category: string;
  fileName: string;
  bytes: Buffer;
  sha256: string;
}

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

/** A JPEG: start and end markers around enough bytes that it is worth storing uncompressed. */
const jpeg = (fill: number) => Buffer.concat([Buffer.from('ffd8ffe000104a46494600010100000100010000', 'hex'), Buffer.alloc(40_000, fill), Buffer.from('ffd9', 'hex')]);

/** One file for every category a filing with SAR results asks for. */
export async function tagEvidence(): Promise<Omit<UploadedEvidence, 'sha256'>[]> {
  const pdf = (lines: string[]) => makePdf([lines]);
  return [
    { category: 'test-report', fileName: 'WR2-T SAR report.pdf', bytes: await pdf(['SAR test report', 'Wren W2 asset tag, model WR2-T']) },
    { category: 'report-appendix', fileName: 'SAR plots.pdf', bytes: await pdf(['SAR plots, scans T01 to T04']) },
    { category: 'calibration-certificate', fileName: 'probe EP-7462 calibration.pdf', bytes: await pdf(['Calibration certificate', 'E-field probe EP-7462']) },
    { category: 'check-records', fileName: 'liquid and system checks.csv', bytes: Buffer.from('id,frequency_Hz,eps_r,sigma_S_per_m\r\nL-2450,2450000000,39.4,1.82\r\n') },
    { category: 'setup-photos', fileName: 'lanyard back 15 mm.jpg', bytes: jpeg(7) },
    { category: 'tune-up-table', fileName: 'tune-up table.pdf', bytes: await pdf(['Tune-up power table, WR2-T', 'Bluetooth LE: 4.0 dBm', 'Wi-Fi 2.4 GHz: 6.0 dBm']) },
    { category: 'user-manual', fileName: 'manual RF exposure.pdf', bytes: await pdf(['RF exposure', 'Wear the tag on its lanyard.']) },
    { category: 'label-drawing', fileName: 'label.pdf', bytes: await pdf(['Label artwork, WR2-T']) },
  ];
}

export async function uploadEvidence(engineer: Agent, filingId: number, files: Omit<UploadedEvidence, 'sha256'>[]): Promise<UploadedEvidence[]> {
  const out: UploadedEvidence[] = [];
  for (const f of files) {
    const res = await engineer.post(`/api/filings/${filingId}/evidence`).field('category', f.category).attach('file', f.bytes, { filename: f.fileName });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    out.push({ ...f, sha256: sha256(f.bytes) });
  }
  return out;
}

export async function putLab(engineer: Agent, filingId: number, lab: Partial<typeof TAG_LAB>) {
  const sets = [
    ['liquid-checks', 'liquidChecks'],
    ['system-checks', 'systemChecks'],
    ['instruments', 'instruments'],
    ['uncertainty-budget', 'components'],
    ['measurements', 'measurements'],
  ] as const;
  for (const [path, key] of sets) {
    if (!lab[key]) continue;
    const res = await engineer.put(`/api/filings/${filingId}/${path}`).send({ [key]: lab[key] });
    expect(res.status, `${path}: ${JSON.stringify(res.body)}`).toBe(200);
  }
}

/** The tag filing with its lab data and evidence, ready for review; returns its id. */
export async function tagFiling(specialist: Agent, engineer: Agent) {
  const created = await specialist.post('/api/filings/import').send(TAG_DEVICE);
  expect(created.status, JSON.stringify(created.body)).toBe(201);
  const filingId = created.body.filing.id as number;
  await putLab(engineer, filingId, TAG_LAB);
  const evidence = await uploadEvidence(engineer, filingId, await tagEvidence());
  return { filingId, evidence };
}

/** Review and signing through the API; fails with the checklist's words if something blocks. */
export async function requestAndSign(specialist: Agent, approver: Agent, filingId: number) {
  const asked = await specialist.post(`/api/filings/${filingId}/review/request`);
  expect(asked.status, JSON.stringify(asked.body)).toBe(200);
  const signed = await approver.post(`/api/filings/${filingId}/review/sign`).send({ password: TEST_PASSWORD, statement: SIGNING_STATEMENT });
  expect(signed.status, JSON.stringify(signed.body)).toBe(200);
  return signed.body.review.version as { number: number; signature: { signer: { name: string }; signedAt: string; statement: string; contentSha256: string } };
}
