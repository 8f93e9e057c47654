/**
 * Which stored hashes the database still references, per storage area; the start-up sweep
 * (sweep.ts) removes every other object of an area listed here. Add one line per table that
 * keeps hashes (its query lives in its repo).
 */
import { allEvidenceHashes } from '../repos/evidence-repo';
import type { ReferenceSource } from './sweep';
import { allStorageKeys } from '../repos/packages-repo';

export const referenceSources: ReferenceSource[] = [
  { area: 'uploads', referenced: allEvidenceHashes },
  { area: 'packages', referenced: allStorageKeys },
];
