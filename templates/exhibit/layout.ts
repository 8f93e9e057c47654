/**
 * The exhibit's structure: turns an ExhibitModel into an ordered list of blocks (headings,
 * paragraphs, tables, charts). pdf.ts and docx.ts render the same blocks, so the PDF and the
 * editable DOCX always carry the same content. Numbers are formatted here, once.
 */
import type { Derivation, Quantity } from '../../calc/types';
import type { ExhibitAppendixEntry, ExhibitDepthProfile, ExhibitModel } from './model';
import { CAUTIONS, CHECK_KIND_LABELS, CHECK_STATUS_WORDS, INTRO, READINESS_STATUS_WORDS, REGIME_SHORT, RESULT_MARKS, RESULT_WORDS, SECTION, formatDateTime, powerModeWords } from './texts';

export interface Column {
  title: string;
  /** Share of the text width. */
  width: number;
  align?: 'left' | 'right';
}

export interface MarginBar {
  label: string;
  marginDb: number | null;
  result: string;
}

export type Block =
  | { kind: 'heading'; level: 1 | 2; text: string }
  | { kind: 'paragraph'; text: string; style?: 'normal' | 'small' | 'caution' }
  | { kind: 'table'; columns: Column[]; rows: string[][]; header?: boolean }
  | { kind: 'keyValue'; rows: [string, string][] }
  | { kind: 'marginChart'; markets: { market: string; bars: MarginBar[] }[] }
  | { kind: 'depthChart'; profile: ExhibitDepthProfile }
  | { kind: 'derivation'; entry: ExhibitAppendixEntry }
  | { kind: 'pageBreak' };

/** Up to `digits` significant digits, without trailing zeros or exponent for everyday values. */
/** The line under the depth chart: the averages in W/kg beyond the reactive near field, the reason for a relative profile closer. */
export function depthChartFootnote(p: ExhibitDepthProfile): string {
  return p.averagedSarWPerKg
    ? `Averaged over 1 g: ${num(p.averagedSarWPerKg['1g'], 3)} W/kg; over 10 g: ${num(p.averagedSarWPerKg['10g'], 3)} W/kg (model estimate, not a measured SAR).`
    : 'Relative profile (surface = 1): no W/kg is given inside the reactive near field. Not a measured SAR.';
}

export function num(x: number | null | undefined, digits = 4): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return '—';
  if (x === 0) return '0';
  const abs = Math.abs(x);
  if (abs >= 1e6 || abs < 1e-4) return x.toExponential(digits - 1).replace(/\.?0+e/, 'e');
  return String(Number(x.toPrecision(digits)));
}

export const fixed = (x: number | null | undefined, decimals: number) => (x === null || x === undefined || !Number.isFinite(x) ? '—' : x.toFixed(decimals));

export function hz(x: number): string {
  if (x >= 1e9) return `${num(x / 1e9, 5)} GHz`;
  if (x >= 1e6) return `${num(x / 1e6, 5)} MHz`;
  if (x >= 1e3) return `${num(x / 1e3, 5)} kHz`;
  return `${num(x)} Hz`;
}

export const mm = (m: number) => `${num(m * 1000)} mm`;

export function resultText(result: string): string {
  return `${RESULT_MARKS[result] ?? ''} ${RESULT_WORDS[result] ?? result}`.trim();
}

/** A derivation quantity with its unit; frequencies in Hz read as MHz/GHz, words without a unit. */
export function quantityText(qty: Quantity): string {
  if (typeof qty.value === 'number' && qty.unit === 'Hz') return hz(qty.value);
  const value = typeof qty.value === 'number' ? num(qty.value, 6) : qty.value === null ? '—' : String(qty.value);
  return qty.unit && qty.unit !== '1' && qty.unit !== 'text' ? `${value} ${qty.unit}` : value;
}

/**
 * A derivation as labelled rows: the formula, then the inputs, intermediate values and results
 * each as one list of "name = value" (so an entry takes a few lines, not one line per figure),
 * the source and each note.
 */
