/**
 * Rows pasted from a spreadsheet into the Radios step's transmitter table. Spreadsheets copy a
 * block of cells as tab-separated lines (a cell holding a tab, a line break or a quote comes
 * quoted, its quotes doubled); CSV text pasted as it is has commas or semicolons. An optional
 * header row is recognised by column names; without one the columns are the table's visible
 * order. Every cell is read (units and decimal commas too) and checked with the form's own
 * schema (`zRadiosTransmitter`, `radiosCrossIssues`); each problem is a note that names the
 * line, the column and what to fix. Pure: no React, no I/O.
 */
import { MAX_TRANSMITTERS } from '../../constants/schemas/device-file';
import { radiosCrossIssues, zRadiosTransmitter } from '../../constants/schemas/filings';
import { nextId } from './next-id';

export type Delimiter = '\t' | ',' | ';';
export interface BlockLine {
  /** 1-based row of the pasted block (the header counts), as the person sees it in the sheet. */
  line: number;
  cells: string[];
}

/** Tab if the text has one (a spreadsheet's copy), else semicolon or comma, whichever the first line has more of. */
export function detectDelimiter(text: string): Delimiter {
  if (text.includes('\t')) return '\t';
  const first = text.split(/\r\n|\n|\r/).find((l) => l.trim() !== '') ?? '';
  const semicolons = first.split(';').length - 1;
  const commas = first.split(',').length - 1;
  return semicolons > 0 && semicolons >= commas ? ';' : ',';
}

/** Splits pasted text into lines of trimmed cells; blank lines are skipped but still counted. */
export function splitBlock(text: string, delimiter: Delimiter = detectDelimiter(text)): BlockLine[] {
  const records: string[][] = [];
  let cells: string[] = [];
  let cell = '';
  let quoted = false;
  let atCellStart = true;
  const endCell = () => {
    cells.push(cell.trim());
    cell = '';
    atCellStart = true;
  };
  const endRecord = () => {
    endCell();
    records.push(cells);
    cells = [];
  };
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
      continue;
    }
    if (ch === '"' && atCellStart && cell.trim() === '') {
      quoted = true;
      cell = '';
      atCellStart = false;
    } else if (ch === delimiter) endCell();
    else if (ch === '\r' || ch === '\n') {
      if (ch === '\r' && text[i + 1] === '\n') i++;
      endRecord();
    } else {
      cell += ch;
      if (ch.trim() !== '') atCellStart = false;
    }
  }
  if (cell !== '' || cells.length) endRecord();
  return records.map((r, i) => ({ line: i + 1, cells: r })).filter((r) => r.cells.some((c) => c !== ''));
}

/** Whether pasted text is a block of cells (a tab or several lines) rather than one value for one field. */
export function isBlock(text: string): boolean {
  return text.includes('\t') || text.split(/\r\n|\n|\r/).filter((l) => l.trim() !== '').length > 1;
}

export type DecimalMark = '.' | ',' | null;

// Thousands grouping only ("1,710", "1.710.000"): the cells a decimal mark makes ambiguous.
const GROUPED_COMMA = /^[-+]?\d{1,3}(,\d{3})+$/;
const GROUPED_DOT = /^[-+]?\d{1,3}(\.\d{3})+$/;
const PLAIN = /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i;

