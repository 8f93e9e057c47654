/** Health: the database answers a query (a failure throws, and the error handler answers 500). */
import type { Db } from '../../db/client';
import { pingDatabase } from '../repos/health-repo';

export function checkHealth(db: Db): void {
  pingDatabase(db);
}
