/**
 * What the exhibit and the package take from other parts of Fieldfile: lab results, the
 * readiness checklist, the signature and the evidence files of a version. Each is a small
 * function so the module that records the data supplies it; until a module is present its
 * section of the exhibit says that nothing is recorded (and no version counts as signed).
 */
import type { Readable } from 'node:stream';
import type { Db } from '../../db/client';
import type { ExhibitLab, ExhibitReadinessItem, ExhibitSignature } from '../../templates/exhibit/model';

export interface PackageEvidence {
  category: string;
  fileName: string;
  sizeBytes: number;
  /** Taken when the file was uploaded, so the build reads each file's bytes once. */
  sha256: string;
  open(): Readable;
}

export interface ExhibitSources {
  lab(db: Db, versionId: number): ExhibitLab | null;
  readiness(db: Db, versionId: number): { asOf: string; items: ExhibitReadinessItem[] } | null;
  /** The signature of a signed version; null while it is not signed. */
  signature(db: Db, versionId: number): ExhibitSignature | null;
  /** The version's evidence files in a fixed order (category, then name). */
  evidence(db: Db, versionId: number): PackageEvidence[];
}

export const defaultExhibitSources: ExhibitSources = {
  lab: () => null,
  readiness: () => null,
  signature: () => null,
  evidence: () => [],
};
