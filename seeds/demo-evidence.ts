/**
 * Evidence for the demo tracker filing: a few small generated PDFs filed by the demo engineer.
 * The label drawing is left out on purpose, so the required list shows a gap; the test report
 * states Band 2's tune-up power as 23.0 dBm where the filing says 23.5 dBm, so the read-back has
 * something to show.
 */
import { Readable } from 'node:stream';
import { and, eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { devices, filings, filingVersions, users } from '../db/schema';
import type { EvidenceCategoryId } from '../constants/schemas/evidence';
import type { ByteStorage } from '../server/storage';
import { insertEvidence } from '../server/repos/evidence-repo';
import { readBack } from '../server/services/evidence-service';
import { READ_BACK_CATEGORIES } from '../server/services/version-readback';
import { makePdf } from './documents';
import { DEMO_TRACKER } from './demo-filing';

export interface DemoDocument {
  category: EvidenceCategoryId;
  title: string;
  fileName: string;
  documentDate?: string;
  pages: string[][];
}

const DOCUMENTS: DemoDocument[] = [
  {
    category: 'test-report',
    title: 'SAR test report, part 1 of 1',
    fileName: 'TH4-LW2 SAR report.pdf',
    pages: [
      ['RF exposure (SAR) test report', 'Model TH4-LW2 - Trailhound TH-4 rugged tracker', 'Applicant: Halden Ridge Instruments', 'Lab: Skarvik Test Laboratory (fictional)'],
      ['Conducted output power', 'LTE Band 12 maximum tune-up power: 24.0 dBm', 'LTE Band 2 maximum tune-up power: 23.0 dBm', 'Wi-Fi 2.4 GHz maximum tune-up power: 17.0 dBm'],
      ['Test positions', 'Body-worn (belt clip) separation distance: 10 mm'],
    ],
  },
  {
    category: 'calibration-certificate',
    title: 'E-field probe calibration certificate',
    fileName: 'probe-calibration.pdf',
    documentDate: '2026-03-02',
    pages: [['Calibration certificate', 'Isotropic E-field probe, serial 4471 (fictional)', 'Calibrated on 2026-03-02']],
  },
  {
    category: 'tune-up-table',
    title: 'Tune-up power table',
    fileName: 'tune-up-table.pdf',
    pages: [['Tune-up power table, TH4-LW2', 'LTE Band 12: 24.0 dBm', 'LTE Band 11/21: 23.0 dBm', 'LTE Band 2: 23.5 dBm', 'Wi-Fi 2.4 GHz: 17.0 dBm', 'Wi-Fi 5 GHz: 14.0 dBm', 'Bluetooth LE: 4.0 dBm']],
  },
  {
    category: 'user-manual',
    title: 'User manual, RF-exposure page',
    fileName: 'manual-rf-exposure.pdf',
    pages: [['RF exposure', 'When worn on the body, keep the tracker in its belt clip, at least 10 mm from the body.']],
  },
];

/** Files the demo documents into the tracker filing's first version (once). */
export async function seedDemoEvidence(db: Db, storage: ByteStorage, organisationId: number): Promise<number> {
  const version = db
    .select({ id: filingVersions.id })
    .from(filingVersions)
    .innerJoin(filings, eq(filings.id, filingVersions.filingId))
    .innerJoin(devices, eq(devices.id, filings.deviceId))
    .where(and(eq(filings.organisationId, organisationId), eq(devices.model, DEMO_TRACKER.device.model), eq(filingVersions.number, 1)))
    .get();
  const engineer = db.select({ id: users.id }).from(users).where(eq(users.email, 'engineer@fieldfile.test')).get();
  if (!version || !engineer) return 0;
  return fileDemoDocuments(db, storage, version.id, engineer.id, DOCUMENTS);
}

/** Generates each document as a PDF, stores its bytes and files it in the version (read back where an upload would be). */
export async function fileDemoDocuments(db: Db, storage: ByteStorage, versionId: number, uploadedByUserId: number, documents: DemoDocument[]): Promise<number> {
  for (const d of documents) {
    const bytes = await makePdf(d.pages, d.title);
    const stored = await storage.put(Readable.from([bytes]));
    insertEvidence(db, {
      versionId,
      category: d.category,
      title: d.title,
      fileName: d.fileName,
      sizeBytes: stored.sizeBytes,
      mediaType: 'application/pdf',
      sha256: stored.sha256,
      documentDate: d.documentDate ?? null,
      uploadedByUserId,
    });
    if (READ_BACK_CATEGORIES.includes(d.category)) await readBack(db, storage, stored.sha256);
  }
  return documents.length;
}