export function derivationRows(d: Derivation): [string, string][] {
  const list = (q: Record<string, Quantity>) =>
    Object.entries(q)
      .map(([k, v]) => `${k} = ${quantityText(v)}`)
      .join(';  ');
  const rows: [string, string][] = [['Formula', d.formula]];
  if (Object.keys(d.inputs).length) rows.push(['Inputs', list(d.inputs)]);
  if (Object.keys(d.intermediate).length) rows.push(['Intermediate values', list(d.intermediate)]);
  rows.push(['Result', list(d.result)]);
  rows.push(['Source', d.source]);
  for (const note of d.notes) rows.push(['Note', note]);
  return rows;
}

function summaryBlocks(m: ExhibitModel): Block[] {
  const rows = m.markets.map((market) => {
    const mine = m.screening.rows.filter((r) => r.regime === market.regime);
    const count = (res: string) => String(mine.filter((r) => r.result === res).length);
    const margins = mine.map((r) => r.marginDb).filter((x): x is number => x !== null);
    return [
      REGIME_SHORT[market.regime] ?? market.regime,
      market.tier === 'occupational' ? 'Occupational' : 'General public',
      String(mine.length),
      count('exempt'),
      count('evaluate-sar'),
      count('evaluate-mpe'),
      margins.length ? `${fixed(Math.min(...margins), 1)} dB` : '—',
    ];
  });
  const blocks: Block[] = [
    { kind: 'heading', level: 1, text: SECTION.summary },
    { kind: 'paragraph', text: INTRO.summary },
    {
      kind: 'table',
      columns: [
        { title: 'Market', width: 0.17 },
        { title: 'Exposure tier', width: 0.17 },
        { title: 'Combinations', width: 0.14, align: 'right' },
        { title: 'Exempt', width: 0.11, align: 'right' },
        { title: 'SAR evaluation', width: 0.14, align: 'right' },
        { title: 'MPE evaluation', width: 0.14, align: 'right' },
        { title: 'Smallest margin', width: 0.13, align: 'right' },
      ],
      rows,
    },
  ];
  if (m.lab?.highestReported.length) {
    blocks.push({ kind: 'heading', level: 2, text: 'Highest reported SAR per market and exposure condition' }, highestSarTable(m));
  }
  if (m.screening.gaps.length) {
    blocks.push({
      kind: 'paragraph',
      style: 'caution',
      text: `${m.screening.gaps.length} combination(s) could not be screened. ${m.screening.gaps.map((g) => `${g.transmitterId} at ${g.usePositionId}: ${g.message}`).join(' ')}`,
    });
  }
  return blocks;
}

const sar = (x: number | null) => (x === null ? '—' : `${fixed(x, 2)} W/kg`);
const mass = (kg: number) => `${num(kg * 1000)} g`;

function highestSarTable(m: ExhibitModel): Block {
  return {
    kind: 'table',
    columns: [
      { title: 'Market', width: 0.09 },
      { title: 'Exposure condition', width: 0.2 },
      { title: 'Mass', width: 0.05, align: 'right' },
      { title: 'Highest reported SAR', width: 0.12, align: 'right' },
      { title: 'Limit', width: 0.08, align: 'right' },
      { title: 'Margin', width: 0.07, align: 'right' },
      { title: 'Transmitter', width: 0.1 },
      { title: 'Use position', width: 0.12 },
      { title: 'Scan', width: 0.06 },
      { title: 'Outcome', width: 0.11 },
    ],
    rows: m.lab!.highestReported.map((h) => [
      h.market,
      h.exposureCondition,
      mass(h.averagingMassKg),
      h.reportedSarWPerKg === null ? 'not measured' : sar(h.reportedSarWPerKg),
      `${num(h.limitWPerKg)} W/kg`,
      h.marginDb === null ? '—' : `${fixed(h.marginDb, 1)} dB`,
      h.transmitterId ?? '—',
      h.usePositionId ?? '—',
      h.measurementId ?? '—',
      h.withinLimit === null ? '—' : h.withinLimit ? '✓ Within' : '× Over',
    ]),
  };
}

