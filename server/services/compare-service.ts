/**
 * Two versions of a filing side by side: every changed field, and — computed from each
 * version's own data — every screening row, checklist item, market count and highest reported
 * SAR that moved because of it (change impact). `compareSnapshots` is pure, so the bench times it.
 */
import type { Db } from '../../db/client';
import type { VersionState } from '../../constants/schemas/filings';
import type { ComparisonDto, FieldChange, LabMove, MarketMove, ScreeningMove } from '../../constants/schemas/compare';
import type { ReadinessChecklist, ReadinessInput } from '../../calc/readiness';
import { summarizeScreening } from '../../calc/screening/screen';
import type { VersionScreening } from './version-screening';
import { notFound } from '../http-error';
import * as filingsRepo from '../repos/filings-repo';
import * as repo from '../repos/review-repo';
import type { FilingActor } from './filings-service';
import { readVersionData, readinessInput, screenVersion, type VersionData } from './readiness-service';
import { evaluateReadiness } from '../../calc/readiness';

export interface VersionSnapshot {
  number: number;
  state: VersionState;
  data: VersionData;
  screening: VersionScreening | null;
  checklist: ReadinessChecklist;
  lab: ReadinessInput['lab'];
}

/** Margins that differ by less than this are the same (the screen prints two decimals). */
const MARGIN_SAME_DB = 0.005;

const FIELD_WORDS: Record<string, string> = {
  name: 'name',
  model: 'model',
  applicant: 'applicant',
  productType: 'product type',
  hardwareVersion: 'hardware version',
  firmwareVersion: 'firmware version',
  gainDbi: 'gain',
  location: 'location',
  technology: 'technology',
  band: 'band',
  frequencyMinHz: 'lowest frequency',
  frequencyMaxHz: 'highest frequency',
  maxTuneUpPowerDbm: 'maximum tune-up power',
  dutyCycle: 'duty cycle',
  antennaId: 'antenna',
  kind: 'kind',
  tier: 'tier',
  fccSarScreening: 'FCC SAR screening',
};

/** A value as the user reads it, with the unit its field name carries. */
function show(field: string, v: unknown): string {
  if (v === null || v === undefined || v === '') return '—';
  if (typeof v === 'number') {
    if (field.endsWith('Hz')) return `${+(v / 1e6).toPrecision(8)} MHz`;
    if (field.endsWith('Dbm')) return `${v} dBm`;
    if (field.endsWith('Dbi')) return `${v} dBi`;
    if (field.endsWith('M')) return `${+(v * 1000).toPrecision(6)} mm`;
    return String(v);
  }
  return typeof v === 'object' ? JSON.stringify(v) : String(v);
}

type Flat = Map<string, { step: string; label: string; value: string }>;

/**
 * Fields that name a stored row rather than describe the device: a new version copies every row
 * under new row ids, so comparing them would report an unchanged copy as changed. Rows are matched
 * by their natural keys (the labels a user types: transmitter, antenna and use-position ids, the
 * market's regime) instead.
 */
const ROW_IDENTITY_FIELDS = new Set(['id', 'rowId']);

function flatten(v: VersionData): Flat {
  const out: Flat = new Map();
  const put = (step: string, key: string, label: string, field: string, value: unknown) =>
    out.set(`${step}|${key}|${field}`, { step, label: `${label} · ${FIELD_WORDS[field] ?? field}`, value: show(field, value) });
  const items = (step: string, kind: string, list: { id: string }[]) => {
    for (const item of list)
      for (const [field, value] of Object.entries(item)) if (!ROW_IDENTITY_FIELDS.has(field) && typeof value !== 'object') put(step, `${kind}:${item.id}`, `${kind} ${item.id}`, field, value);
  };
  for (const [field, value] of Object.entries(v.data.device)) if (!ROW_IDENTITY_FIELDS.has(field)) put('device', 'device', 'Device', field, value);
  items('radios', 'Antenna', v.data.radios.antennas);
  items('radios', 'Transmitter', v.data.radios.transmitters);
  items('use-positions', 'Use position', v.data['use-positions'].usePositions);
  for (const p of v.data['use-positions'].usePositions)
    for (const s of p.separations)
      out.set(`use-positions|${p.id}|sep:${s.antennaId}`, { step: 'use-positions', label: `Use position ${p.id} · separation to ${s.antennaId}`, value: show('separationM', s.separationM) });
  items(
    'markets',
    'Market',
    v.data.markets.markets.map((m) => ({ ...m, id: m.regime })),
  );
  for (const g of v.simultaneous) out.set(`co-transmission|${[...g].sort().join('+')}`, { step: 'co-transmission', label: `Co-transmission ${g.join(' + ')}`, value: 'on together' });
  for (const g of v.simultaneousAt ?? [])
    out.set(`co-transmission|${g.usePositionId}|${[...g.transmitterIds].sort().join('+')}`, {
      step: 'co-transmission',
      label: `Co-transmission ${g.transmitterIds.join(' + ')} at ${g.usePositionId}`,
      value: 'on together',
    });
  return out;
}

