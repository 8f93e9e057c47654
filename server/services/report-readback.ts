/**
 * Report read-back: the text of a test-report PDF (pdfjs-dist), and the places where it states a
 * number that disagrees with the filing — tune-up powers, the highest reported SAR per exposure
 * condition, test separations, the model and FCC ID. The comparison is a pure function of the
 * pages' text and the filing's numbers; it reads lines the way a reviewer skims them (a line that
 * names a band and says "tune-up" with a dBm figure, say), so a table laid out in an unusual way
 * may be missed. It flags; it never decides.
 */
import path from 'node:path';
import type { FindingKind } from '../../constants/schemas/evidence';
import { USE_POSITION_LABELS, type UsePositionKind } from '../../constants/schemas/device-file';

export type PdfText = { status: 'read'; pages: string[] } | { status: 'unreadable'; reason: string; pages: string[] };

const STANDARD_FONTS = `${path.join(path.dirname(require.resolve('pdfjs-dist/package.json')), 'standard_fonts')}/`;

interface TextItemLike {
  str: string;
  hasEOL?: boolean;
  transform: number[];
}

/** Joins a page's text items into lines (items on the same baseline, left to right). */
function pageLines(items: TextItemLike[]): string {
  const rows = new Map<number, { x: number; s: string }[]>();
  for (const it of items) {
    if (!it.str) continue;
    const y = Math.round(it.transform[5]);
    const row = rows.get(y) ?? [];
    row.push({ x: it.transform[4], s: it.str });
    rows.set(y, row);
  }
  return [...rows.entries()]
    .sort((a, b) => b[0] - a[0])
    .map(([, row]) =>
      row
        .sort((a, b) => a.x - b.x)
        .map((r) => r.s)
        .join(' ')
        .replace(/\s+/g, ' ')
        .trim(),
    )
    .filter(Boolean)
    .join('\n');
}

/**
 * pdfjs-dist's legacy build bundles core-js, which on import (and again when it loads its worker
 * code) replaces JSON.parse, JSON.stringify and Array.prototype.push with JavaScript versions for
 * the whole process (to add JSON.rawJSON, which Node 20 lacks). They are many times slower and
 * allocate heavily: after the first PDF was read, every JSON answer of the server paid for it (a
 * 5 000-row lab results answer took seconds and hundreds of MB). V8's own are put back after each
 * read; pdfjs works with them (it only reads text here).
 */
const NATIVE_BUILTINS = { parse: JSON.parse, stringify: JSON.stringify, push: Array.prototype.push };
export function restoreNativeBuiltins(): void {
  if (JSON.parse !== NATIVE_BUILTINS.parse) JSON.parse = NATIVE_BUILTINS.parse;
  if (JSON.stringify !== NATIVE_BUILTINS.stringify) JSON.stringify = NATIVE_BUILTINS.stringify;
  // Putting V8's own method back, not extending the prototype.
  // eslint-disable-next-line no-extend-native
  if (Array.prototype.push !== NATIVE_BUILTINS.push) Object.defineProperty(Array.prototype, 'push', { value: NATIVE_BUILTINS.push, writable: true, configurable: true, enumerable: false });
}

/** Reads every page's text. An encrypted or damaged PDF is reported as unreadable, with why. */
export async function extractPdfText(data: Uint8Array): Promise<PdfText> {
  try {
    return await readPdfText(data);
  } finally {
    restoreNativeBuiltins();
  }
}