function deviceBlocks(m: ExhibitModel): Block[] {
  return [
    { kind: 'heading', level: 1, text: SECTION.device },
    { kind: 'paragraph', text: INTRO.device },
    {
      kind: 'keyValue',
      rows: [
        ['Device name', m.device.name],
        ['Model', m.device.model],
        ['Applicant', m.device.applicant],
        ['Product type', m.device.productType],
        ['Hardware version', m.device.hardwareVersion || '—'],
        ['Firmware version', m.device.firmwareVersion || '—'],
        ['Markets', m.markets.map((x) => `${x.label} (${x.tier === 'occupational' ? 'occupational' : 'general public'})`).join('; ') || '—'],
      ],
    },
  ];
}

function radioBlocks(m: ExhibitModel): Block[] {
  return [
    { kind: 'heading', level: 1, text: SECTION.radios },
    { kind: 'paragraph', text: INTRO.radios },
    {
      kind: 'table',
      columns: [
        { title: 'Antenna', width: 0.2 },
        { title: 'Gain', width: 0.14, align: 'right' },
        { title: 'Location', width: 0.66 },
      ],
      rows: m.antennas.map((a) => [a.id, `${num(a.gainDbi)} dBi`, a.location || '—']),
    },
    {
      kind: 'table',
      columns: [
        { title: 'Transmitter', width: 0.14 },
        { title: 'Technology', width: 0.17 },
        { title: 'Band', width: 0.17 },
        { title: 'Frequency range', width: 0.18 },
        { title: 'Max tune-up power (target ± tolerance)', width: 0.14, align: 'right' },
        { title: 'Duty cycle', width: 0.08, align: 'right' },
        { title: 'Antenna', width: 0.12 },
      ],
      rows: m.transmitters.map((t) => [t.id, t.technology, t.band, `${hz(t.frequencyMinHz)} – ${hz(t.frequencyMaxHz)}`, tuneUpText(t), num(t.dutyCycle, 3), t.antennaId]),
    },
  ];
}

/** "24 dBm (23 ± 1 dB)": the upper bound screening uses, and the target and tolerance it comes from. */
const tuneUpText = (t: ExhibitModel['transmitters'][number]) =>
  t.tuneUpTargetDbm !== undefined && t.tuneUpToleranceDb !== undefined
    ? `${num(t.maxTuneUpPowerDbm)} dBm (${num(t.tuneUpTargetDbm)} ± ${num(t.tuneUpToleranceDb)} dB)`
    : `${num(t.maxTuneUpPowerDbm)} dBm`;

function positionBlocks(m: ExhibitModel): Block[] {
  const antennaIds = m.antennas.map((a) => a.id);
  const share = 0.55 / Math.max(1, antennaIds.length);
  return [
    { kind: 'heading', level: 1, text: SECTION.positions },
    { kind: 'paragraph', text: INTRO.positions },
    {
      kind: 'table',
      columns: [{ title: 'Use position', width: 0.18 }, { title: 'Kind', width: 0.27 }, ...antennaIds.map((id) => ({ title: id, width: share, align: 'right' as const }))],
      rows: m.usePositions.map((p) => [
        p.id,
        p.kindLabel,
        ...antennaIds.map((id) => {
          const s = p.separations.find((x) => x.antennaId === id);
          return s ? mm(s.separationM) : '—';
        }),
      ]),
    },
    ...powerModeBlocks(m),
  ];
}

/** Section 4's table of reduced tune-up powers: per use position, each transmitter that backs off, and why. */
function powerModeBlocks(m: ExhibitModel): Block[] {
  const rows = m.usePositions.flatMap((p) =>
    p.powerModes.map((x) => {
      const max = m.transmitters.find((t) => t.id === x.transmitterId)?.maxTuneUpPowerDbm;
      return [
        p.id,
        x.transmitterId,
        max === undefined ? '—' : `${num(max)} dBm`,
        `${num(x.reducedTuneUpPowerDbm)} dBm`,
        max === undefined ? '—' : `${fixed(x.reducedTuneUpPowerDbm - max, 1)} dB`,
        x.triggerLabel,
      ];
    }),
  );
  if (!rows.length) return [{ kind: 'paragraph', text: INTRO.powerModesNone }];
  return [
    { kind: 'heading', level: 2, text: 'Reduced tune-up power per use position' },
    { kind: 'paragraph', text: INTRO.powerModes },
    {
      kind: 'table',
      columns: [
        { title: 'Use position', width: 0.17 },
        { title: 'Transmitter', width: 0.15 },
        { title: 'Max tune-up power', width: 0.15, align: 'right' },
        { title: 'Reduced tune-up power', width: 0.17, align: 'right' },
        { title: 'Reduction', width: 0.12, align: 'right' },
        { title: 'Trigger', width: 0.24 },
      ],
      rows,
    },
  ];
}

