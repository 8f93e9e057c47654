/**
 * Import of a lab's measurement spreadsheet (CSV or XLSX): the file's kind is decided by its
 * bytes, the CSV delimiter and a decimal comma are detected, columns are mapped onto the
 * measurement fields with their units, every bad cell is named by line and column, and the rows
 * are stored all or nothing. A dry run returns the same preview without storing anything. The
 * mapping an organisation used for a header row is remembered and offered again.
 */
import { createHash } from 'node:crypto';
import { fileTypeFromBuffer } from 'file-type';
import { parse as parseCsv } from 'csv-parse/sync';
import ExcelJS from 'exceljs';
import type { Db } from '../../db/client';
import {
  FIELD_DEFAULT_UNIT,
  FIELD_UNIT_KIND,
  IMPORT_FIELDS,
  MAX_MEASUREMENTS,
  REQUIRED_IMPORT_FIELDS,
  UNIT_FACTORS,
  zImportMapping,
  zMeasurement,
  type ImportField,
  type ImportMapping,
  type ImportPreview,
  type ImportProblem,
  type Measurement,
} from '../../constants/schemas/lab';
import { HttpError, unprocessable } from '../http-error';
import { zodFieldErrors } from '../middleware/validate';
import * as repo from '../repos/lab-repo';
import * as filingsRepo from '../repos/filings-repo';
import { recordAudit } from './audit';
import { loadFiling, requireEditable, type FilingActor } from './filings-service';
import { knownIds, measurementReferenceProblems, requireEngineer } from './lab-service';

const XLSX_MIME = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';
const PREVIEW_ROWS = 200;

export class ImportRefused extends HttpError {
  constructor(
    message: string,
    readonly preview: ImportPreview,
  ) {
    super(422, 'invalid_input', message);
  }
}

const unsupported = (message: string) => new HttpError(415, 'unsupported_media_type', message);

/** Decides CSV or XLSX by the bytes; anything else is refused naming what it is. */
export async function sniff(buffer: Buffer): Promise<'csv' | 'xlsx'> {
  if (buffer.length === 0) throw unprocessable('The file is empty.');
  const type = await fileTypeFromBuffer(buffer);
  if (type?.mime === XLSX_MIME) return 'xlsx';
  if (type) throw unsupported(`The file is ${type.mime} (.${type.ext}), not CSV or XLSX. Export the lab’s table as CSV or XLSX.`);
  const head = buffer.subarray(0, 64 * 1024);
  if (head.includes(0)) throw unsupported('The file is binary data of an unknown kind, not CSV or XLSX.');
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(head.length < buffer.length ? head.subarray(0, head.lastIndexOf(0x0a) + 1 || head.length) : head);
  } catch {
    throw unsupported('The file is not UTF-8 text: save the CSV as UTF-8, or upload the XLSX.');
  }
  return 'csv';
}

interface Table {
  headers: string[];
  rows: { line: number; cells: string[] }[];
  delimiter: string | null;
  decimalComma: boolean;
}

function detectDelimiter(firstLine: string): string {
  const counts = [',', ';', '\t'].map((d) => [d, firstLine.split(d).length - 1] as const);
  return counts.reduce((best, c) => (c[1] > best[1] ? c : best))[0];
}

const DECIMAL_COMMA = /^[+-]?\d+,\d+$/;

function readCsv(buffer: Buffer): Table {
  const text = buffer.toString('utf8').replace(/^\uFEFF/, '');
  const firstLine = text.slice(0, text.search(/\r?\n|$/));
  const delimiter = detectDelimiter(firstLine);
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parseCsv(text, { delimiter, relax_column_count: true, skip_empty_lines: true, trim: true, info: true }) as never;
  } catch (err) {
    const e = err as { message?: string; lines?: number };
    throw unprocessable(`The CSV cannot be read${e.lines ? ` at line ${e.lines}` : ''}: ${e.message ?? 'malformed'}. Nothing was imported.`);
  }
  if (!records.length) throw unprocessable('The file has no header row.');
  const [header, ...body] = records;
  const rows = body.map((r) => ({ line: r.info.lines, cells: r.record }));
  const decimalComma = delimiter !== ',' && rows.some((r) => r.cells.some((c) => DECIMAL_COMMA.test(c)));
  return { headers: header.record.map((h) => h.trim()), rows, delimiter, decimalComma };
}

