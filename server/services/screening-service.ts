/**
 * Screening of a filing's current version: the engine's `screening` calculation over the
 * wizard's data. Each distinct result is stored with the engine and rule-set versions it was
 * computed with, so a signed version can show exactly what it was signed on.
 */
import { createHash } from 'node:crypto';
import { gzipSync } from 'node:zlib';
import { and, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { screeningResults } from '../../db/schema';
import { ENGINE_VERSION, RULE_SET_VERSION } from '../../calc/versions';
import { screeningInput, type ScreeningInput, type ScreeningRegime } from '../../calc/screening/input';
import { SCREENING_CAUTIONS, screenParsed } from '../../calc/screening/screen';
import { screeningDepthProfile } from '../../calc/screening';
import { notFound, unprocessable } from '../http-error';
import { getFiling, type FilingActor } from './filings-service';
import { DATA_STEPS } from '../../constants/schemas/filings';

export interface ScreeningMeta {
  filingId: number;
  version: number;
  engineVersion: string;
  ruleSetVersion: string;
  computedAt: string;
  /** False while a wizard step is incomplete: the table covers only what is entered. */
  complete: boolean;
  cautions: string[];
}


export function screeningInputFor(detail: ReturnType<typeof getFiling>): ScreeningInput {
  return screeningInput.parse({
    markets: detail.data.markets.markets,
    antennas: detail.data.radios.antennas.map((a) => ({ id: a.id, gainDbi: a.gainDbi })),
    transmitters: detail.data.radios.transmitters,
    usePositions: detail.data['use-positions'].usePositions,
  });
}

/** Gzipped responses of recent stored results; a result never changes once stored. */
const GZIP_CACHE_ENTRIES = 32;
const gzipCache = new Map<string, Buffer>();

function rememberGzip(key: string, body: Buffer): Buffer {
  gzipCache.delete(key);
  gzipCache.set(key, body);
  if (gzipCache.size > GZIP_CACHE_ENTRIES) gzipCache.delete(gzipCache.keys().next().value!);
  return body;
}

export type ScreeningResponse = { encoding: 'gzip'; body: Buffer } | { encoding: 'identity'; body: string };

/**
 * The screening of a filing's current data, as the response body. An unchanged filing (same
 * input, engine and rule-set versions) is answered from the stored result without recomputing
 * or re-parsing it: the result is JSON text, and the body is that text with the meta fields in
 * front. A result is about 4 KB a row (every row carries its derivation), so clients that accept
 * gzip get it compressed, once per stored result.
 */
export function screeningResponseForFiling(db: Db, actor: FilingActor, filingId: number, acceptsGzip: boolean): ScreeningResponse {
  const detail = getFiling(db, actor, filingId);
  const input = screeningInputFor(detail);
  const inputJson = JSON.stringify(input);
  const inputSha256 = createHash('sha256').update(inputJson).digest('hex');
  const key = and(
    eq(screeningResults.versionId, detail.version.id),
    eq(screeningResults.inputSha256, inputSha256),
    eq(screeningResults.engineVersion, ENGINE_VERSION),
    eq(screeningResults.ruleSetVersion, RULE_SET_VERSION),
  );
  // Complete when the device data is: the later (lab) steps do not change what screening covers.
  const complete = detail.steps.filter((s) => (DATA_STEPS as readonly string[]).includes(s.step)).every((s) => s.complete);
  const found = db.select({ id: screeningResults.id }).from(screeningResults).where(key).get();
  const cacheKey = found && `${found.id}:${filingId}:${complete}`;
  const cached = cacheKey && acceptsGzip ? gzipCache.get(cacheKey) : undefined;
  if (cached) return { encoding: 'gzip', body: cached };

  let stored = found && db.select({ id: screeningResults.id, output: screeningResults.output, computedAt: screeningResults.computedAt }).from(screeningResults).where(eq(screeningResults.id, found.id)).get();
  if (!stored) {
    const output = JSON.stringify(screenParsed(input));
    stored = db
      .insert(screeningResults)
      .values({ versionId: detail.version.id, engineVersion: ENGINE_VERSION, ruleSetVersion: RULE_SET_VERSION, inputSha256, input: inputJson, output })
      .returning({ id: screeningResults.id, output: screeningResults.output, computedAt: screeningResults.computedAt })
      .get();
  }
  const meta: ScreeningMeta = {
    filingId,
    version: detail.version.number,
    engineVersion: ENGINE_VERSION,
    ruleSetVersion: RULE_SET_VERSION,
    computedAt: stored.computedAt,
    complete,
    cautions: [...SCREENING_CAUTIONS],
  };
  // `{...meta, ...output}` without parsing the stored output: both are JSON objects.
  const body = `${JSON.stringify(meta).slice(0, -1)},${stored.output.slice(1)}`;
  if (!acceptsGzip) return { encoding: 'identity', body };
  return { encoding: 'gzip', body: rememberGzip(`${stored.id}:${filingId}:${complete}`, gzipSync(body, { level: 6 })) };
}

/**
 * SAR against depth in a default head stack for one transmitter at one use position, from the
 * screening table's own figures: the row's evaluated (time-averaged) EIRP at the row's most
 * restrictive frequency — the same engine call that builds the table, restricted to this
 * transmitter and position. `regime` picks the market's row (default: the first market's).
 */
export function depthProfileForFiling(db: Db, actor: FilingActor, filingId: number, q: { transmitterId: string; usePositionId: string; regime?: ScreeningRegime }) {
  const detail = getFiling(db, actor, filingId);
  const input = screeningInputFor(detail);
  const tx = input.transmitters.find((t) => t.id === q.transmitterId);
  const position = input.usePositions.find((p) => p.id === q.usePositionId);
  if (!tx || !position) throw notFound('No such transmitter or use position in this filing.');
  if (!position.separations.some((s) => s.antennaId === tx.antennaId)) {
    throw unprocessable(`“${position.id}” gives no separation for antenna ${tx.antennaId}; add it under Use positions.`);
  }
  const markets = q.regime ? input.markets.filter((m) => m.regime === q.regime) : input.markets;
  if (!markets.length) {
    throw unprocessable(q.regime ? `This filing has no ${q.regime} market; choose one of its markets.` : 'Choose a market under Markets first: the depth estimate uses the screening table’s figures.');
  }
  const { rows } = screenParsed({ ...input, markets: markets.slice(0, 1), transmitters: [tx], usePositions: [position] });
  const row = rows[0];
  const eirpW = row.powers.eirpMw / 1000;
  const profile = screeningDepthProfile({ frequencyHz: row.frequencyHz, eirpW, separationM: row.separationM });
  profile.derivation.notes.push(
    `Figures from the screening table’s ${row.regime} row: time-averaged EIRP ${eirpW.toPrecision(4)} W at its most restrictive frequency ${(row.frequencyHz / 1e6).toPrecision(6)} MHz.`,
  );
  return {
    transmitterId: tx.id,
    usePositionId: position.id,
    basis: { regime: row.regime, frequencyHz: row.frequencyHz, eirpW, separationM: row.separationM, method: row.method },
    ...profile,
    cautions: [
      'A screening estimate from a plane-wave model of layered tissue; it never replaces a SAR measurement where the rules require one.',
      ...SCREENING_CAUTIONS,
    ],
  };
}