function marginBars(m: ExhibitModel) {
  return m.markets.map((market) => ({
    market: REGIME_SHORT[market.regime] ?? market.regime,
    bars: m.transmitters.map((t) => {
      const rows = m.screening.rows.filter((r) => r.regime === market.regime && r.transmitterId === t.id);
      const withMargin = rows.filter((r) => r.marginDb !== null).sort((a, b) => a.marginDb! - b.marginDb!);
      const worst = withMargin[0] ?? rows.find((r) => r.result !== 'exempt') ?? rows[0];
      return { label: t.id, marginDb: worst?.marginDb ?? null, result: worst?.result ?? '' };
    }),
  }));
}

function screeningBlocks(m: ExhibitModel): Block[] {
  const blocks: Block[] = [
    { kind: 'heading', level: 1, text: SECTION.screening },
    { kind: 'paragraph', text: INTRO.screening },
    { kind: 'paragraph', style: 'small', text: `Engine ${m.screening.engineVersion}, rule set ${m.screening.ruleSetVersion}: ${m.screening.ruleSetDocuments.join('; ')}.` },
  ];
  for (const market of m.markets) {
    const rows = m.screening.rows.filter((r) => r.regime === market.regime);
    blocks.push(
      { kind: 'heading', level: 2, text: `${market.label} — ${market.tier === 'occupational' ? 'occupational' : 'general public'}` },
      {
        kind: 'table',
        columns: [
          { title: 'Transmitter', width: 0.095 },
          { title: 'Position', width: 0.09 },
          { title: 'Rule', width: 0.165 },
          { title: 'Power', width: 0.09 },
          { title: 'At', width: 0.08, align: 'right' },
          { title: 'Sep.', width: 0.06, align: 'right' },
          { title: 'Evaluated', width: 0.1, align: 'right' },
          { title: 'Threshold', width: 0.095, align: 'right' },
          { title: 'Result', width: 0.11 },
          { title: 'Margin', width: 0.065, align: 'right' },
          { title: 'Ref.', width: 0.05, align: 'right' },
        ],
        rows: rows.map((r) => [
          r.transmitterId,
          r.usePositionId,
          r.methodLabel,
          powerModeWords(r.powerMode),
          hz(r.frequencyHz),
          mm(r.separationM),
          r.thresholdUnit === 'mW' || r.thresholdUnit === null ? `${num(r.evaluatedPowerMw)} mW` : `${num(r.evaluatedPowerMw)} mW (${r.evaluatedQuantity})`,
          r.threshold === null ? '—' : `${num(r.threshold)} ${r.thresholdUnit ?? ''}`.trim(),
          resultText(r.result),
          r.marginDb === null ? '—' : `${fixed(r.marginDb, 1)} dB`,
          r.appendixRef,
        ]),
      },
    );
  }
  blocks.push({ kind: 'heading', level: 2, text: 'Margins per market' }, { kind: 'paragraph', text: INTRO.marginChart }, { kind: 'marginChart', markets: marginBars(m) });
  if (m.depthProfile) {
    blocks.push(
      { kind: 'heading', level: 2, text: 'SAR against depth (estimate)' },
      {
        kind: 'paragraph',
        text: `${INTRO.depthChart} ${m.depthProfile.transmitterId} at ${m.depthProfile.usePositionId}, ${hz(m.depthProfile.frequencyHz)}, distance used ${mm(m.depthProfile.distanceUsedM)}; model: ${m.depthProfile.stackTitle}. ${m.depthProfile.scaleReason} See ${m.depthProfile.appendixRef}.`,
      },
      { kind: 'depthChart', profile: m.depthProfile },
    );
  }
  return blocks;
}