function cellText(value: ExcelJS.CellValue): string {
  if (value === null || value === undefined) return '';
  if (value instanceof Date) return value.toISOString().slice(0, 10);
  if (typeof value === 'object') {
    if ('result' in value) return cellText(value.result as ExcelJS.CellValue);
    if ('richText' in value) return value.richText.map((t) => t.text).join('');
    if ('text' in value) return String(value.text);
    if ('error' in value) return String(value.error);
  }
  return String(value).trim();
}

async function readXlsx(buffer: Buffer): Promise<Table> {
  const workbook = new ExcelJS.Workbook();
  try {
    await workbook.xlsx.load(buffer as unknown as ArrayBuffer);
  } catch {
    throw unprocessable('The XLSX workbook cannot be read; open and save it again, or export CSV.');
  }
  const sheet = workbook.worksheets[0];
  if (!sheet || sheet.rowCount === 0) throw unprocessable('The workbook’s first sheet is empty.');
  const all: { line: number; cells: string[] }[] = [];
  sheet.eachRow({ includeEmpty: false }, (row, line) => {
    const values = row.values as ExcelJS.CellValue[];
    all.push({ line, cells: values.slice(1).map(cellText) });
  });
  const [header, ...rows] = all;
  return { headers: header.cells.map((h) => h.trim()), rows: rows.filter((r) => r.cells.some((c) => c !== '')), delimiter: null, decimalComma: false };
}

const normal = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, '');
const headerSha = (headers: string[]) =>
  createHash('sha256')
    .update(headers.map((h) => h.trim().toLowerCase()).join('\t'))
    .digest('hex');

/** Fields whose canonical header is present, with the default unit. */
function headerMapping(headers: string[]): ImportMapping {
  const byNormal = new Map(headers.map((h) => [normal(h), h]));
  const mapping: ImportMapping = {};
  for (const f of IMPORT_FIELDS) {
    const h = byNormal.get(normal(f));
    if (h) mapping[f] = { column: h, unit: FIELD_DEFAULT_UNIT[f] };
  }
  return mapping;
}

/** A guess for headers that are not canonical: the field name without its unit, unit from the header. */
function guessMapping(headers: string[]): ImportMapping {
  const mapping: ImportMapping = {};
  const stems: [ImportField, RegExp][] = [
    ['transmitter_id', /^(transmitter|tx|radio)(id)?$/],
    ['use_position_id', /^(useposition|position)(id)?$/],
    ['test_position', /^testposition|^configuration/],
    ['channel', /^(channel|ch)$/],
    ['frequency_mhz', /^(frequency|freq)/],
    ['test_separation_mm', /^(testseparation|separation|distance|gap)/],
    ['measured_power_dbm', /^(measuredpower|conductedpower|power)/],
    ['tune_up_power_dbm', /^(tuneup|maxpower|tuneuppower)/],
    ['test_duty_cycle', /^(testdutycycle|dutycycle|duty)/],
    ['sar_1g_w_kg', /^(sar1g|1gsar|sar1)/],
    ['sar_10g_w_kg', /^(sar10g|10gsar|sar10)/],
    ['drift_db', /^(drift|powerdrift)/],
    ['test_date', /^(testdate|date)/],
    ['peak_x_mm', /^(peakx|x)/],
    ['peak_y_mm', /^(peaky|y)/],
  ];
  for (const h of headers) {
    const n = normal(h);
    const hit = stems.find(([f, re]) => !mapping[f] && re.test(n));
    if (!hit) continue;
    const kind = FIELD_UNIT_KIND[hit[0]];
    const unit = kind ? Object.keys(UNIT_FACTORS[kind]).find((u) => new RegExp(`[(\\[ _]${u.replace('/', '\\/')}[)\\] ]?$`, 'i').test(h)) : undefined;
    mapping[hit[0]] = { column: h, unit: unit ?? FIELD_DEFAULT_UNIT[hit[0]] };
  }
  return mapping;
}