async function readPdfText(data: Uint8Array): Promise<PdfText> {
  const pdfjs = await import('pdfjs-dist/legacy/build/pdf.mjs');
  let doc: Awaited<ReturnType<typeof pdfjs.getDocument>['promise']> | undefined;
  try {
    // pdfjs refuses a Node Buffer and detaches the memory it is given: hand it a copy.
    const bytes = new Uint8Array(data);
    doc = await pdfjs.getDocument({ data: bytes, isEvalSupported: false, disableFontFace: true, standardFontDataUrl: STANDARD_FONTS, verbosity: 0 }).promise;
    const pages: string[] = [];
    for (let n = 1; n <= doc.numPages; n++) {
      const page = await doc.getPage(n);
      const content = await page.getTextContent();
      pages.push(pageLines(content.items as TextItemLike[]));
      page.cleanup();
    }
    return { status: 'read', pages };
  } catch (err) {
    const e = err as { name?: string; message?: string };
    const reason = e.name === 'PasswordException' ? 'The PDF is encrypted with a password, so its text could not be read.' : `The PDF could not be read (${e.message ?? 'damaged file'}).`;
    return { status: 'unreadable', reason, pages: [] };
  } finally {
    await doc?.destroy();
  }
}

export interface FilingNumbers {
  model: string;
  fccId?: string | null;
  tuneUps: { transmitterId: string; band: string; tuneUpPowerDbm: number }[];
  separations: { kind: UsePositionKind; separationMm: number }[];
  /** Highest reported SAR per exposure condition from the lab results, W/kg (empty before any). */
  highestReportedSar: { kind: UsePositionKind; sarWPerKg: number }[];
}

export interface ReadBackDraft {
  key: string;
  kind: FindingKind;
  page: number | null;
  message: string;
  reportValue: string | null;
  filingValue: string | null;
  /** For a tune-up finding: the transmitter and the report's figure (the readiness rules compare them). */
  tuneUp?: { transmitterId: string; reportTuneUpPowerDbm: number };
}

const CONDITION_PATTERNS: [UsePositionKind, RegExp][] = [
  ['head', /\bhead\b/i],
  ['body-worn', /\bbody[- ]?worn\b/i],
  ['hotspot', /\bhot[- ]?spot\b/i],
  ['extremity', /\b(extremity|limb)\b/i],
];

const numbersWithUnit = (line: string, unit: RegExp) =>
  [...line.matchAll(new RegExp(`(\\d+(?:[.,]\\d+)?)\\s*(?:${unit.source})`, 'gi'))].map((m) => ({
    value: Number(m[1].replace(',', '.')),
    index: m.index ?? 0,
  }));

const fmt = (v: number, digits = 2) => String(Number(v.toFixed(digits)));
const conditionLabel = (k: UsePositionKind) => USE_POSITION_LABELS[k].toLowerCase();
const escapeRe = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