function labBlocks(m: ExhibitModel): Block[] {
  const blocks: Block[] = [{ kind: 'heading', level: 1, text: SECTION.lab }];
  if (!m.lab || !m.lab.sarResults.length) return [...blocks, { kind: 'paragraph', text: INTRO.labMissing }];
  const lab = m.lab;
  blocks.push(
    { kind: 'paragraph', text: INTRO.lab },
    {
      kind: 'table',
      columns: [
        { title: 'Scan', width: 0.055 },
        { title: 'Transmitter', width: 0.095 },
        { title: 'Use position (as tested)', width: 0.17 },
        { title: 'Frequency', width: 0.085, align: 'right' },
        { title: 'Sep.', width: 0.055, align: 'right' },
        { title: 'Power / tune-up (dBm)', width: 0.11, align: 'right' },
        { title: 'Scaling', width: 0.065, align: 'right' },
        { title: 'Measured 1 g / 10 g', width: 0.12, align: 'right' },
        { title: 'Reported 1 g / 10 g', width: 0.12, align: 'right' },
        { title: 'Drift (dB)', width: 0.065, align: 'right' },
        { title: 'Ref.', width: 0.06, align: 'right' },
      ],
      rows: lab.sarResults.map((r) => [
        r.measurementId,
        r.transmitterId,
        `${r.usePositionId}${r.testPosition ? ` (${r.testPosition})` : ''}`,
        hz(r.frequencyHz),
        mm(r.testSeparationM),
        `${num(r.measuredPowerDbm)} / ${num(r.tuneUpPowerDbm)}`,
        num(r.scalingFactor, 4),
        `${fixed(r.measuredSar1gWPerKg, 3)} / ${fixed(r.measuredSar10gWPerKg, 3)}`,
        `${fixed(r.reportedSar1gWPerKg, 2)} / ${fixed(r.reportedSar10gWPerKg, 2)}`,
        r.powerDriftDb === null ? '—' : fixed(r.powerDriftDb, 2),
        r.appendixRef,
      ]),
    },
    { kind: 'paragraph', style: 'small', text: INTRO.labUnits },
  );
  if (lab.highestReported.length) blocks.push({ kind: 'heading', level: 2, text: 'Highest reported SAR per market and exposure condition' }, highestSarTable(m));
  if (lab.coverage.some((c) => c.status !== 'not-required')) {
    blocks.push(
      { kind: 'heading', level: 2, text: 'Coverage against the screening' },
      { kind: 'paragraph', text: INTRO.coverage },
      {
        kind: 'table',
        columns: [
          { title: 'Transmitter', width: 0.15 },
          { title: 'Use position', width: 0.17 },
          { title: 'Condition', width: 0.17 },
          { title: 'SAR evaluation needed in', width: 0.2 },
          { title: 'Scans', width: 0.16 },
          { title: 'State', width: 0.15 },
        ],
        rows: lab.coverage.map((c) => [c.transmitterId, c.usePositionId, c.exposureCondition, c.markets.join(', ') || '—', c.measurementIds.join(', ') || '—', COVERAGE_WORDS[c.status]]),
      },
    );
  }
  return blocks;
}

const COVERAGE_WORDS = { measured: '✓ Measured', missing: '× Not measured', 'not-required': '– Not required' } as const;

