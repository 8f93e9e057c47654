/** What routes and services need from the running app, built once by createApp(). */
import type { Db } from '../db/client';
import type { CalcPool } from './calc-pool';
import type { Config } from './env';
import type { Mailer } from './services/mailer';
import type { Storages } from './storage';

export interface AppContext {
  db: Db;
  config: Config;
  mailer: Mailer;
  /** Where bytes live (evidence uploads, packages); see server/storage. */
  storage: Storages;
  /** Worker threads for calculations through the API (off the event loop, with a time limit). */
  calcPool: CalcPool;
}