function fieldChanges(a: VersionData, b: VersionData): FieldChange[] {
  const fa = flatten(a);
  const fb = flatten(b);
  const out: FieldChange[] = [];
  for (const [k, x] of fa) {
    const y = fb.get(k);
    if (!y) out.push({ step: x.step, label: x.label, before: x.value, after: null });
    else if (y.value !== x.value) out.push({ step: x.step, label: x.label, before: x.value, after: y.value });
  }
  for (const [k, y] of fb) if (!fa.has(k)) out.push({ step: y.step, label: y.label, before: null, after: y.value });
  return out;
}

function screeningMoves(a: VersionScreening | null, b: VersionScreening | null): ScreeningMove[] {
  const key = (r: { transmitterId: string; usePositionId: string; regime: string }) => `${r.transmitterId}|${r.usePositionId}|${r.regime}`;
  const ra = new Map((a?.rows ?? []).map((r) => [key(r), r]));
  const rb = new Map((b?.rows ?? []).map((r) => [key(r), r]));
  const out: ScreeningMove[] = [];
  const pick = (r: VersionScreening['rows'][number] | undefined) => (r ? { result: r.result, marginDb: r.marginDb } : null);
  for (const k of new Set([...ra.keys(), ...rb.keys()])) {
    const x = ra.get(k);
    const y = rb.get(k);
    const moved = !x || !y || x.result !== y.result || (x.marginDb === null) !== (y.marginDb === null) || Math.abs((x.marginDb ?? 0) - (y.marginDb ?? 0)) >= MARGIN_SAME_DB;
    if (moved) {
      const r = (x ?? y)!;
      out.push({ transmitterId: r.transmitterId, usePositionId: r.usePositionId, regime: r.regime, before: pick(x), after: pick(y) });
    }
  }
  return out;
}

function marketMoves(a: VersionScreening | null, b: VersionScreening | null): MarketMove[] {
  const sa = summarizeScreening(a?.rows ?? []).byRegime;
  const sb = summarizeScreening(b?.rows ?? []).byRegime;
  const zero = { combinations: 0, exempt: 0, needsEvaluation: 0 };
  const pick = (c: typeof sa.fcc) => (c ? { combinations: c.combinations, exempt: c.exempt, needsEvaluation: c.needsEvaluation } : zero);
  const out: MarketMove[] = [];
  for (const regime of new Set([...Object.keys(sa), ...Object.keys(sb)]) as Set<keyof typeof sa>) {
    const before = pick(sa[regime]);
    const after = pick(sb[regime]);
    if (JSON.stringify(before) !== JSON.stringify(after)) out.push({ regime, before, after });
  }
  return out;
}

function labMoves(a: ReadinessInput['lab'], b: ReadinessInput['lab']): LabMove[] {
  const key = (h: { regime: string; usePositionKind: string }) => `${h.regime}|${h.usePositionKind}`;
  const ha = new Map((a?.highest ?? []).map((h) => [key(h), h]));
  const hb = new Map((b?.highest ?? []).map((h) => [key(h), h]));
  const out: LabMove[] = [];
  for (const k of new Set([...ha.keys(), ...hb.keys()])) {
    const x = ha.get(k)?.reportedSarWPerKg ?? null;
    const y = hb.get(k)?.reportedSarWPerKg ?? null;
    if (x !== y) {
      const [regime, usePositionKind] = k.split('|');
      out.push({ regime, usePositionKind, before: x, after: y });
    }
  }
  return out;
}

export function compareSnapshots(filingId: number, a: VersionSnapshot, b: VersionSnapshot): ComparisonDto {
  const statusA = new Map(a.checklist.items.map((i) => [i.id, i]));
  const checklist = b.checklist.items
    .filter((i) => statusA.get(i.id)?.status !== i.status || statusA.get(i.id)?.findings.length !== i.findings.length)
    .map((i) => ({ id: i.id, title: i.title, severity: i.severity, before: statusA.get(i.id)?.status ?? 'not-applicable', after: i.status }));
  return {
    filingId,
    from: { number: a.number, state: a.state },
    to: { number: b.number, state: b.state },
    fields: fieldChanges(a.data, b.data),
    impact: { screening: screeningMoves(a.screening, b.screening), checklist, markets: marketMoves(a.screening, b.screening), lab: labMoves(a.lab, b.lab) },
    cautions: [
      'Results are engineering estimates or summaries of lab measurements, recomputed from each version’s own data.',
      'The certifying body and accredited labs decide; follow the applicable regulations and local codes.',
    ],
  };
}

export function snapshotOf(db: Db, version: repo.VersionRow, fallbackDeviceId: number): VersionSnapshot {
  const data = readVersionData(db, version, fallbackDeviceId);
  const screening = screenVersion(data);
  const input = readinessInput(db, version.id, data, screening);
  return { number: version.number, state: version.state as VersionState, data, screening, checklist: evaluateReadiness(input), lab: input.lab };
}

export function compareVersions(db: Db, actor: FilingActor, filingId: number, from: number, to: number): ComparisonDto {
  const row = filingsRepo.findFiling(db, actor.organisationId, filingId);
  if (!row) throw notFound('No such filing in your organisation.');
  const va = repo.findVersion(db, filingId, from);
  const vb = repo.findVersion(db, filingId, to);
  if (!va || !vb) throw notFound(`This filing has no version ${!va ? from : to}.`);
  return compareSnapshots(filingId, snapshotOf(db, va, row.filing.deviceId), snapshotOf(db, vb, row.filing.deviceId));
}