/** Digits grouped with spaces (including no-break and thin spaces) or apostrophes are joined; a typographic minus is a minus. */
const compact = (s: string) =>
  s
    .trim()
    .replace(/\u2212/g, '-')
    .replace(/(\d)[\s\u00a0\u202f\u2009']+(?=\d)/g, '$1');

/** The block's decimal mark, judged from the cells that can be read only one way (mixed evidence: none). */
export function decimalMarkOf(numbers: readonly string[]): DecimalMark {
  let dot = false;
  let comma = false;
  for (const raw of numbers) {
    const s = compact(splitUnit(raw).number);
    if (/\d,\d{3}\.\d+$/.test(s) || (/^[-+]?\d*\.\d+$/.test(s) && !GROUPED_DOT.test(s))) dot = true;
    if (/\d\.\d{3},\d+$/.test(s) || (/^[-+]?\d*,\d+$/.test(s) && !GROUPED_COMMA.test(s))) comma = true;
  }
  return dot === comma ? null : dot ? '.' : ',';
}

/** "699 MHz" → 699 and "MHz"; "50%" → 50 and "%". */
export function splitUnit(text: string): { number: string; unit: string } {
  const m = /^(.*?[\d.,])\s*([A-Za-z%µ]+)$/.exec(text.trim());
  return m && !/^e[-+]?\d*$/i.test(m[2]) ? { number: m[1], unit: m[2] } : { number: text.trim(), unit: '' };
}

export type NumberRead = { ok: true; value: number } | { ok: false; reason: 'not-a-number' | 'ambiguous' };

/** A number as a spreadsheet shows it: decimal point or comma, grouped digits, a leading sign. */
export function readNumber(text: string, mark: DecimalMark = null): NumberRead {
  let s = compact(text);
  const dots = s.split('.').length - 1;
  const commas = s.split(',').length - 1;
  if (dots && commas) {
    // Both marks: the last one is the decimal mark, the other groups thousands.
    const decimal = s.lastIndexOf('.') > s.lastIndexOf(',') ? '.' : ',';
    s = s.split(decimal === '.' ? ',' : '.').join('');
    if (decimal === ',') s = s.replace(',', '.');
  } else if (commas) {
    if (GROUPED_COMMA.test(s) && (commas > 1 || mark === '.')) s = s.split(',').join('');
    else if (GROUPED_COMMA.test(s) && mark === null) return { ok: false, reason: 'ambiguous' };
    else if (commas === 1) s = s.replace(',', '.');
  } else if (dots && GROUPED_DOT.test(s) && (dots > 1 || mark === ',')) s = s.split('.').join('');
  if (!PLAIN.test(s)) return { ok: false, reason: 'not-a-number' };
  const value = Number(s);
  return Number.isFinite(value) ? { ok: true, value } : { ok: false, reason: 'not-a-number' };
}

// ---------------------------------------------------------------------------------------------
// The transmitter table's columns

type Kind = 'text' | 'antenna' | 'frequency' | 'number';
export interface PasteColumn {
  field: string;
  /** The form field's own label, used in the notes. */
  label: string;
  kind: Kind;
  /** The unit a number is typed in, and stored = typed × scale. */
  unit?: string;
  scale?: number;
  /** Header names it answers to, normalised (lower case, letters and digits only, unit removed). */
  names: readonly string[];
  /** An empty cell leaves the field out (optional numbers) or gives this value. */
  emptyValue?: unknown;
}

export const TRANSMITTER_PASTE_COLUMNS: readonly PasteColumn[] = [
  { field: 'id', label: 'Transmitter id', kind: 'text', names: ['id', 'transmitterid', 'transmitter', 'txid', 'tx', 'name'] },
  { field: 'technology', label: 'Technology', kind: 'text', names: ['technology', 'tech', 'radio', 'rat'] },
  { field: 'band', label: 'Band', kind: 'text', names: ['band', 'bandname'] },
  {
    field: 'frequencyMinHz',
    label: 'Lowest frequency',
    kind: 'frequency',
    unit: 'MHz',
    scale: 1e6,
    names: ['lowest', 'lowestfrequency', 'lowfrequency', 'fmin', 'minfrequency', 'frequencymin', 'flow', 'fstart', 'startfrequency', 'from'],
  },
  {
    field: 'frequencyMaxHz',
    label: 'Highest frequency',
    kind: 'frequency',
    unit: 'MHz',
    scale: 1e6,
    names: ['highest', 'highestfrequency', 'highfrequency', 'fmax', 'maxfrequency', 'frequencymax', 'fhigh', 'fstop', 'stopfrequency', 'to'],
  },
  {
    field: 'maxTuneUpPowerDbm',
    label: 'Max tune-up power',
    kind: 'number',
    unit: 'dBm',
    scale: 1,
    names: ['maxtuneup', 'maxtuneuppower', 'maximumtuneup', 'maximumtuneuppower', 'tuneuppower', 'tuneup', 'maxpower', 'power'],
  },
  { field: 'dutyCycle', label: 'Duty cycle', kind: 'number', unit: '%', scale: 0.01, names: ['duty', 'dutycycle', 'dutyfactor'], emptyValue: 1 },
  { field: 'antennaId', label: 'Antenna', kind: 'antenna', names: ['antenna', 'antennaid', 'ant'] },
  { field: 'tuneUpTargetDbm', label: 'Tune-up target', kind: 'number', unit: 'dBm', scale: 1, names: ['tuneuptarget', 'target', 'targetpower'], emptyValue: undefined },
  { field: 'tuneUpToleranceDb', label: 'Tolerance', kind: 'number', unit: 'dB', scale: 1, names: ['tolerance', 'tuneuptolerance', 'tol'], emptyValue: undefined },
  { field: 'mode', label: 'Mode', kind: 'text', names: ['mode'] },
  { field: 'modulation', label: 'Modulation', kind: 'text', names: ['modulation'] },
  { field: 'bandwidth', label: 'Bandwidth', kind: 'text', names: ['bandwidth', 'bw', 'channelbandwidth'] },
];

const unitWord = (u: string) => (u.toLowerCase() === 'percent' ? '%' : u.toLowerCase());
const FREQUENCY_UNITS: Record<string, number> = { hz: 1, khz: 1e3, mhz: 1e6, ghz: 1e9 };
const HEADER_UNIT = /(mhz|ghz|khz|hz|dbm|db|percent|%)$/;

/** A header cell's column name (normalised) and the unit it states: "Lowest (GHz)" → lowest, GHz. */
export function headerName(cell: string): { name: string; unit: string } {
  const inBrackets = /[([]\s*([^)\]]*?)\s*[)\]]/.exec(cell);
  let name = cell
    .replace(/[([][^)\]]*[)\]]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9%]/g, '');
  let unit = inBrackets?.[1] ?? '';
  const trailing = HEADER_UNIT.exec(name);
  if (trailing && trailing.index > 0) {
    unit ||= trailing[1];
    name = name.slice(0, trailing.index);
  }
  return { name: name.replace(/%/g, ''), unit };
}

