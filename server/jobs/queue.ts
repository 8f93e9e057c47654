/**
 * The job queue: enqueue a job, follow its progress (stage and percent), wait for its result.
 * This implementation runs jobs in this process, one at a time (the build is I/O- and CPU-heavy
 * and the server is small), and keeps each job's state in the `jobs` table, so a job that was
 * running when the server stopped shows as failed after the next start and can be run again.
 * A PostgreSQL-backed queue (e.g. pg-boss) can implement the same interface when several app
 * servers share the work.
 */
import { EventEmitter } from 'node:events';
import type { Db } from '../../db/client';
import * as repo from '../repos/jobs-repo';

export type JobState = 'queued' | 'running' | 'done' | 'failed';

export interface JobStatus {
  id: number;
  kind: string;
  state: JobState;
  stage: string;
  percent: number;
  result: Record<string, unknown> | null;
  error: string | null;
  createdAt: string;
  finishedAt: string | null;
}

export interface JobContext {
  id: number;
  organisationId: number;
  payload: Record<string, unknown>;
  report(stage: string, percent: number): void;
}

export type JobHandler = (job: JobContext) => Promise<Record<string, unknown>>;

export interface JobQueue {
  register(kind: string, handler: JobHandler): void;
  enqueue(kind: string, organisationId: number, payload: Record<string, unknown>, requestedByUserId: number | null): JobStatus;
  get(id: number): JobStatus | undefined;
  /** Calls `listener` on every change of the job until it is done or failed; returns the unsubscribe. */
  subscribe(id: number, listener: (status: JobStatus) => void): () => void;
  /** Resolves with the final status (done or failed). */
  result(id: number): Promise<JobStatus>;
  /** Marks jobs left queued or running by a previous process as failed; returns how many. */
  recoverInterrupted(): number;
}

export const INTERRUPTED = 'The server stopped while this job was running; run it again.';

const toStatus = (row: repo.JobRow): JobStatus => ({
  id: row.id,
  kind: row.kind,
  state: row.state,
  stage: row.stage,
  percent: row.percent,
  result: row.result ?? null,
  error: row.error,
  createdAt: row.createdAt,
  finishedAt: row.finishedAt,
});

export function createInProcessQueue(db: Db): JobQueue {
  const handlers = new Map<string, JobHandler>();
  const events = new EventEmitter();
  events.setMaxListeners(0);
  const pending: number[] = [];
  let running = false;

  const get = (id: number) => {
    const row = repo.findJob(db, id);
    return row && toStatus(row);
  };
  const emit = (id: number) => {
    const status = get(id);
    if (status) events.emit(String(id), status);
  };

  async function runNext() {
    if (running) return;
    const id = pending.shift();
    if (id === undefined) return;
    let row: ReturnType<typeof repo.findJob>;
    try {
      row = repo.findJob(db, id);
    } catch {
      // The database is closed (the app is shutting down): the next start marks what was queued failed.
      pending.length = 0;
      return;
    }
    if (!row) return;
    running = true;
    const handler = handlers.get(row.kind);
    try {
      if (!handler) throw new Error(`No handler for jobs of kind ${row.kind}.`);
      repo.markRunning(db, id);
      emit(id);
      let last = '';
      const report = (stage: string, percent: number) => {
        const p = Math.max(0, Math.min(99, Math.round(percent)));
        if (`${stage}:${p}` === last) return;
        last = `${stage}:${p}`;
        repo.setProgress(db, id, stage, p);
        emit(id);
      };
      const result = await handler({ id, organisationId: row.organisationId, payload: row.payload, report });
      repo.markDone(db, id, result);
    } catch (e) {
      try {
        repo.markFailed(db, id, e instanceof Error ? e.message : String(e));
      } catch {
        // The database is gone (the app is shutting down): the next start marks the job failed.
      }
    } finally {
      try {
        emit(id);
      } catch {
        // As above.
      }
      running = false;
      setImmediate(() => void runNext());
    }
  }

  return {
    register(kind, handler) {
      handlers.set(kind, handler);
    },
    enqueue(kind, organisationId, payload, requestedByUserId) {
      const row = repo.insertJob(db, { kind, organisationId, payload, requestedByUserId });
      pending.push(row.id);
      setImmediate(() => void runNext());
      return toStatus(row);
    },
    get,
    subscribe(id, listener) {
      const key = String(id);
      const wrapped = (s: JobStatus) => listener(s);
      events.on(key, wrapped);
      return () => events.off(key, wrapped);
    },
    result(id) {
      return new Promise((resolve) => {
        const now = get(id);
        if (!now || now.state === 'done' || now.state === 'failed') return resolve(now!);
        const off = this.subscribe(id, (s) => {
          if (s.state === 'done' || s.state === 'failed') {
            off();
            resolve(s);
          }
        });
      });
    },
    recoverInterrupted() {
      return repo.failInterrupted(db, INTERRUPTED);
    },
  };
}
