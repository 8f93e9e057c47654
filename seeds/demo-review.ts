/**
 * Demo filings that show every review state after `npm start`: a badge in review with a comment
 * thread (the approver asked, the specialist answered), and a gateway whose version 1 is signed
 * and frozen while version 2 is a draft with a higher Wi-Fi tune-up power. Fictional devices of
 * the fictional Halden Ridge Instruments; every combination is exempt, so the checklist is clear.
 */
import type { Db } from '../db/client';
import type { Config } from '../server/env';
import { SIGNING_STATEMENT } from '../constants/schemas/review';
import { DEVICE_FILE_FORMAT, zDeviceFile, type DeviceFileInput } from '../constants/schemas/device-file';
import type { Role } from '../constants/schemas/roles';
import { importDeviceFile, saveStep } from '../server/services/filings-service';
import { addThread, replyToThread, requestReview, signVersion, startNextVersion, type ReviewContext } from '../server/services/review-service';

export const DEMO_BADGE: DeviceFileInput = {
  format: DEVICE_FILE_FORMAT,
  device: { name: 'Wren W1 crew badge', model: 'WR1-B', applicant: 'Halden Ridge Instruments', productType: 'wearable', hardwareVersion: 'PVT rev A', firmwareVersion: '1.2.0' },
  markets: [
    { regime: 'fcc', tier: 'general', fccSarScreening: 'exemption' },
    { regime: 'eu', tier: 'general' },
  ],
  antennas: [{ id: 'ANT-BT', gainDbi: 0.5, location: 'Top edge, under the clip' }],
  transmitters: [{ id: 'BT-LE', technology: 'Bluetooth LE', band: '2.4 GHz ISM', frequencyMinHz: 2402e6, frequencyMaxHz: 2480e6, maxTuneUpPowerDbm: 4, dutyCycle: 0.35, antennaId: 'ANT-BT' }],
  usePositions: [{ id: 'lanyard', kind: 'body-worn', separations: [{ antennaId: 'ANT-BT', separationM: 0.005 }] }],
  simultaneous: [],
};

export const DEMO_GATEWAY: DeviceFileInput = {
  format: DEVICE_FILE_FORMAT,
  device: { name: 'Kestrel K1 site gateway', model: 'KS1-G', applicant: 'Halden Ridge Instruments', productType: 'iot-module', hardwareVersion: 'MP', firmwareVersion: '3.0.2' },
  markets: [
    { regime: 'fcc', tier: 'general', fccSarScreening: 'exemption' },
    { regime: 'ised', tier: 'general' },
  ],
  antennas: [{ id: 'ANT-WLAN', gainDbi: 3, location: 'External whip, top' }],
  transmitters: [{ id: 'WLAN-2G4', technology: 'Wi-Fi 802.11b/g/n', band: '2.4 GHz', frequencyMinHz: 2412e6, frequencyMaxHz: 2462e6, maxTuneUpPowerDbm: 17, dutyCycle: 0.98, antennaId: 'ANT-WLAN' }],
  usePositions: [{ id: 'wall-mount', kind: 'far-field', separations: [{ antennaId: 'ANT-WLAN', separationM: 0.2 }] }],
  simultaneous: [],
};

interface Person {
  id: number;
  name: string;
}

/** Review steps run through the same services as the API; the demo sends no mail. */
export async function seedReviewDemo(db: Db, organisationId: number, specialist: Person, approver: Person, demoPassword: string): Promise<number> {
  const ctx: ReviewContext = { db, config: { publicUrl: '' } as Config, mailer: { send: async () => undefined } };
  const spec = { id: specialist.id, name: specialist.name, organisationId, roles: ['specialist'] as Role[] };
  const appr = { id: approver.id, name: approver.name, organisationId, roles: ['approver'] as Role[] };

  const badge = importDeviceFile(db, spec, zDeviceFile.parse(DEMO_BADGE)).id;
  await requestReview(ctx, spec, badge);
  const thread = addThread(db, appr, badge, {
    step: 'use-positions',
    rowRef: 'lanyard',
    body: 'The lanyard clip puts the badge 5 mm from the chest. Is that the closest it gets with the spring clip open?',
  });
  replyToThread(db, spec, badge, thread.id, { body: 'Yes — measured on the DVT samples: 5 mm with the clip fully open, 9 mm closed.' });

  const gateway = importDeviceFile(db, spec, zDeviceFile.parse(DEMO_GATEWAY)).id;
  await requestReview(ctx, spec, gateway);
  await signVersion(ctx, appr, gateway, { password: demoPassword, statement: SIGNING_STATEMENT });
  startNextVersion(db, spec, gateway);
  const radios = zDeviceFile.parse(DEMO_GATEWAY);
  saveStep(db, spec, gateway, 'radios', { antennas: radios.antennas, transmitters: radios.transmitters.map((t) => ({ ...t, maxTuneUpPowerDbm: 20 })) });
  return 2;
}
