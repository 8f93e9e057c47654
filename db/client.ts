/**
 * Opens the SQLite file and states its pragmas: WAL so readers never wait for the writer,
 * foreign keys enforced, and a busy timeout so a concurrent writer waits instead of failing.
 */
import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import type { BaseSQLiteDatabase } from 'drizzle-orm/sqlite-core';
import * as schema from './schema';

/** The database or a transaction on it: repos and services accept either. */
export type Db = BaseSQLiteDatabase<'sync', Database.RunResult, typeof schema>;

export interface DbHandle {
  sqlite: Database.Database;
  db: BetterSQLite3Database<typeof schema>;
}

export function openDatabase(file: string): DbHandle {
  const sqlite = new Database(file);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('foreign_keys = ON');
  sqlite.pragma('busy_timeout = 5000');
  sqlite.pragma('synchronous = NORMAL');
  return { sqlite, db: drizzle(sqlite, { schema }) };
}
