/**
 * Demo filings that show every review state after `npm start`: a badge in review with a comment
 * thread (the approver asked, the specialist answered), and a gateway whose version 1 is signed
 * and frozen while version 2 is a draft with a higher Wi-Fi tune-up power. Fictional devices of
 * the fictional Halden Ridge Instruments; every combination is exempt and each filing carries the
 * evidence it needs (tune-up table, manual, label), so nothing blocks signing.
 */
import type { Db } from '../db/client';
import type { Config } from '../server/env';
import { SIGNING_STATEMENT } from '../constants/schemas/review';
import { DEVICE_FILE_FORMAT, zDeviceFile, type DeviceFileInput } from '../constants/schemas/device-file';
import type { Role } from '../constants/schemas/roles';
import type { ByteStorage } from '../server/storage';
import { importDeviceFile, saveStep } from '../server/services/filings-service';
import { fileDemoDocuments, type DemoDocument } from './demo-evidence';
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

/** What an exempt FCC + EU wearable must carry: the tune-up table, the manual (read back for its separation), the label. */
const BADGE_DOCUMENTS: DemoDocument[] = [
  { category: 'tune-up-table', title: 'Tune-up power table', fileName: 'WR1-B tune-up table.pdf', pages: [['Tune-up power table, WR1-B', 'Bluetooth LE 2.4 GHz ISM: 4.0 dBm']] },
  {
    category: 'user-manual',
    title: 'User manual, RF-exposure page',
    fileName: 'WR1-B manual RF exposure.pdf',
    pages: [['RF exposure', 'Wear the badge on its lanyard, at least 5 mm from the body.']],
  },
  { category: 'label-drawing', title: 'Label drawing', fileName: 'WR1-B label.pdf', pages: [['Label WR1-B, on the back cover', 'FCC ID: 2BHRI-WR1B (fictional)']] },
];

/** An FCC + ISED gateway: the manual in English and French. */
const GATEWAY_DOCUMENTS: DemoDocument[] = [
  { category: 'tune-up-table', title: 'Tune-up power table', fileName: 'KS1-G tune-up table.pdf', pages: [['Tune-up power table, KS1-G', 'Wi-Fi 802.11b/g/n 2.4 GHz: 17.0 dBm']] },
  {
    category: 'user-manual-bilingual',
    title: 'Installation guide, RF-exposure notice (English and French)',
    fileName: 'KS1-G installation RF exposure.pdf',
    pages: [
      [
        'RF exposure',
        'Install the gateway so that its antenna is at least 20 cm from people.',
        'Exposition aux RF',
        'Installer la passerelle de sorte que son antenne soit à au moins 20 cm des personnes.',
      ],
    ],
  },
  { category: 'label-drawing', title: 'Label drawing', fileName: 'KS1-G label.pdf', pages: [['Label KS1-G, on the base', 'FCC ID: 2BHRI-KS1G, IC: 31415-KS1G (fictional)']] },
];

interface Person {
  id: number;
  name: string;
}

/**
 * Review steps run through the same services as the API; the demo sends no mail. The documents
 * are filed as the specialist would upload them (their bytes in `storage`).
 */
export async function seedReviewDemo(db: Db, storage: ByteStorage, organisationId: number, specialist: Person, approver: Person, demoPassword: string): Promise<number> {
  const ctx: ReviewContext = { db, config: { publicUrl: '' } as Config, mailer: { send: async () => undefined } };
  const spec = { id: specialist.id, name: specialist.name, organisationId, roles: ['specialist'] as Role[] };
  const appr = { id: approver.id, name: approver.name, organisationId, roles: ['approver'] as Role[] };

  const badge = importDeviceFile(db, spec, zDeviceFile.parse(DEMO_BADGE));
  await fileDemoDocuments(db, storage, badge.version.id, spec.id, BADGE_DOCUMENTS);
  await requestReview(ctx, spec, badge.id);
  const thread = addThread(db, appr, badge.id, {
    step: 'use-positions',
    rowRef: 'lanyard',
    body: 'The lanyard clip puts the badge 5 mm from the chest. Is that the closest it gets with the spring clip open?',
  });
  replyToThread(db, spec, badge.id, thread.id, { body: 'Yes — measured on the DVT samples: 5 mm with the clip fully open, 9 mm closed.' });

  const gateway = importDeviceFile(db, spec, zDeviceFile.parse(DEMO_GATEWAY));
  await fileDemoDocuments(db, storage, gateway.version.id, spec.id, GATEWAY_DOCUMENTS);
  await requestReview(ctx, spec, gateway.id);
  await signVersion(ctx, appr, gateway.id, { password: demoPassword, statement: SIGNING_STATEMENT });
  startNextVersion(db, spec, gateway.id);
  const radios = zDeviceFile.parse(DEMO_GATEWAY);
  saveStep(db, spec, gateway.id, 'radios', { antennas: radios.antennas, transmitters: radios.transmitters.map((t) => ({ ...t, maxTuneUpPowerDbm: 20 })) });
  return 2;
}