function columnNamed(cell: string, columns: readonly PasteColumn[]): { column: PasteColumn; unit: string } | null {
  const { name, unit } = headerName(cell);
  const column = columns.find((c) => c.names.includes(name) || headerName(c.label).name === name);
  return column ? { column, unit } : null;
}

// ---------------------------------------------------------------------------------------------
// Reading a block into transmitter rows

export interface PastedTransmitter {
  id: string;
  technology: string;
  band: string;
  frequencyMinHz: number | null;
  frequencyMaxHz: number | null;
  maxTuneUpPowerDbm: number | null;
  tuneUpTargetDbm?: number;
  tuneUpToleranceDb?: number;
  mode: string;
  modulation: string;
  bandwidth: string;
  dutyCycle: number | null;
  dutyCyclePreset: string;
  antennaId: string;
  moreAntennaIds: string[];
  antennaUse: 'mimo' | 'switched';
}

/** A new transmitter row as "Add transmitter" makes it; pasted cells fill it. */
export function blankTransmitter(id: string, antennaId: string): PastedTransmitter {
  return {
    id,
    technology: '',
    band: '',
    frequencyMinHz: null,
    frequencyMaxHz: null,
    maxTuneUpPowerDbm: null,
    mode: '',
    modulation: '',
    bandwidth: '',
    dutyCycle: 1,
    dutyCyclePreset: '',
    antennaId,
    moreAntennaIds: [],
    antennaUse: 'mimo',
  };
}

export interface PasteNote {
  /** Index among the pasted rows. */
  row: number;
  field: string;
  line: number;
  /** The column's label. */
  column: string;
  /** What the cell held ('' when the column was not pasted or the cell was empty). */
  text: string;
  /** The whole note: "line 3, Max tune-up power: 'abc' is not a number in dBm". */
  message: string;
}

export interface PasteResult {
  rows: PastedTransmitter[];
  notes: PasteNote[];
  /** The labels of the columns filled, in the pasted order. */
  columns: string[];
  headerFound: boolean;
  /** Pasted columns that fill nothing, in words. */
  ignored: string[];
  /** The block's data lines (header excluded). */
  lines: number[];
  /** Lines past the step's limit of transmitters, left out. */
  leftOut: number[];
  delimiter: Delimiter;
  decimalMark: DecimalMark;
}