function coTransmissionBlocks(m: ExhibitModel): Block[] {
  const blocks: Block[] = [{ kind: 'heading', level: 1, text: SECTION.coTransmission }];
  if (m.simultaneousGroups.length) {
    blocks.push(
      { kind: 'paragraph', text: INTRO.coTransmissionGroups },
      {
        kind: 'table',
        columns: [
          { title: 'Group', width: 0.12 },
          { title: 'Transmitters on together', width: 0.88 },
        ],
        rows: m.simultaneousGroups.map((g, i) => [String(i + 1), g.join(' + ')]),
      },
    );
  }
  if (!m.lab?.coTransmission.length) return [...blocks, { kind: 'paragraph', text: INTRO.coTransmissionMissing }];
  blocks.push(
    { kind: 'paragraph', text: INTRO.coTransmission },
    {
      kind: 'table',
      columns: [
        { title: 'Market', width: 0.09 },
        { title: 'Use position', width: 0.12 },
        { title: 'Transmitters and their parts', width: 0.37 },
        { title: 'Sum', width: 0.1, align: 'right' },
        { title: 'Limit', width: 0.08, align: 'right' },
        { title: 'Outcome', width: 0.19 },
        { title: 'Ref.', width: 0.05, align: 'right' },
      ],
      rows: m.lab.coTransmission.map((c) => [
        c.market,
        `${c.usePositionId} (${c.exposureCondition})`,
        c.contributions.join('; '),
        c.sum === null ? '—' : c.unit === 'W/kg' ? `${fixed(c.sum, 2)} W/kg` : num(c.sum, 3),
        c.unit === 'W/kg' ? `${num(c.limit)} W/kg` : num(c.limit),
        `${c.pass ? '✓' : '×'} ${c.outcome}`,
        c.appendixRef,
      ]),
    },
  );
  return blocks;
}

/** The per-scan checks in the order the matrix shows them. */
const SCAN_CHECK_ORDER = ['power', 'separation', 'band', 'drift', 'liquid', 'system-check', 'calibration', 'repeats', 'mass', 'limit'] as const;
const STATUS_RANK = { pass: 0, warning: 1, fail: 2 } as const;
const STATUS_MARK = { pass: '✓', warning: '!', fail: '×' } as const;

function checkBlocks(m: ExhibitModel): Block[] {
  const blocks: Block[] = [{ kind: 'heading', level: 1, text: SECTION.checks }];
  if (!m.lab || (!m.lab.checks.length && !m.lab.instruments.length)) return [...blocks, { kind: 'paragraph', text: INTRO.checksMissing }];
  const lab = m.lab;
  const s = lab.summary;
  blocks.push({ kind: 'paragraph', text: `${INTRO.checks} ${lab.checks.length} checks in all: ${s.failing} outside tolerance (${s.blocking} of them stop signing), ${s.warnings} to look at.` });
  const sources: string[] = [];
  const ref = (source: string) => {
    let i = sources.indexOf(source);
    if (i < 0) i = sources.push(source) - 1;
    return `[${i + 1}]`;
  };
  const setup = lab.checks.filter((c) => c.subjectType === 'liquid-check' || c.subjectType === 'system-check' || c.subjectType === 'instrument' || c.subjectType === 'uncertainty');
  if (setup.length) {
    blocks.push(
      { kind: 'heading', level: 2, text: 'Liquid, system, calibration and uncertainty checks' },
      {
        kind: 'table',
        columns: [
          { title: 'Check', width: 0.14 },
          { title: 'Of', width: 0.1 },
          { title: 'Value', width: 0.36 },
          { title: 'Tolerance', width: 0.22 },
          { title: 'Outcome', width: 0.1 },
          { title: 'Source', width: 0.08 },
        ],
        rows: setup.map((c) => [c.kind, c.subject, c.status === 'pass' ? c.value : `${c.value}. ${c.message}`, c.tolerance, CHECK_STATUS_WORDS[c.status] ?? c.status, ref(c.source)]),
      },
    );
  }
  const perScan = lab.checks.filter((c) => c.subjectType === 'measurement');
  if (perScan.length) {
    const kinds = SCAN_CHECK_ORDER.filter((k) => perScan.some((c) => c.kindId === k));
    const cell = (scan: string, kind: string) => {
      const found = perScan.filter((c) => c.subject === scan && c.kindId === kind);
      if (!found.length) return '–';
      return STATUS_MARK[found.reduce((w, c) => (STATUS_RANK[c.status] > STATUS_RANK[w] ? c.status : w), 'pass' as keyof typeof STATUS_RANK)];
    };
    blocks.push(
      { kind: 'heading', level: 2, text: 'Checks of each scan' },
      { kind: 'paragraph', style: 'small', text: INTRO.scanChecks },
      {
        kind: 'table',
        columns: [{ title: 'Scan', width: 0.1 }, ...kinds.map((k) => ({ title: CHECK_KIND_LABELS[k] ?? k, width: 0.9 / kinds.length }))],
        rows: lab.sarResults.map((r) => [r.measurementId, ...kinds.map((k) => cell(r.measurementId, k))]),
      },
    );
    const findings = perScan.filter((c) => c.status !== 'pass');
    if (findings.length) {
      blocks.push({
        kind: 'table',
        columns: [
          { title: 'Scan', width: 0.08 },
          { title: 'Check', width: 0.14 },
          { title: 'Finding', width: 0.5 },
          { title: 'Tolerance', width: 0.2 },
          { title: 'Source', width: 0.08 },
        ],
        rows: findings.map((c) => [c.subject, `${STATUS_MARK[c.status]} ${c.kind}`, c.value === '—' ? c.message : `${c.message} (${c.value})`, c.tolerance, ref(c.source)]),
      });
    }
  }
  if (lab.instruments.length) {
    blocks.push(
      { kind: 'heading', level: 2, text: 'Instruments' },
      {
        kind: 'table',
        columns: [
          { title: 'Id', width: 0.1 },
          { title: 'Kind', width: 0.18 },
          { title: 'Model', width: 0.22 },
          { title: 'Serial', width: 0.14 },
          { title: 'Calibrated', width: 0.12 },
          { title: 'Due', width: 0.12 },
          { title: 'On test dates', width: 0.12 },
        ],
        rows: lab.instruments.map((i) => [i.id, i.kind, i.model || '—', i.serial || '—', i.calibratedOn, i.calibrationDueOn, i.inCalibration ? '✓ In calibration' : '× Not in calibration']),
      },
    );
  }
  if (sources.length) {
    blocks.push(
      { kind: 'heading', level: 2, text: 'Sources of the tolerances' },
      {
        kind: 'table',
        header: false,
        columns: [
          { title: '', width: 0.06 },
          { title: '', width: 0.94 },
        ],
        rows: sources.map((src, i) => [`[${i + 1}]`, src]),
      },
    );
  }
  return blocks;
}