/** Every disagreement between the report's pages and the filing's numbers. */
export function compareReport(pages: string[], f: FilingNumbers): ReadBackDraft[] {
  const drafts: ReadBackDraft[] = [];
  const lines = pages.flatMap((text, i) => text.split('\n').map((line) => ({ page: i + 1, line })));

  // Tune-up powers: a line naming a band (or transmitter id) and "tune-up" with a dBm figure.
  const bands = [...f.tuneUps]
    .sort((a, b) => b.band.length - a.band.length)
    .map((t) => ({ ...t, bandRe: new RegExp(`(^|\\W)${escapeRe(t.band)}(\\W|$)`, 'i'), idRe: new RegExp(`(^|\\W)${escapeRe(t.transmitterId)}(\\W|$)`) }));
  for (const { page, line } of lines) {
    const tuneUp = /tune[- ]?up/i.exec(line);
    if (!tuneUp) continue;
    const tx = bands.find((t) => t.bandRe.test(line) || t.idRe.test(line));
    if (!tx) continue;
    const values = numbersWithUnit(line, /dBm/);
    const stated = values.find((v) => v.index > tuneUp.index) ?? values[values.length - 1];
    if (!stated || Math.abs(stated.value - tx.tuneUpPowerDbm) < 0.005) continue;
    drafts.push({
      key: `tune-up-power:${tx.transmitterId}:${page}:${fmt(stated.value)}`,
      kind: 'tune-up-power',
      page,
      message: `Report page ${page} gives a tune-up power of ${fmt(stated.value)} dBm for ${tx.band}; the filing’s is ${fmt(tx.tuneUpPowerDbm)} dBm.`,
      reportValue: `${fmt(stated.value)} dBm`,
      filingValue: `${fmt(tx.tuneUpPowerDbm)} dBm`,
      tuneUp: { transmitterId: tx.transmitterId, reportTuneUpPowerDbm: stated.value },
    });
  }

  // Highest reported SAR per condition: the report's largest "reported SAR" figure for it.
  const highest = new Map<UsePositionKind, { value: number; page: number }>();
  for (const { page, line } of lines) {
    if (!/reported/i.test(line) || !/\bSAR\b/i.test(line)) continue;
    const kind = CONDITION_PATTERNS.find(([, re]) => re.test(line))?.[0];
    const values = numbersWithUnit(line, /W\/kg/);
    if (!kind || !values.length) continue;
    const value = Math.max(...values.map((v) => v.value));
    if (value > (highest.get(kind)?.value ?? -1)) highest.set(kind, { value, page });
  }
  for (const filed of f.highestReportedSar) {
    const stated = highest.get(filed.kind);
    if (!stated || Math.abs(stated.value - filed.sarWPerKg) < 0.005) continue;
    drafts.push({
      key: `reported-sar:${filed.kind}:${stated.page}:${fmt(stated.value)}`,
      kind: 'reported-sar',
      page: stated.page,
      message: `Report page ${stated.page} says ${fmt(stated.value)} W/kg for ${conditionLabel(filed.kind)}; the filing’s highest reported is ${fmt(filed.sarWPerKg)} W/kg.`,
      reportValue: `${fmt(stated.value)} W/kg`,
      filingValue: `${fmt(filed.sarWPerKg)} W/kg`,
    });
  }

  // Test separations: a line naming a condition and a separation/distance in mm.
  for (const { page, line } of lines) {
    if (!/(separation|distance|spacing)/i.test(line)) continue;
    const kind = CONDITION_PATTERNS.find(([, re]) => re.test(line))?.[0];
    if (!kind) continue;
    const filed = f.separations.filter((s) => s.kind === kind).map((s) => s.separationMm);
    if (!filed.length) continue;
    for (const v of numbersWithUnit(line, /mm\b/)) {
      if (filed.some((mm) => Math.abs(mm - v.value) < 0.05)) continue;
      const list = [...new Set(filed.map((mm) => `${fmt(mm, 1)} mm`))].join(', ');
      drafts.push({
        key: `separation:${kind}:${page}:${fmt(v.value, 1)}`,
        kind: 'separation',
        page,
        message: `Report page ${page} gives a ${conditionLabel(kind)} separation of ${fmt(v.value, 1)} mm; the filing’s ${conditionLabel(kind)} separation${filed.length > 1 ? 's are' : ' is'} ${list}.`,
        reportValue: `${fmt(v.value, 1)} mm`,
        filingValue: list,
      });
    }
  }

  // The model, and the FCC ID when the filing has one.
  const squash = (s: string) => s.toLowerCase().replace(/\s+/g, '');
  const all = squash(pages.join(' '));
  if (f.model.trim() && pages.length && !all.includes(squash(f.model))) {
    drafts.push({
      key: `model:${squash(f.model)}`,
      kind: 'model',
      page: null,
      message: `The report never names the filing’s model “${f.model}”.`,
      reportValue: null,
      filingValue: f.model,
    });
  }
  if (f.fccId) {
    for (const { page, line } of lines) {
      const m = /FCC\s*ID\s*:?\s*([A-Z0-9][A-Z0-9-]{3,})/i.exec(line);
      if (!m || squash(m[1]) === squash(f.fccId)) continue;
      drafts.push({
        key: `model:fcc-id:${page}:${m[1]}`,
        kind: 'model',
        page,
        message: `Report page ${page} names FCC ID ${m[1]}; the filing’s is ${f.fccId}.`,
        reportValue: m[1],
        filingValue: f.fccId,
      });
    }
  }
  return drafts;
}