export interface PasteContext {
  /** The table's visible columns, by field, in order (columns without a header fill these). */
  visibleOrder: readonly string[];
  /** The antennas listed above the table, by label. */
  antennas: readonly string[];
  /** The transmitters already in the form. */
  transmitters: readonly { id?: string; antennaId?: string; moreAntennaIds?: string[] }[];
  maxRows?: number;
}

const quote = (s: string) => `‘${s}’`;
const round2 = (x: number) => Math.round(x * 100) / 100;
type Fields = Record<string, unknown>;

/** Reads a pasted block into rows to append after the form's transmitters, with a note for every cell to fix. */
export function readTransmitterBlock(text: string, ctx: PasteContext): PasteResult {
  const delimiter = detectDelimiter(text);
  const all = splitBlock(text, delimiter);
  const byField = new Map(TRANSMITTER_PASTE_COLUMNS.map((c) => [c.field, c]));
  const ignored: string[] = [];

  // The header, when at least half of the first line's cells name a column.
  const first = all[0]?.cells ?? [];
  const named = first.map((c) => (c ? columnNamed(c, TRANSMITTER_PASTE_COLUMNS) : null));
  const filled = first.filter((c) => c !== '').length;
  const headerFound = filled > 0 && named.filter(Boolean).length * 2 >= filled;
  let layout: ({ column: PasteColumn; unit: string } | null)[];
  if (headerFound) {
    const seen = new Set<string>();
    layout = named.map((n, i) => {
      if (!n) {
        if (first[i]) ignored.push(`column ${quote(first[i])} is not a column of this table`);
        return null;
      }
      if (seen.has(n.column.field)) {
        ignored.push(`column ${quote(first[i])} repeats ${n.column.label}; the first one is used`);
        return null;
      }
      seen.add(n.column.field);
      return n;
    });
  } else {
    layout = ctx.visibleOrder.map((f) => byField.get(f)).map((c) => (c ? { column: c, unit: '' } : null));
    const widest = Math.max(0, ...all.map((l) => l.cells.length));
    if (widest > layout.length && all.some((l) => l.cells.slice(layout.length).some((c) => c !== ''))) {
      ignored.push(`cells after the ${layout.length}th column (${layout[layout.length - 1]?.column.label ?? ''}) have no column here`);
    }
  }
  const body = headerFound ? all.slice(1) : all;
  const room = Math.max(0, (ctx.maxRows ?? MAX_TRANSMITTERS) - ctx.transmitters.length);
  const taken = body.slice(0, room);
  const leftOut = body.slice(room).map((l) => l.line);

  const numericCells = taken.flatMap((l) => layout.flatMap((s, i) => (s && (s.column.kind === 'number' || s.column.kind === 'frequency') && l.cells[i] ? [l.cells[i]] : [])));
  const decimalMark = decimalMarkOf(numericCells);

  const notes: PasteNote[] = [];
  const noted = new Set<string>();
  const note = (row: number, line: number, column: PasteColumn, text: string, detail: string) => {
    const key = `${row}:${column.field}`;
    if (noted.has(key)) return;
    noted.add(key);
    notes.push({ row, field: column.field, line, column: column.label, text, message: `line ${line}, ${column.label}: ${detail}` });
  };
  const antennaList = ctx.antennas.length ? ctx.antennas.join(', ') : 'none yet';
  const ids = ctx.transmitters.map((t) => t.id ?? '');
  const shape = zRadiosTransmitter.shape as unknown as Record<string, { safeParse: (v: unknown) => { success: boolean; error?: { issues: { message: string }[] } } }>;

  const rows = taken.map((l, row): PastedTransmitter => {
    const values: Fields = { ...blankTransmitter('', ctx.antennas[0] ?? '') };
    const texts = new Map<string, string>();
    layout.forEach((slot, i) => {
      // A line shorter than the others leaves its last columns out: they keep the defaults of "Add transmitter".
      if (!slot || i >= l.cells.length) return;
      const { column } = slot;
      const cell = l.cells[i] ?? '';
      texts.set(column.field, cell);
      if (column.kind === 'text') {
        values[column.field] = cell;
      } else if (column.kind === 'antenna') {
        const known = ctx.antennas.find((a) => a.toLowerCase() === cell.toLowerCase());
        if (known) values.antennaId = known;
        else if (cell === '' && ctx.antennas.length === 1) values.antennaId = ctx.antennas[0];
        else {
          values.antennaId = cell;
          note(
            row,
            l.line,
            column,
            cell,
            cell === '' ? `empty; pick one of the antennas above (${antennaList})` : `${quote(cell)} is not one of the antennas above (${antennaList}); add it under Antennas or pick one`,
          );
        }
      } else {
        const unit = column.unit ?? '';
        const empty = 'emptyValue' in column ? column.emptyValue : null;
        if (cell === '') {
          if (empty === undefined) delete values[column.field];
          else values[column.field] = empty;
          return;
        }
        values[column.field] = column.emptyValue === undefined && 'emptyValue' in column ? undefined : null;
        const { number, unit: typed } = splitUnit(cell);
        const headerUnit = slot.unit;
        let factor: number | null = column.scale ?? 1;
        let shownUnit = unit;
        if (column.kind === 'frequency') {
          const u = (typed || headerUnit || unit).toLowerCase();
          factor = FREQUENCY_UNITS[u] ?? null;
          shownUnit = typed || headerUnit || unit;
        } else if ((typed || headerUnit) && unitWord(typed || headerUnit) !== unitWord(unit)) factor = null;
        if (factor === null) {
          note(row, l.line, column, cell, `${quote(cell)} is in ${typed || headerUnit}; give it in ${unit}`);
          return;
        }
        const read = readNumber(number, decimalMark);
        if (!read.ok) {
          const detail =
            read.reason === 'ambiguous'
              ? `${quote(cell)} could be ${number.replace(/,/g, '')} or ${number.replace(',', '.')} ${shownUnit}; write it without the thousands separator`
              : `${quote(cell)} is not a number in ${shownUnit}`;
          note(row, l.line, column, cell, detail);
          return;
        }
        const value = Number((read.value * factor).toPrecision(12));
        values[column.field] = value;
        const check = shape[column.field]?.safeParse(value);
        if (check && !check.success) note(row, l.line, column, cell, `${quote(cell)}: ${check.error?.issues[0]?.message ?? 'not accepted'}`);
      }
    });
    // Target and tolerance without a maximum: the maximum is their sum, as in the form.
    const target = values.tuneUpTargetDbm;
    const tolerance = values.tuneUpToleranceDb;
    if (values.maxTuneUpPowerDbm === null && !texts.get('maxTuneUpPowerDbm') && typeof target === 'number' && typeof tolerance === 'number') values.maxTuneUpPowerDbm = round2(target + tolerance);
    if (!values.id) {
      values.id = nextId('TX', ids);
      texts.set('id', '');
    }
    ids.push(String(values.id));
    // Rules across a row's fields (and fields not pasted), in the schema's own words.
    const parsed = zRadiosTransmitter.safeParse(values);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const column = byField.get(String(issue.path[0]));
        if (column) note(row, l.line, column, texts.get(column.field) ?? '', texts.get(column.field) ? `${quote(texts.get(column.field)!)}: ${issue.message}` : issue.message);
      }
    }
    return values as unknown as PastedTransmitter;
  });

  // Rules across rows: a duplicate id, an antenna not listed.
  const before = ctx.transmitters.length;
  radiosCrossIssues(
    {
      antennas: ctx.antennas.map((id) => ({ id })),
      transmitters: [...ctx.transmitters.map((t) => ({ id: t.id ?? '', antennaId: t.antennaId ?? '', moreAntennaIds: t.moreAntennaIds ?? [] })), ...rows],
    },
    {
      addIssue: ({ path, message }) => {
        const row = Number(path[1]) - before;
        const column = byField.get(String(path[2]));
        if (path[0] !== 'transmitters' || row < 0 || !column) return;
        const cell = layout.findIndex((s) => s?.column.field === column.field);
        const textOf = cell >= 0 ? (taken[row].cells[cell] ?? '') : '';
        note(row, taken[row].line, column, textOf, textOf ? `${quote(textOf)}: ${message}` : message);
      },
    },
  );

  notes.sort((a, b) => a.line - b.line || layout.findIndex((s) => s?.column.field === a.field) - layout.findIndex((s) => s?.column.field === b.field));
  return {
    rows,
    notes,
    columns: layout.flatMap((s) => (s ? [s.column.label] : [])),
    headerFound,
    ignored,
    lines: taken.map((l) => l.line),
    leftOut,
    delimiter,
    decimalMark,
  };
}
