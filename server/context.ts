/** What routes and services need from the running app, built once by createApp(). */
import type { Db } from '../db/client';
import type { CalcPool } from './calc-pool';
import type { Config } from './env';
import type { Mailer } from './services/mailer';
import type { ReadCaches } from './read-caches';
import type { Storages } from './storage';

/** A version that was just signed (the signing transaction has committed). */
export interface SignedVersion {
  organisationId: number;
  filingId: number;
  versionNumber: number;
  signerUserId: number;
}

export interface AppContext {
  db: Db;
  config: Config;
  mailer: Mailer;
  /** Where bytes live (evidence uploads, packages); see server/storage. */
  storage: Storages;
  /** Worker threads for calculations through the API (off the event loop, with a time limit). */
  calcPool: CalcPool;
  /** Caches of hot reads, emptied by any database write (server/read-caches.ts). */
  readCaches: ReadCaches;
  /** Called once a version is signed: the app queues the build of its package. */
  onVersionSigned?: (signed: SignedVersion) => void;
}