const FIELD_OF_PATH: Record<string, ImportField> = {
  id: 'measurement_id',
  transmitterId: 'transmitter_id',
  usePositionId: 'use_position_id',
  testPosition: 'test_position',
  channel: 'channel',
  frequencyHz: 'frequency_mhz',
  testSeparationM: 'test_separation_mm',
  measuredPowerDbm: 'measured_power_dbm',
  tuneUpPowerDbm: 'tune_up_power_dbm',
  testDutyCycle: 'test_duty_cycle',
  sar1gWPerKg: 'sar_1g_w_kg',
  sar10gWPerKg: 'sar_10g_w_kg',
  repeatSarWPerKg: 'repeat_sar_w_kg',
  driftDb: 'drift_db',
  testDate: 'test_date',
  peakXMm: 'peak_x_mm',
  peakYMm: 'peak_y_mm',
  liquidCheckId: 'liquid_check_id',
  systemCheckId: 'system_check_id',
};

interface Converter {
  problems: ImportProblem[];
  mapping: ImportMapping;
  decimalComma: boolean;
}

function toNumber(raw: string, decimalComma: boolean): number | null {
  const s = decimalComma || (DECIMAL_COMMA.test(raw) && !raw.includes('.')) ? raw.replace(',', '.') : raw;
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(s)) return null;
  return Number(s);
}

/** Converts one field of a row to its SI value; records a problem and returns undefined when it cannot. */
function convert(c: Converter, field: ImportField, raw: string, line: number): number | string | number[] | null | undefined {
  const column = c.mapping[field]!.column;
  const unit = c.mapping[field]!.unit ?? FIELD_DEFAULT_UNIT[field];
  const problem = (message: string) => {
    c.problems.push({ line, column, field, message });
    return undefined;
  };
  if (raw === '') return null;
  if (['transmitter_id', 'use_position_id', 'test_position', 'channel', 'measurement_id', 'liquid_check_id', 'system_check_id'].includes(field)) return raw;
  if (field === 'test_date') {
    const iso = /^\d{4}-\d{2}-\d{2}$/.test(raw) ? raw : /^(\d{2})[./](\d{2})[./](\d{4})$/.test(raw) ? raw.replace(/^(\d{2})[./](\d{2})[./](\d{4})$/, '$3-$2-$1') : null;
    return iso ?? problem(`“${raw}” is not a date; use YYYY-MM-DD (or DD.MM.YYYY).`);
  }
  if (field === 'repeat_sar_w_kg') {
    const parts = raw.split(/[|/ ]+/).filter(Boolean);
    const values = parts.map((p) => toNumber(p, c.decimalComma));
    if (values.some((v) => v === null)) return problem(`“${raw}” is not a list of numbers; separate repeats with “|”.`);
    return values.map((v) => v! * (UNIT_FACTORS.sar as Record<string, number>)[unit ?? 'W/kg']);
  }
  const n = toNumber(raw, c.decimalComma);
  if (n === null) return problem(`“${raw}” is not a number.`);
  const kind = FIELD_UNIT_KIND[field];
  if (!kind) return n;
  if (kind === 'power') {
    if (unit === 'dBm') return n;
    if (n <= 0) return problem(`“${raw}” ${unit} cannot be converted to dBm (must be above 0).`);
    return 10 * Math.log10(unit === 'W' ? n * 1000 : n);
  }
  const factors = UNIT_FACTORS[kind] as Record<string, number>;
  const factor = factors[unit ?? ''];
  if (factor === undefined) return problem(`Unknown unit “${unit}” for ${field}; use ${Object.keys(factors).join(', ')}.`);
  return n * factor;
}

