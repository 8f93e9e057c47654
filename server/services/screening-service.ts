/**
 * Screening of a filing's current version: the engine's `screening` calculation over the
 * wizard's data. The result a version is signed on is stored with it, with the engine and
 * rule-set versions it was computed with; drafts are computed on demand and never stored.
 */
import { createHash } from 'node:crypto';
import { gzipSync } from 'node:zlib';
import type { Db } from '../../db/client';
import { findStoredScreening, replaceStoredScreening } from '../repos/screening-repo';
import { ENGINE_VERSION, RULE_SET_VERSION } from '../../calc/versions';
import { antennasOf, screeningInput, type ScreeningInput, type ScreeningRegime } from '../../calc/screening/input';
import { SCREENING_CAUTIONS, screenParsed } from '../../calc/screening/screen';
import { screeningDepthProfile } from '../../calc/screening';
import { notFound, unprocessable } from '../http-error';
import { getFiling, type FilingActor } from './filings-service';
import { ByteLru } from './result-cache';
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
  const modules = detail.data.device.modules;
  return screeningInput.parse({
    markets: detail.data.markets.markets,
    antennas: detail.data.radios.antennas.map((a) => ({ id: a.id, gainDbi: a.gainDbi })),
    // Further antennas and how they are used only where there are any, so a one-antenna
    // transmitter's input is as it was.
    transmitters: detail.data.radios.transmitters.map(({ moreAntennaIds, antennaUse, ...t }) => (moreAntennaIds.length ? { ...t, moreAntennaIds, antennaUse } : t)),
    // Power modes only where a position has any (older inputs hash as before), and only those still
    // below their transmitter's maximum (the Use positions step names the others as problems).
    usePositions: detail.data['use-positions'].usePositions.map(({ powerModes, ...p }) => {
      const below = (powerModes ?? []).filter((m) => {
        const max = detail.data.radios.transmitters.find((t) => t.id === m.transmitterId)?.maxTuneUpPowerDbm;
        return max !== undefined && m.reducedTuneUpPowerDbm < max;
      });
      return below.length ? { ...p, powerModes: below } : p;
    }),
    // Only a host with modules inside names them, so other filings' inputs (and their stored results) stay as they were.
    ...(modules.length ? { modules: modules.map((m) => ({ id: m.id, ...(m.minSeparationM !== undefined ? { minSeparationM: m.minSeparationM } : {}) })) } : {}),
  });
}

/**
 * Computed screening outputs and their gzipped responses, per app instance. Reading never writes
 * to the database: a draft's screening is computed on demand and kept here (keyed by the input's
 * hash and the engine and rule-set versions); a signed version's is the one stored at signing.
 */
export interface ScreeningCache {
  outputs: ByteLru<{ output: string; computedAt: string }>;
  gzipped: ByteLru<Buffer>;
}

/** Room for the few filings being worked on at once (a large filing's output is several MB). */
const OUTPUT_CACHE_BYTES = 64 * 1024 * 1024;
const GZIP_CACHE_BYTES = 16 * 1024 * 1024;

export function createScreeningCache(): ScreeningCache {
  return {
    outputs: new ByteLru(OUTPUT_CACHE_BYTES, (e) => e.output.length * 2),
    gzipped: new ByteLru(GZIP_CACHE_BYTES, (b) => b.length),
  };
}

export type ScreeningResponse = { encoding: 'gzip'; body: Buffer } | { encoding: 'identity'; body: string };

/**
 * The screening of a filing's current data, as the response body. A signed version answers with
 * the result stored at signing; a draft's is computed once per distinct input and kept in the
 * instance's cache. The result is JSON text, and the body is that text with the meta fields in
 * front, without re-parsing. A result is about 4 KB a row (every row carries its derivation), so
 * clients that accept gzip get it compressed, once per result.
 */
