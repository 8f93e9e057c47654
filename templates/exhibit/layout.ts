/**
 * The exhibit's structure: turns an ExhibitModel into an ordered list of blocks (headings,
 * paragraphs, tables, charts). pdf.ts and docx.ts render the same blocks, so the PDF and the
 * editable DOCX always carry the same content. Numbers are formatted here, once.
 */
import type { Derivation, Quantity } from '../../calc/types';
import type { ExhibitAppendixEntry, ExhibitDepthProfile, ExhibitModel } from './model';
import { CAUTIONS, INTRO, REGIME_SHORT, RESULT_MARKS, RESULT_WORDS, SECTION, formatDateTime } from './texts';

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
  | { kind: 'table'; columns: Column[]; rows: string[][] }
  | { kind: 'keyValue'; rows: [string, string][] }
  | { kind: 'marginChart'; markets: { market: string; bars: MarginBar[] }[] }
  | { kind: 'depthChart'; profile: ExhibitDepthProfile }
  | { kind: 'derivation'; entry: ExhibitAppendixEntry }
  | { kind: 'pageBreak' };

/** Up to `digits` significant digits, without trailing zeros or exponent for everyday values. */
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

export function derivationRows(d: Derivation): [string, string][] {
  const rows: [string, string][] = [['Formula', d.formula]];
  for (const [k, v] of Object.entries(d.inputs)) rows.push([k, quantityText(v)]);
  for (const [k, v] of Object.entries(d.intermediate)) rows.push([k, quantityText(v)]);
  for (const [k, v] of Object.entries(d.result)) rows.push([`→ ${k}`, quantityText(v)]);
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
    blocks.push(
      { kind: 'heading', level: 2, text: 'Highest reported SAR per exposure condition' },
      highestSarTable(m),
    );
  }
  if (m.screening.gaps.length) {
    blocks.push({ kind: 'paragraph', style: 'caution', text: `${m.screening.gaps.length} combination(s) could not be screened. ${m.screening.gaps.map((g) => `${g.transmitterId} at ${g.usePositionId}: ${g.message}`).join(' ')}` });
  }
  return blocks;
}

function highestSarTable(m: ExhibitModel): Block {
  return {
    kind: 'table',
    columns: [
      { title: 'Exposure condition', width: 0.24 },
      { title: 'Transmitter', width: 0.2 },
      { title: 'Use position', width: 0.2 },
      { title: 'Highest reported SAR', width: 0.18, align: 'right' },
      { title: 'Limit', width: 0.18, align: 'right' },
    ],
    rows: m.lab!.highestReported.map((h) => [h.exposureCondition, h.transmitterId, h.usePositionId, `${fixed(h.reportedSarWPerKg, 2)} W/kg`, `${num(h.limitWPerKg)} W/kg`]),
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
        { title: 'Frequency range', width: 0.2 },
        { title: 'Max tune-up power', width: 0.12, align: 'right' },
        { title: 'Duty cycle', width: 0.08, align: 'right' },
        { title: 'Antenna', width: 0.12 },
      ],
      rows: m.transmitters.map((t) => [t.id, t.technology, t.band, `${hz(t.frequencyMinHz)} – ${hz(t.frequencyMaxHz)}`, `${num(t.maxTuneUpPowerDbm)} dBm`, num(t.dutyCycle, 3), t.antennaId]),
    },
  ];
}

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
          { title: 'Transmitter', width: 0.1 },
          { title: 'Position', width: 0.1 },
          { title: 'Rule', width: 0.2 },
          { title: 'At', width: 0.085, align: 'right' },
          { title: 'Sep.', width: 0.065, align: 'right' },
          { title: 'Evaluated', width: 0.105, align: 'right' },
          { title: 'Threshold', width: 0.1, align: 'right' },
          { title: 'Result', width: 0.115 },
          { title: 'Margin', width: 0.075, align: 'right' },
          { title: 'Ref.', width: 0.055, align: 'right' },
        ],
        rows: rows.map((r) => [
          r.transmitterId,
          r.usePositionId,
          r.methodLabel,
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
      { kind: 'paragraph', text: `${INTRO.depthChart} ${m.depthProfile.transmitterId} at ${m.depthProfile.usePositionId}, ${hz(m.depthProfile.frequencyHz)}, distance used ${mm(m.depthProfile.distanceUsedM)}; see ${m.depthProfile.appendixRef}.` },
      { kind: 'depthChart', profile: m.depthProfile },
    );
  }
  return blocks;
}

function labBlocks(m: ExhibitModel): Block[] {
  const blocks: Block[] = [{ kind: 'heading', level: 1, text: SECTION.lab }];
  if (!m.lab || !m.lab.sarResults.length) return [...blocks, { kind: 'paragraph', text: INTRO.labMissing }];
  blocks.push({
    kind: 'table',
    columns: [
      { title: 'Transmitter', width: 0.12 },
      { title: 'Position', width: 0.12 },
      { title: 'Condition', width: 0.12 },
      { title: 'Frequency', width: 0.11, align: 'right' },
      { title: 'Mass', width: 0.06, align: 'right' },
      { title: 'Measured', width: 0.1, align: 'right' },
      { title: 'Scaling', width: 0.08, align: 'right' },
      { title: 'Reported SAR', width: 0.11, align: 'right' },
      { title: 'Limit', width: 0.09, align: 'right' },
      { title: 'Drift', width: 0.09, align: 'right' },
    ],
    rows: m.lab.sarResults.map((r) => [
      r.transmitterId,
      r.usePositionId,
      r.exposureCondition,
      hz(r.frequencyHz),
      `${num(r.averagingMassKg * 1000)} g`,
      `${fixed(r.measuredSarWPerKg, 3)} W/kg`,
      num(r.scalingFactor, 4),
      `${fixed(r.reportedSarWPerKg, 2)} W/kg`,
      `${num(r.limitWPerKg)} W/kg`,
      r.powerDriftDb === null ? '—' : `${fixed(r.powerDriftDb, 2)} dB`,
    ]),
  });
  if (m.lab.highestReported.length) blocks.push({ kind: 'heading', level: 2, text: 'Highest reported SAR per exposure condition' }, highestSarTable(m));
  return blocks;
}

