/** The health check's one query: the database answers. */
import { sql } from 'drizzle-orm';
import type { Db } from '../../db/client';

export function pingDatabase(db: Db): void {
  db.get(sql`select 1`);
}
