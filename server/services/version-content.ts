/**
 * The canonical content of a filing version and its SHA-256 (FIPS 180-4): every stored row of
 * the version and its stored results, tables in a fixed order, each row's columns sorted by
 * name, the rows of a table sorted by their own serialisation, as one JSON text. The same rows
 * give the same bytes on any start of the server, so a signature can be verified at any time.
 */
import { createHash } from 'node:crypto';
import type { Db } from '../../db/client';
import { LATER_COLUMN_DEFAULTS, readVersionRows, UNHASHED_COLUMNS } from '../repos/review-repo';

/** Bump when the serialisation changes; a signature records the format it was computed with. */
export const CONTENT_FORMAT = 'fieldfile.version-content/1';

function canonicalRow(table: string, row: Record<string, unknown>): string {
  const skip = UNHASHED_COLUMNS[table] ?? [];
  const later = LATER_COLUMN_DEFAULTS[table] ?? {};
  const keys = Object.keys(row)
    .filter((k) => !skip.includes(k) && !(k in later && row[k] === later[k]))
    .sort();
  return JSON.stringify(Object.fromEntries(keys.map((k) => [k, row[k] === undefined ? null : row[k]])));
}

export function canonicalVersionContent(db: Db, versionId: number): string {
  const parts = readVersionRows(db, versionId).map(({ table, rows }) => {
    const serialised = rows.map((r) => canonicalRow(table, r)).sort();
    return `{"table":${JSON.stringify(table)},"rows":[${serialised.join(',')}]}`;
  });
  return `{"format":${JSON.stringify(CONTENT_FORMAT)},"tables":[${parts.join(',')}]}`;
}

export function versionContentSha256(db: Db, versionId: number): string {
  return createHash('sha256').update(canonicalVersionContent(db, versionId), 'utf8').digest('hex');
}