const KEY_OF_FIELD = Object.fromEntries(Object.entries(FIELD_OF_PATH).map(([k, f]) => [f, k])) as Record<ImportField, keyof Measurement>;

/**
 * Parses, maps and validates a file. Throws 415 for a file that is not CSV/XLSX, 422 for one that
 * cannot be read at all; otherwise returns the preview with every problem.
 */
export async function previewImport(
  db: Db,
  actor: FilingActor,
  filingId: number,
  buffer: Buffer,
  given: unknown,
  dryRun: boolean,
): Promise<{ preview: ImportPreview; measurements: Measurement[]; headerSha256: string; versionId: number }> {
  requireEngineer(actor);
  const row = loadFiling(db, actor, filingId);
  requireEditable(row);
  const format = await sniff(buffer);
  const table = format === 'xlsx' ? await readXlsx(buffer) : readCsv(buffer);
  const headerSha256 = headerSha(table.headers);

  let mapping: ImportMapping;
  let mappingSource: ImportPreview['mappingSource'];
  if (given !== undefined && given !== null && given !== '') {
    const parsed = zImportMapping.safeParse(typeof given === 'string' ? safeJson(given) : given);
    if (!parsed.success) throw unprocessable('The column mapping is not valid.', zodFieldErrors(parsed.error));
    mapping = parsed.data;
    mappingSource = 'given';
  } else {
    const fromHeader = headerMapping(table.headers);
    const remembered = repo.findImportMapping(db, actor.organisationId, headerSha256);
    if (REQUIRED_IMPORT_FIELDS.every((f) => fromHeader[f])) [mapping, mappingSource] = [fromHeader, 'header'];
    else if (remembered) [mapping, mappingSource] = [remembered, 'remembered'];
    else [mapping, mappingSource] = [guessMapping(table.headers), 'guessed'];
  }

  const problems: ImportProblem[] = [];
  for (const f of REQUIRED_IMPORT_FIELDS) {
    if (!mapping[f]) problems.push({ line: 1, column: null, field: f, message: `No column is mapped to ${f}; map one of the file’s columns to it.` });
  }
  if (!mapping.sar_1g_w_kg && !mapping.sar_10g_w_kg) problems.push({ line: 1, column: null, field: 'sar_1g_w_kg', message: 'Map a column to sar_1g_w_kg or sar_10g_w_kg (or both).' });
  for (const [f, m] of Object.entries(mapping)) {
    if (!table.headers.includes(m.column)) problems.push({ line: 1, column: m.column, field: f as ImportField, message: `The file has no column “${m.column}” (mapped to ${f}).` });
  }
  if (table.rows.length > MAX_MEASUREMENTS) problems.push({ line: 1, column: null, field: null, message: `The file has ${table.rows.length} rows; at most ${MAX_MEASUREMENTS} are accepted.` });

  const conv: Converter = { problems, mapping, decimalComma: table.decimalComma };
  const indexOf = Object.fromEntries(Object.entries(mapping).map(([f, m]) => [f, table.headers.indexOf(m.column)])) as Partial<Record<ImportField, number>>;
  const measurements: Measurement[] = [];
  const previewRows: ImportPreview['rows'] = [];
  const lineOfRow: number[] = [];
  const mappedFields = (Object.keys(mapping) as ImportField[]).filter((f) => (indexOf[f] ?? -1) >= 0);
  const fileOk = problems.length === 0;
  if (fileOk) {
    table.rows.forEach((r, i) => {
      const before = problems.length;
      const cells: Partial<Record<ImportField, string>> = {};
      const draft: Record<string, unknown> = { id: `M${i + 1}` };
      for (const f of mappedFields) {
        const raw = (r.cells[indexOf[f]!] ?? '').trim();
        cells[f] = raw;
        const v = convert(conv, f, raw, r.line);
        if (v === undefined) continue;
        if (v === null) {
          if (f === 'measurement_id') continue;
          if (f === 'test_duty_cycle') continue; // blank → 1
          if (f === 'repeat_sar_w_kg') continue;
          if (['test_position', 'channel'].includes(f)) draft[KEY_OF_FIELD[f]] = '';
          else draft[KEY_OF_FIELD[f]] = null;
          continue;
        }
        draft[KEY_OF_FIELD[f]] = v;
      }
      if (problems.length === before) {
        const parsed = zMeasurement.safeParse(draft);
        if (parsed.success) measurements.push(parsed.data);
        else {
          for (const issue of parsed.error.issues) {
            const field = FIELD_OF_PATH[String(issue.path[0])] ?? null;
            const column = field && mapping[field] ? mapping[field]!.column : null;
            const raw = field ? cells[field] : undefined;
            problems.push({ line: r.line, column, field, message: raw !== undefined && raw !== '' ? `“${raw}”: ${issue.message}` : issue.message });
          }
        }
      }
      if (problems.length === before) lineOfRow[measurements.length - 1] = r.line;
      if (previewRows.length < PREVIEW_ROWS || problems.length > before) previewRows.push({ line: r.line, cells });
    });
    if (table.rows.length === 0) problems.push({ line: 2, column: null, field: null, message: 'The file has a header but no rows.' });
  }

  if (measurements.length) {
    const seen = new Map<string, number>();
    measurements.forEach((m, i) => {
      const prev = seen.get(m.id);
      if (prev !== undefined)
        problems.push({ line: lineOfRow[i], column: mapping.measurement_id?.column ?? null, field: 'measurement_id', message: `Measurement id “${m.id}” is also on line ${prev}.` });
      seen.set(m.id, lineOfRow[i]);
    });
    const ref = measurementReferenceProblems(measurements, knownIds(db, row.version.id), (i, f) => `${i}|${f}`);
    for (const [key, message] of Object.entries(ref)) {
      const [i, path] = key.split('|');
      const field = FIELD_OF_PATH[path];
      problems.push({ line: lineOfRow[Number(i)], column: mapping[field]?.column ?? null, field, message });
    }
  }
  problems.sort((a, b) => a.line - b.line);

  return {
    preview: {
      format,
      delimiter: table.delimiter,
      decimalComma: table.decimalComma,
      headers: table.headers,
      mapping,
      mappingSource,
      rowCount: table.rows.length,
      rows: previewRows,
      problems,
      dryRun,
      imported: 0,
    },
    measurements,
    headerSha256,
    versionId: row.version.id,
  };
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    throw unprocessable('The column mapping is not valid JSON.');
  }
}

/** The import: a dry run returns the preview; otherwise every row is stored, or none. */
export async function importMeasurements(db: Db, actor: FilingActor, filingId: number, buffer: Buffer, mapping: unknown, dryRun: boolean): Promise<ImportPreview> {
  const { preview, measurements, headerSha256, versionId } = await previewImport(db, actor, filingId, buffer, mapping, dryRun);
  if (dryRun) return preview;
  if (preview.problems.length) {
    const n = preview.problems.length;
    throw new ImportRefused(`${n} problem${n === 1 ? '' : 's'} in the file; nothing was imported. Fix ${n === 1 ? 'it' : 'them'} and import again.`, preview);
  }
  db.transaction((tx) => {
    repo.writeMeasurements(tx, versionId, measurements);
    repo.saveImportMapping(tx, actor.organisationId, headerSha256, preview.mapping);
    filingsRepo.touchFiling(tx, filingId);
    recordAudit(tx, {
      organisationId: actor.organisationId,
      actorUserId: actor.id,
      action: 'lab.measurements.import',
      targetType: 'filing',
      targetId: filingId,
      details: { rows: measurements.length, format: preview.format },
    });
  });
  return { ...preview, imported: measurements.length };
}
