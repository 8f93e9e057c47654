/** Applies the committed drizzle-kit migrations in db/migrations; safe to run on every start. */
import path from 'node:path';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import type { DbHandle } from './client';

export const MIGRATIONS_DIR = path.join(__dirname, 'migrations');

export function applyMigrations(db: DbHandle['db']): void {
  migrate(db, { migrationsFolder: MIGRATIONS_DIR });
}
