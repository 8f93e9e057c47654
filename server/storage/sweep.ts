/**
 * The start-up orphan sweep. Each area's owner registers which hashes its rows reference; an area
 * without a registered source is never swept (so nothing is deleted by omission).
 */
import type { Db } from '../../db/client';
import type { Storages } from './index';
import type { SweepReport } from './byte-storage';

export interface ReferenceSource {
  area: keyof Storages;
  /** Every hash the database still points to in that area (a repo query). */
  referenced(db: Db): Iterable<string>;
}

export async function sweepOrphans(storages: Storages, db: Db, sources: ReferenceSource[], options: { minAgeMs?: number } = {}): Promise<Partial<Record<keyof Storages, SweepReport>>> {
  const reports: Partial<Record<keyof Storages, SweepReport>> = {};
  const areas = [...new Set(sources.map((s) => s.area))];
  for (const area of areas) {
    const keep = new Set<string>();
    for (const s of sources) if (s.area === area) for (const h of s.referenced(db)) keep.add(h);
    reports[area] = await storages[area].sweepOrphans((h) => keep.has(h), options);
  }
  return reports;
}