function uncertaintyBlocks(m: ExhibitModel): Block[] {
  const blocks: Block[] = [{ kind: 'heading', level: 1, text: SECTION.uncertainty }];
  const u = m.lab?.uncertainty;
  if (!u) return [...blocks, { kind: 'paragraph', text: INTRO.uncertaintyMissing }];
  const highest = u.highestMeasuredSarWPerKg === null ? 'no SAR measured' : `highest measured SAR ${fixed(u.highestMeasuredSarWPerKg, 3)} W/kg (${u.highestMeasuredMass})`;
  blocks.push({
    kind: 'keyValue',
    rows: [
      ['Budget required', `${u.required ? 'Yes' : 'No'}: ${highest}`],
      ['Combined standard uncertainty', u.combinedStandardPercent === null ? '—' : `${fixed(u.combinedStandardPercent, 1)} %`],
      [
        'Expanded uncertainty',
        u.expandedPercent === null
          ? 'No budget entered'
          : `${fixed(u.expandedPercent, 1)} % (k = ${num(u.coverageFactor)}); at most ${num(u.limitPercent)} %${u.appendixRef ? `; see ${u.appendixRef}` : ''}`,
      ],
    ],
  });
  if (u.components.length) {
    blocks.push({
      kind: 'table',
      columns: [
        { title: 'Contribution', width: 0.36 },
        { title: 'Value', width: 0.12, align: 'right' },
        { title: 'Distribution', width: 0.16 },
        { title: 'Divisor', width: 0.1, align: 'right' },
        { title: 'Sensitivity', width: 0.13, align: 'right' },
        { title: 'Degrees of freedom', width: 0.13, align: 'right' },
      ],
      rows: u.components.map((c) => [
        c.name,
        `${fixed(c.valuePercent, 2)} %`,
        c.distribution,
        c.divisor === null ? 'from distribution' : num(c.divisor),
        num(c.sensitivity),
        c.degreesOfFreedom === null ? '∞' : num(c.degreesOfFreedom),
      ]),
    });
  }
  return blocks;
}