// ---------------------------------------------------------------------------------------------
// The user manual and the antenna drawing: the figures the readiness rules compare.

/** A distance as the text states it, in mm ("10 mm", "1.5 cm", "0,5 cm"). */
const DISTANCE = /(\d+(?:[.,]\d+)?)\s*(mm|cm)\b/gi;
const distancesMm = (line: string) => [...line.matchAll(DISTANCE)].map((m) => ({ mm: Number(m[1].replace(',', '.')) * (m[2].toLowerCase() === 'cm' ? 10 : 1), index: m.index ?? 0 }));

export interface ManualSeparationStatement {
  /** The condition the sentence names; null when it names none ("from your body"). */
  kind: UsePositionKind | null;
  separationMm: number;
  page: number;
  line: string;
}

/**
 * Separation distances a user manual states: a line that speaks of keeping the device at a
 * distance from the body (separation, distance, "at least", "away from", "from the body") with a
 * figure in mm or cm. English and French wording, as RSP-100 asks for both in Canada. A line
 * naming a condition (body-worn, hotspot) is that condition's; otherwise it names none.
 */
export function manualSeparationStatements(pages: string[]): ManualSeparationStatement[] {
  const out: ManualSeparationStatement[] = [];
  pages.forEach((text, i) => {
    for (const line of text.split('\n')) {
      if (!/(separation|distance|at least|away from|from (?:the|your) body|au moins|du corps|écart)/i.test(line)) continue;
      const figures = distancesMm(line);
      if (!figures.length) continue;
      const kind = CONDITION_PATTERNS.find(([, re]) => re.test(line))?.[0] ?? null;
      for (const f of figures) out.push({ kind, separationMm: f.mm, page: i + 1, line });
    }
  });
  return out;
}

export const EDGES = ['top', 'bottom', 'left', 'right'] as const;
export type Edge = (typeof EDGES)[number];
const EDGE_WORDS: [Edge, RegExp][] = [
  ['top', /\b(top|haut|sup[ée]rieur)\b/i],
  ['bottom', /\b(bottom|bas|inf[ée]rieur)\b/i],
  ['left', /\b(left|gauche)\b/i],
  ['right', /\b(right|droit[e]?)\b/i],
];

export interface AntennaEdgeDistance {
  antennaId: string;
  edge: Edge;
  distanceMm: number;
  page: number;
}

/**
 * Antenna-to-edge distances an antenna location drawing states in its text: a line naming an edge
 * (top, bottom, left, right) with a figure in mm or cm, for the antenna the line names — or, in a
 * table laid out one antenna per heading, the antenna named last above it on the same page.
 * "ANT-MAIN: top edge 6 mm, left edge 30 mm" gives two distances. A drawing that is only a
 * picture has no text, and gives none.
 */
export function antennaEdgeDistances(pages: string[], antennaIds: readonly string[]): AntennaEdgeDistance[] {
  const ids = [...antennaIds].sort((a, b) => b.length - a.length).map((id) => ({ id, re: new RegExp(`(^|[^A-Za-z0-9._-])${escapeRe(id)}($|[^A-Za-z0-9._-])`, 'i') }));
  const out: AntennaEdgeDistance[] = [];
  pages.forEach((text, i) => {
    let current: string | null = null;
    for (const line of text.split('\n')) {
      const named = ids.find((a) => a.re.test(line));
      if (named) current = named.id;
      if (!current) continue;
      // Each part between commas or semicolons pairs one edge with one figure.
      for (const part of line.split(/[;,]/)) {
        const edge = EDGE_WORDS.find(([, re]) => re.test(part))?.[0];
        const figure = distancesMm(part)[0];
        if (edge && figure) out.push({ antennaId: current, edge, distanceMm: figure.mm, page: i + 1 });
      }
    }
  });
  return out;
}