function coTransmissionBlocks(m: ExhibitModel): Block[] {
  const blocks: Block[] = [{ kind: 'heading', level: 1, text: SECTION.coTransmission }];
  if (m.simultaneousGroups.length) {
    blocks.push({ kind: 'paragraph', text: INTRO.coTransmissionGroups }, {
      kind: 'table',
      columns: [
        { title: 'Group', width: 0.12 },
        { title: 'Transmitters on together', width: 0.88 },
      ],
      rows: m.simultaneousGroups.map((g, i) => [String(i + 1), g.join(' + ')]),
    });
  }
  if (!m.lab?.coTransmission.length) return [...blocks, { kind: 'paragraph', text: INTRO.coTransmissionMissing }];
  blocks.push({
    kind: 'table',
    columns: [
      { title: 'Exposure condition', width: 0.22 },
      { title: 'Transmitters', width: 0.34 },
      { title: 'Sum of SAR', width: 0.14, align: 'right' },
      { title: 'Limit', width: 0.12, align: 'right' },
      { title: 'Outcome', width: 0.18 },
    ],
    rows: m.lab.coTransmission.map((c) => [c.exposureCondition, c.transmitterIds.join(' + '), c.sumSarWPerKg === null ? '—' : `${fixed(c.sumSarWPerKg, 2)} W/kg`, c.limitWPerKg === null ? '—' : `${num(c.limitWPerKg)} W/kg`, c.outcome]),
  });
  return blocks;
}

function checkBlocks(m: ExhibitModel): Block[] {
  const blocks: Block[] = [{ kind: 'heading', level: 1, text: SECTION.checks }];
  if (!m.lab || (!m.lab.checks.length && !m.lab.instruments.length)) return [...blocks, { kind: 'paragraph', text: INTRO.checksMissing }];
  if (m.lab.checks.length) {
    blocks.push({
      kind: 'table',
      columns: [
        { title: 'Check', width: 0.14 },
        { title: 'What', width: 0.22 },
        { title: 'Date', width: 0.11 },
        { title: 'Measured', width: 0.13, align: 'right' },
        { title: 'Target', width: 0.13, align: 'right' },
        { title: 'Deviation', width: 0.09, align: 'right' },
        { title: 'Tolerance', width: 0.09, align: 'right' },
        { title: 'Outcome', width: 0.09 },
      ],
      rows: m.lab.checks.map((c) => [c.kind, c.label, c.date, c.measured, c.target, c.deviationPercent === null ? '—' : `${fixed(c.deviationPercent, 1)} %`, c.tolerancePercent === null ? '—' : `±${num(c.tolerancePercent)} %`, c.pass ? '✓ Within' : '× Outside']),
    });
  }
  if (m.lab.instruments.length) {
    blocks.push({ kind: 'heading', level: 2, text: 'Instruments' }, {
      kind: 'table',
      columns: [
        { title: 'Instrument', width: 0.4 },
        { title: 'Serial', width: 0.2 },
        { title: 'Calibrated', width: 0.2 },
        { title: 'Calibration due', width: 0.2 },
      ],
      rows: m.lab.instruments.map((i) => [i.name, i.serial, i.calibratedOn, i.calibrationDueOn]),
    });
  }
  return blocks;
}

function uncertaintyBlocks(m: ExhibitModel): Block[] {
  const blocks: Block[] = [{ kind: 'heading', level: 1, text: SECTION.uncertainty }];
  if (!m.lab?.uncertainty.length) return [...blocks, { kind: 'paragraph', text: INTRO.uncertaintyMissing }];
  for (const u of m.lab.uncertainty) {
    blocks.push({ kind: 'heading', level: 2, text: `${u.label}: expanded uncertainty ${fixed(u.expandedUncertaintyPercent, 1)} % (k = ${num(u.coverageFactor)})` }, {
      kind: 'table',
      columns: [
        { title: 'Component', width: 0.75 },
        { title: 'Standard uncertainty', width: 0.25, align: 'right' },
      ],
      rows: u.components.map((c) => [c.name, `${fixed(c.valuePercent, 2)} %`]),
    });
  }
  return blocks;
}

function readinessBlocks(m: ExhibitModel): Block[] {
  const blocks: Block[] = [{ kind: 'heading', level: 1, text: SECTION.readiness }];
  if (!m.readiness) return [...blocks, { kind: 'paragraph', text: INTRO.readinessMissing }];
  return [
    ...blocks,
    { kind: 'paragraph', text: `As it stood on ${formatDateTime(m.readiness.asOf)}.` },
    {
      kind: 'table',
      columns: [
        { title: 'Requirement', width: 0.4 },
        { title: 'State', width: 0.14 },
        { title: 'Detail', width: 0.46 },
      ],
      rows: m.readiness.items.map((i) => [i.label, i.met ? '✓ Met' : '× Open', i.detail]),
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
        { title: 'Category', width: 0.15 },
        { title: 'File', width: 0.3 },
        { title: 'Size', width: 0.1, align: 'right' },
        { title: 'SHA-256', width: 0.45 },
      ],
      rows: m.evidence.map((e) => [e.category, e.fileName, `${e.sizeBytes} B`, e.sha256]),
    },
  ];
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
  if (s.contentSha256) rows.push(['Content SHA-256', s.contentSha256]);
  return rows;
}