function readinessBlocks(m: ExhibitModel): Block[] {
  const r = m.readiness;
  const blocks: Block[] = [{ kind: 'heading', level: 1, text: SECTION.readiness }];
  if (!r) return [...blocks, { kind: 'paragraph', text: INTRO.readinessMissing }];
  const when = r.basis === 'at-signing' ? `As it stood at signing, ${formatDateTime(r.asOf)}.` : `${INTRO.readinessDraft} As of ${formatDateTime(r.asOf)}.`;
  return [
    ...blocks,
    { kind: 'paragraph', text: `${when} ${r.counts.passed} met, ${r.counts.blocking} blocking signing, ${r.counts.warnings} warning(s), ${r.counts.notApplicable} not applicable.` },
    {
      kind: 'table',
      columns: [
        { title: 'Requirement', width: 0.34 },
        { title: 'Weight', width: 0.12 },
        { title: 'State', width: 0.1 },
        { title: 'Detail', width: 0.44 },
      ],
      rows: r.items.map((i) => [i.title, i.severity === 'blocks-signing' ? 'Blocks signing' : 'Warning', READINESS_STATUS_WORDS[i.status] ?? i.status, i.detail || '—']),
    },
  ];
}

function evidenceBlocks(m: ExhibitModel): Block[] {
  const blocks: Block[] = [{ kind: 'heading', level: 1, text: SECTION.evidence }];
  if (!m.evidence.length) return [...blocks, { kind: 'paragraph', text: INTRO.evidenceMissing }];
  return [
    ...blocks,
    { kind: 'paragraph', text: INTRO.evidence },
    {
      kind: 'table',
      columns: [
        { title: 'Document, category and path in this package', width: 0.3 },
        { title: 'Size', width: 0.075, align: 'right' },
        { title: 'Uploaded', width: 0.085 },
        { title: 'SHA-256', width: 0.54 },
      ],
      rows: m.evidence.map((e) => [`${e.title} (${e.category})\n${e.path}`, bytes(e.sizeBytes), e.uploadedAt.slice(0, 10), e.sha256]),
    },
  ];
}

/** "1.2 MB", "340 kB", "812 B" (decimal units, as file managers show them). */
export function bytes(n: number): string {
  // A no-break space, so the unit stays with its number in a narrow column.
  if (n >= 1e9) return `${num(n / 1e9, 3)}\u00a0GB`;
  if (n >= 1e6) return `${num(n / 1e6, 3)}\u00a0MB`;
  if (n >= 1e3) return `${num(n / 1e3, 3)}\u00a0kB`;
  return `${n}\u00a0B`;
}

/** Every block of the exhibit after the cover and contents, in reading order. */
export function exhibitBlocks(m: ExhibitModel): Block[] {
  return [
    ...summaryBlocks(m),
    ...deviceBlocks(m),
    ...radioBlocks(m),
    ...positionBlocks(m),
    ...screeningBlocks(m),
    ...labBlocks(m),
    ...coTransmissionBlocks(m),
    ...checkBlocks(m),
    ...uncertaintyBlocks(m),
    ...readinessBlocks(m),
    ...evidenceBlocks(m),
    { kind: 'heading', level: 1, text: SECTION.cautions },
    ...CAUTIONS.map((text): Block => ({ kind: 'paragraph', style: 'caution', text })),
    ...m.cautions.filter((c) => !(CAUTIONS as readonly string[]).includes(c)).map((text): Block => ({ kind: 'paragraph', style: 'caution', text })),
    { kind: 'pageBreak' },
    { kind: 'heading', level: 1, text: SECTION.appendix },
    { kind: 'paragraph', text: INTRO.appendix },
    ...m.appendix.map((entry): Block => ({ kind: 'derivation', entry })),
  ];
}

/** The cover's signature block lines. */
export function signatureLines(m: ExhibitModel): [string, string][] {
  if (!m.signature) return [['Signature', INTRO.unsigned]];
  const s = m.signature;
  const rows: [string, string][] = [
    ['Signed by', `${s.signerName} (${s.signerRole})`],
    ['Signed at', formatDateTime(s.signedAt)],
    ['Statement', s.statement],
  ];
  rows.push(['Content SHA-256', `${s.contentSha256} (${s.contentFormat})`]);
  return rows;
}
