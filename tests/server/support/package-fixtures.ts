/**
 * Stand-ins for what the lab-results, signing and evidence modules record, so the package can be
 * tested with every section filled. Figures are invented for the fictional demo tracker.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import type { Db } from '../../../db/client';
import { filingVersions } from '../../../db/schema';
import type { ExhibitSources, PackageEvidence } from '../../../server/services/exhibit-sources';
import type { ExhibitLab } from '../../../templates/exhibit/model';

export const SIGNED_AT = '2026-11-30T14:05:00.000Z';

export const LAB: ExhibitLab = {
  sarResults: [
    { transmitterId: 'LTE-B12', usePositionId: 'belt-clip', exposureCondition: 'Body-worn', frequencyHz: 707.5e6, averagingMassKg: 0.001, measuredSarWPerKg: 0.874, scalingFactor: 1.148, reportedSarWPerKg: 1.0034, limitWPerKg: 1.6, powerDriftDb: -0.08 },
    { transmitterId: 'LTE-B2', usePositionId: 'belt-clip', exposureCondition: 'Body-worn', frequencyHz: 1880e6, averagingMassKg: 0.001, measuredSarWPerKg: 1.02, scalingFactor: 1.169, reportedSarWPerKg: 1.1924, limitWPerKg: 1.6, powerDriftDb: 0.05 },
    { transmitterId: 'LTE-B2', usePositionId: 'in-hand', exposureCondition: 'Extremity', frequencyHz: 1880e6, averagingMassKg: 0.01, measuredSarWPerKg: 1.71, scalingFactor: 1.169, reportedSarWPerKg: 1.999, limitWPerKg: 4, powerDriftDb: 0.11 },
  ],
  highestReported: [
    { exposureCondition: 'Body-worn', transmitterId: 'LTE-B2', usePositionId: 'belt-clip', reportedSarWPerKg: 1.1924, limitWPerKg: 1.6 },
    { exposureCondition: 'Extremity', transmitterId: 'LTE-B2', usePositionId: 'in-hand', reportedSarWPerKg: 1.999, limitWPerKg: 4 },
  ],
  coTransmission: [{ exposureCondition: 'Body-worn', transmitterIds: ['LTE-B2', 'WLAN-2G4'], sumSarWPerKg: 1.43, limitWPerKg: 1.6, outcome: '✓ Sum within limit' }],
  checks: [{ kind: 'Liquid', label: 'Head liquid, 1880 MHz, εr', date: '2026-11-12', measured: '39.6', target: '40.0', deviationPercent: -1, tolerancePercent: 5, pass: true }],
  instruments: [{ name: 'E-field probe', serial: 'EP-3391', calibratedOn: '2026-03-02', calibrationDueOn: '2027-03-02' }],
  uncertainty: [{ label: '1 g SAR, 300 MHz – 3 GHz', expandedUncertaintyPercent: 22.4, coverageFactor: 2, components: [{ name: 'Probe calibration', valuePercent: 6.05 }] }],
};

export function markSigned(db: Db, versionId: number) {
  db.update(filingVersions).set({ state: 'signed' }).where(eq(filingVersions.id, versionId)).run();
}

/** Evidence files written into `dir`, each with its hash taken "at upload". */
export function writeEvidence(dir: string, files: { category: string; fileName: string; data: Buffer }[]): PackageEvidence[] {
  fs.mkdirSync(dir, { recursive: true });
  return files.map((f, i) => {
    const p = path.join(dir, `${i}-${f.fileName}`);
    fs.writeFileSync(p, f.data);
    return { category: f.category, fileName: f.fileName, sizeBytes: f.data.length, sha256: createHash('sha256').update(f.data).digest('hex'), open: () => fs.createReadStream(p) };
  });
}

export function fullSources(evidence: PackageEvidence[]): Partial<ExhibitSources> {
  return {
    lab: () => structuredClone(LAB),
    readiness: () => ({ asOf: SIGNED_AT, items: [{ label: 'Every transmitter screened in every market', met: true, detail: '42 of 42 combinations' }] }),
    signature: () => ({ signerName: 'Jonas Weber', signerRole: 'Approver', signedAt: SIGNED_AT, statement: 'I approve this RF-exposure exhibit for submission.', contentSha256: null }),
    evidence: () => evidence,
  };
}
