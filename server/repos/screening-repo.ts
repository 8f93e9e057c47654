/** Drizzle queries for stored screening results (a signed version's result is kept with it). */
import { and, desc, eq, ne } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { screeningResults } from '../../db/schema';

export interface ScreeningKey {
  versionId: number;
  inputSha256: string;
  engineVersion: string;
  ruleSetVersion: string;
}

/** The result stored for this exact input and engine, else the version's latest stored result. */
export function findStoredScreening(db: Db, key: ScreeningKey): { output: string; computedAt: string } | undefined {
  const columns = { output: screeningResults.output, computedAt: screeningResults.computedAt };
  return (
    db
      .select(columns)
      .from(screeningResults)
      .where(
        and(
          eq(screeningResults.versionId, key.versionId),
          eq(screeningResults.inputSha256, key.inputSha256),
          eq(screeningResults.engineVersion, key.engineVersion),
          eq(screeningResults.ruleSetVersion, key.ruleSetVersion),
        ),
      )
      .get() ?? db.select(columns).from(screeningResults).where(eq(screeningResults.versionId, key.versionId)).orderBy(desc(screeningResults.id)).get()
  );
}

/** Makes this the version's one stored result: results stored for other inputs are removed. */
export function replaceStoredScreening(db: Db, key: ScreeningKey, inputJson: string, outputJson: string): void {
  db.delete(screeningResults)
    .where(and(eq(screeningResults.versionId, key.versionId), ne(screeningResults.inputSha256, key.inputSha256)))
    .run();
  db.insert(screeningResults)
    .values({ versionId: key.versionId, engineVersion: key.engineVersion, ruleSetVersion: key.ruleSetVersion, inputSha256: key.inputSha256, input: inputJson, output: outputJson })
    .onConflictDoNothing()
    .run();
}
