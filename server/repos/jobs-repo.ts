/** Drizzle queries for background jobs (the in-process queue's persistent state). */
import { and, desc, eq, inArray, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { jobs } from '../../db/schema';

export type JobRow = typeof jobs.$inferSelect;
const now = sql`(strftime('%Y-%m-%dT%H:%M:%fZ', 'now'))`;

export function insertJob(db: Db, values: { kind: string; organisationId: number; payload: Record<string, unknown>; requestedByUserId: number | null }): JobRow {
  return db.insert(jobs).values(values).returning().get();
}

export function findJob(db: Db, id: number): JobRow | undefined {
  return db.select().from(jobs).where(eq(jobs.id, id)).get();
}

export function markRunning(db: Db, id: number) {
  db.update(jobs).set({ state: 'running', stage: 'starting', percent: 0, startedAt: now }).where(eq(jobs.id, id)).run();
}

export function setProgress(db: Db, id: number, stage: string, percent: number) {
  db.update(jobs).set({ stage, percent }).where(eq(jobs.id, id)).run();
}

export function markDone(db: Db, id: number, result: Record<string, unknown>) {
  db.update(jobs).set({ state: 'done', stage: 'done', percent: 100, result, finishedAt: now }).where(eq(jobs.id, id)).run();
}

export function markFailed(db: Db, id: number, error: string) {
  db.update(jobs).set({ state: 'failed', error, finishedAt: now }).where(eq(jobs.id, id)).run();
}

/** Jobs left queued or running by a server that stopped: they failed. Returns how many. */
export function failInterrupted(db: Db, error: string): number {
  return db
    .update(jobs)
    .set({ state: 'failed', error, finishedAt: now })
    .where(inArray(jobs.state, ['queued', 'running']))
    .run().changes;
}

/** The newest job of this kind whose payload has this key (e.g. the version being packaged). */
export function latestJobFor(db: Db, kind: string, organisationId: number, payloadKey: string, payloadValue: number | string): JobRow | undefined {
  return db
    .select()
    .from(jobs)
    .where(and(eq(jobs.kind, kind), eq(jobs.organisationId, organisationId), sql`json_extract(${jobs.payload}, ${`$.${payloadKey}`}) = ${payloadValue}`))
    .orderBy(desc(jobs.id))
    .limit(1)
    .get();
}