export function screeningResponseForFiling(db: Db, cache: ScreeningCache, actor: FilingActor, filingId: number, acceptsGzip: boolean): ScreeningResponse {
  const detail = getFiling(db, actor, filingId);
  const input = screeningInputFor(detail);
  const inputJson = JSON.stringify(input);
  const inputSha256 = createHash('sha256').update(inputJson).digest('hex');
  // Complete when the device data is: the later (lab) steps do not change what screening covers.
  const complete = detail.steps.filter((s) => (DATA_STEPS as readonly string[]).includes(s.step)).every((s) => s.complete);

  const contentKey = `${inputSha256}:${ENGINE_VERSION}:${RULE_SET_VERSION}`;
  let result = detail.version.state === 'signed' ? storedResultOf(db, detail.version.id, inputSha256) : undefined;
  result ??= cache.outputs.get(contentKey);
  result ??= cache.outputs.set(contentKey, { output: JSON.stringify(screenParsed(input)), computedAt: new Date().toISOString() });

  const gzipKey = `${contentKey}:${result.computedAt}:${filingId}:${detail.version.number}:${complete}`;
  const cached = acceptsGzip ? cache.gzipped.get(gzipKey) : undefined;
  if (cached) return { encoding: 'gzip', body: cached };
  const meta: ScreeningMeta = {
    filingId,
    version: detail.version.number,
    engineVersion: ENGINE_VERSION,
    ruleSetVersion: RULE_SET_VERSION,
    computedAt: result.computedAt,
    complete,
    cautions: [...SCREENING_CAUTIONS],
  };
  // `{...meta, ...output}` without parsing the stored output: both are JSON objects.
  const body = `${JSON.stringify(meta).slice(0, -1)},${result.output.slice(1)}`;
  if (!acceptsGzip) return { encoding: 'identity', body };
  return { encoding: 'gzip', body: cache.gzipped.set(gzipKey, gzipSync(body, { level: 6 })) };
}

/** A signed version's screening: the result stored at signing (for this input if there are several). */
function storedResultOf(db: Db, versionId: number, inputSha256: string) {
  return findStoredScreening(db, { versionId, inputSha256, engineVersion: ENGINE_VERSION, ruleSetVersion: RULE_SET_VERSION });
}

/**
 * SAR against depth in the tissue stack of the position's kind for one transmitter at one use position, from the
 * screening table's own figures: the row's evaluated (time-averaged) EIRP at the row's most
 * restrictive frequency — the same engine call that builds the table, restricted to this
 * transmitter and position. `regime` picks the market's row (default: the first market's).
 */
export function depthProfileForFiling(db: Db, actor: FilingActor, filingId: number, q: { transmitterId: string; usePositionId: string; regime?: ScreeningRegime }) {
  const detail = getFiling(db, actor, filingId);
  return {
    ...depthProfileOf(screeningInputFor(detail), q),
    cautions: ['A screening estimate from a plane-wave model of layered tissue; it never replaces a SAR measurement where the rules require one.', ...SCREENING_CAUTIONS],
  };
}

/** The depth profile of one transmitter at one use position from a version's screening input (also used by the exhibit). */
export function depthProfileOf(input: ScreeningInput, q: { transmitterId: string; usePositionId: string; regime?: ScreeningRegime }) {
  const tx = input.transmitters.find((t) => t.id === q.transmitterId);
  const position = input.usePositions.find((p) => p.id === q.usePositionId);
  if (!tx || !position) throw notFound('No such transmitter or use position in this filing.');
  const missing = antennasOf(tx).filter((a) => !position.separations.some((s) => s.antennaId === a));
  if (missing.length) {
    throw unprocessable(`“${position.id}” gives no separation for antenna ${missing.join(', ')}; add it under Use positions.`);
  }
  const markets = q.regime ? input.markets.filter((m) => m.regime === q.regime) : input.markets;
  if (!markets.length) {
    throw unprocessable(q.regime ? `This filing has no ${q.regime} market; choose one of its markets.` : 'Choose a market under Markets first: the depth estimate uses the screening table’s figures.');
  }
  const { rows } = screenParsed({ ...input, markets: markets.slice(0, 1), transmitters: [tx], usePositions: [position] });
  const row = rows[0];
  const eirpW = row.powers.eirpMw / 1000;
  const profile = screeningDepthProfile({ frequencyHz: row.frequencyHz, eirpW, separationM: row.separationM, usePositionKind: position.kind });
  profile.derivation.notes.push(
    `Figures from the screening table’s ${row.regime} row: time-averaged EIRP ${eirpW.toPrecision(4)} W at its most restrictive frequency ${(row.frequencyHz / 1e6).toPrecision(6)} MHz.`,
  );
  return {
    transmitterId: tx.id,
    usePositionId: position.id,
    basis: { regime: row.regime, frequencyHz: row.frequencyHz, eirpW, separationM: row.separationM, method: row.method },
    ...profile,
  };
}

/**
 * Stores the screening of a version's current data as its one result (signing keeps it with the
 * version, so the signature covers it); results stored for earlier data are removed.
 */
export function storeScreeningOf(db: Db, versionId: number, input: ScreeningInput): void {
  const inputJson = JSON.stringify(input);
  const inputSha256 = createHash('sha256').update(inputJson).digest('hex');
  replaceStoredScreening(db, { versionId, inputSha256, engineVersion: ENGINE_VERSION, ruleSetVersion: RULE_SET_VERSION }, inputJson, JSON.stringify(screenParsed(input)));
}
