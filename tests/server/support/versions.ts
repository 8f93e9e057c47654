/** Test shortcuts on filing versions that the API reaches only through review. */
import type { DbHandle } from '../../../db/client';

/** Marks a version signed without a signature, so its frozen-version triggers apply and version N+1 can start. */
export function markSigned(handle: DbHandle, versionId: number) {
  handle.sqlite.prepare("update filing_versions set state = 'signed' where id = ?").run(versionId);
}
