/**
 * The readiness rules, each with a filing that triggers it and one that does not. The filings
 * are built by hand here; each case says which clause or habit the rule stands for (the rules
 * carry the same source in calc/readiness/rules.ts).
 */
import { describe, expect, it } from 'vitest';
import { evaluateReadiness, READINESS_RULES, type ReadinessInput, type ReadinessLab } from '../../calc/readiness';

/** A complete filing that passes every rule: two transmitters, a body-worn and a hotspot position, FCC and EU. */
function passing(): ReadinessInput {
  const lab: ReadinessLab = {
    measurements: [
      { measurementId: 'M1', transmitterId: 'LTE-B2', usePositionId: 'body', measuredPowerDbm: 22.8, tuneUpPowerDbm: 23.5, testSeparationM: 0.01 },
      { measurementId: 'M2', transmitterId: 'LTE-B2', usePositionId: 'hotspot-top', measuredPowerDbm: 23.1, tuneUpPowerDbm: 23.5, testSeparationM: 0.01 },
    ],
    highest: [{ regime: 'fcc', usePositionKind: 'body-worn', reportedSarWPerKg: 1.19, limitWPerKg: 1.6, transmitterId: 'LTE-B2', usePositionId: 'body' }],
    checks: [
      { kind: 'liquid', ok: true, label: 'Liquid 1880 MHz, εr −2.1 %, σ +3.0 % (±5 %)' },
      { kind: 'system-check', ok: true, label: 'System check S1 within tolerance.' },
      { kind: 'drift', ok: true, label: 'Power drift within tolerance.' },
      { kind: 'calibration', ok: true, label: 'P1 in calibration on every test date.' },
      { kind: 'repeat', ok: true, label: 'M1: repeat measurements as required.' },
      { kind: 'separation', ok: true, label: 'Tested no farther than the device is used.' },
    ],
    coTransmission: ['body', 'hotspot-top'].flatMap((usePositionId) =>
      (['fcc', 'eu'] as const).map((regime) => ({ transmitterIds: ['LTE-B2', 'WLAN'], usePositionId, regime, status: 'within-limit' as const })),
    ),
    uncertainty: { required: true, given: true },
  };
  const positions = [
    {
      id: 'body',
      kind: 'body-worn' as const,
      separations: [
        { antennaId: 'A1', separationM: 0.01 },
        { antennaId: 'A2', separationM: 0.01 },
      ],
    },
    {
      id: 'hotspot-top',
      kind: 'hotspot' as const,
      separations: [
        { antennaId: 'A1', separationM: 0.01 },
        { antennaId: 'A2', separationM: 0.03 },
      ],
    },
  ];
  const rows = positions.flatMap((p) =>
    (['fcc', 'eu'] as const).flatMap((regime) => [
      { transmitterId: 'LTE-B2', usePositionId: p.id, regime, result: 'evaluate-sar' as const, marginDb: -3 },
      { transmitterId: 'WLAN', usePositionId: p.id, regime, result: 'exempt' as const, marginDb: 4.2 },
    ]),
  );
  return {
    device: { name: 'Kittiwake K2', model: 'KW2-A', applicant: 'Halden Ridge Instruments', productType: 'handset', hardwareVersion: 'DVT1', firmwareVersion: '1.0.3' },
    unsavedSteps: [],
    antennaIds: ['A1', 'A2'],
    transmitters: [
      { id: 'LTE-B2', antennaId: 'A1', maxTuneUpPowerDbm: 23.5 },
      { id: 'WLAN', antennaId: 'A2', maxTuneUpPowerDbm: 15 },
    ],
    usePositions: positions,
    regimes: ['fcc', 'eu'],
    simultaneous: [['LTE-B2', 'WLAN']],
    screening: { rows, gaps: [] },
    lab,
    evidence: { required: [{ category: 'sar-report', label: 'SAR test report', present: true }] },
    reportTuneUps: [{ transmitterId: 'LTE-B2', reportTuneUpPowerDbm: 23.5, where: 'page 12', explained: false }],
    reportFindings: [],
    manualSeparations: [
      { usePositionId: 'body', statedSeparationM: 0.015 },
      { usePositionId: 'hotspot-top', statedSeparationM: 0.01 },
    ],
    hotspotEdges: [
      { edge: 'top', antennaId: 'A1', distanceM: 0.008 },
      { edge: 'left', antennaId: 'A2', distanceM: 0.031 },
    ],
  };
}

const item = (input: ReadinessInput, id: string) => evaluateReadiness(input).items.find((i) => i.id === id)!;

describe('the passing filing', () => {
  it('passes every rule, and the checklist says it is ready', () => {
    const list = evaluateReadiness(passing());
    expect(list.items.filter((i) => i.status === 'fail')).toEqual([]);
    expect(list.ready).toBe(true);
    // Only the MPE rule does not apply: nothing in this filing needs an MPE evaluation.
    expect(list.items.filter((i) => i.status === 'not-applicable').map((i) => i.id)).toEqual(['mpe-evaluation']);
    expect(list.counts).toEqual({ blocking: 0, warnings: 0, passed: list.items.length - 1, notApplicable: 1 });
  });

  it('every rule has an id, a severity, a message, a step and a source', () => {
    const ids = READINESS_RULES.map((r) => r.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const r of READINESS_RULES) {
      expect(r.title.length).toBeGreaterThan(10);
      expect(r.fix.length).toBeGreaterThan(10);
      expect(r.step).toBeTruthy();
      expect(r.source).toMatch(/CFR|KDB|RSS|Directive|IEC|EN |Recommendation|common practice/);
    }
  });
});

/** Each case: the rule, what breaks it (from the passing filing), and the finding expected. */
const cases: { id: string; why: string; breaks: (f: ReadinessInput) => void; finding: RegExp; blocks: boolean }[] = [
  { id: 'device-identity', why: '47 CFR §2.1033(b)(1): the applicant is named', breaks: (f) => void (f.device.applicant = ' '), finding: /applicant is missing/, blocks: true },
  { id: 'device-versions', why: 'RED Annex V(a): firmware versions affecting compliance', breaks: (f) => void (f.device.firmwareVersion = ''), finding: /No firmware version/, blocks: false },
  {
    id: 'data-complete',
    why: 'common practice: a separation per antenna and position',
    breaks: (f) => void (f.usePositions[0].separations = [f.usePositions[0].separations[0]]),
    finding: /“body” has no separation for antenna A2/,
    blocks: true,
  },
  { id: 'data-complete', why: 'unsaved input with errors', breaks: (f) => void (f.unsavedSteps = ['radios']), finding: /radios step has input with errors/, blocks: true },
  {
    id: 'screening-coverage',
    why: '§1.1307(b)(3): each combination exempt or evaluated',
    breaks: (f) => void (f.screening!.rows = f.screening!.rows.filter((r) => !(r.transmitterId === 'WLAN' && r.usePositionId === 'body' && r.regime === 'eu'))),
    finding: /WLAN at “body” has no screening result for EU/,
    blocks: true,
  },
  {
    id: 'sar-measured',
    why: '§2.1093(d) / KDB 865664: a SAR evaluation is a measurement',
    breaks: (f) => void (f.lab!.measurements = f.lab!.measurements.filter((m) => m.usePositionId !== 'body')),
    finding: /LTE-B2 at “body” needs SAR \(US FCC, EU\) and has no measurement/,
    blocks: true,
  },
  {
    id: 'reported-sar-within-limit',
    why: '§1.1310(c): 1.6 W/kg over 1 g',
    breaks: (f) => void (f.lab!.highest[0].reportedSarWPerKg = 1.64),
    finding: /reported SAR 1\.64 W\/kg .* over the limit of 1\.6 W\/kg/,
    blocks: true,
  },
  {
    id: 'co-transmission-evaluated',
    why: 'KDB 447498 §4.3.2: every combination summed',
    breaks: (f) => void (f.lab!.coTransmission = f.lab!.coTransmission.slice(1)),
    finding: /LTE-B2 \+ WLAN at “body”, US FCC is not evaluated/,
    blocks: true,
  },
  {
    id: 'co-transmission-evaluated',
    why: 'over the limit without a peak-location ratio',
    breaks: (f) => void (f.lab!.coTransmission[3].status = 'needs-simultaneous-measurement'),
    finding: /“hotspot-top”, EU needs a simultaneous measurement/,
    blocks: true,
  },
  {
    id: 'co-transmission-evaluated',
    why: 'KDB 447498 §4.3.2: a group of one use position is checked in that position',
    breaks: (f) => void (f.simultaneousAt = [{ usePositionId: 'body', transmitterIds: ['LTE-B2', 'BT'] }]),
    finding: /^LTE-B2 \+ BT at “body”, US FCC is not evaluated/,
    blocks: true,
  },
  {
    id: 'tune-up-consistent',
    why: 'common practice: one tune-up figure in every document (measurements)',
    breaks: (f) => void (f.lab!.measurements[0].tuneUpPowerDbm = 24),
    finding: /LTE-B2: measurements use 24 dBm, Radios says 23\.5 dBm/,
    blocks: true,
  },
  {
    id: 'tune-up-consistent',
    why: 'common practice: the report read back says the same',
    breaks: (f) => void (f.reportTuneUps![0].reportTuneUpPowerDbm = 23),
    finding: /the report \(page 12\) says 23 dBm/,
    blocks: true,
  },
  {
    id: 'measured-power-within-tune-up',
    why: 'KDB 447498 §4.1: never above the tune-up limit',
    breaks: (f) => void (f.lab!.measurements[1].measuredPowerDbm = 23.7),
    finding: /Measurement M2 .* 23\.7 dBm measured, tune-up limit 23\.5 dBm/,
    blocks: true,
  },
  {
    id: 'lab-checks-in-tolerance',
    why: 'IEC/IEEE 62209-1528: liquid within ±5 % (KDB 865664)',
    breaks: (f) => void f.lab!.checks.push({ kind: 'liquid', ok: false, label: 'Liquid 2450 MHz, σ +6.1 % (±5 %)' }),
    finding: /σ \+6\.1 %/,
    blocks: true,
  },
  {
    id: 'lab-checks-in-tolerance',
    why: 'IEEE 1528-2013: system check within ±10 % of the dipole target',
    breaks: (f) => void (f.lab!.checks[1] = { kind: 'system-check', ok: false, label: 'System check S1 (2026-11-10) is 11.2 % from its target.' }),
    finding: /11\.2 % from its target/,
    blocks: true,
  },
  {
    id: 'lab-checks-in-tolerance',
    why: 'IEEE 1528-2013: power drift within ±5 %',
    breaks: (f) => void (f.lab!.checks[2] = { kind: 'drift', ok: false, label: 'M1: power drift -0.3 dB is outside ±5 %.' }),
    finding: /power drift -0\.3 dB/,
    blocks: true,
  },
  {
    id: 'lab-checks-in-tolerance',
    why: 'KDB 865664: instruments in calibration on the test date',
    breaks: (f) => void (f.lab!.checks[3] = { kind: 'calibration', ok: false, label: 'P1 (probe) was not in calibration on 2026-11-12.' }),
    finding: /not in calibration on 2026-11-12/,
    blocks: true,
  },
  {
    id: 'lab-checks-in-tolerance',
    why: 'KDB 865664 §2.8.1: a repeat at ≥ 0.8 W/kg',
    breaks: (f) => void (f.lab!.checks[4] = { kind: 'repeat', ok: false, label: 'M1: a repeat is required.' }),
    finding: /a repeat is required/,
    blocks: true,
  },
  {
    id: 'tested-at-use-separation',
    why: 'KDB 447498 §4.1: never tested farther than used',
    breaks: (f) => void (f.lab!.checks[5] = { kind: 'separation', ok: false, label: 'M1: tested at 15 mm, farther than the 10 mm of body.' }),
    finding: /tested at 15 mm, farther than the 10 mm of body/,
    blocks: true,
  },
  {
    id: 'measurements-match-device',
    why: 'common practice: a measurement of a transmitter the device does not have',
    breaks: (f) => void f.lab!.checks.push({ kind: 'reference', ok: false, label: 'Measurement M9 names transmitter “LTE-B5”, which the device data does not have.' }),
    finding: /M9 names transmitter “LTE-B5”/,
    blocks: true,
  },
  {
    id: 'lab-records-complete',
    why: 'IEC/IEEE 62209-1528: the drift of each scan is recorded',
    breaks: (f) => void f.lab!.checks.push({ kind: 'drift', ok: false, gap: true, label: 'M1: no power drift recorded.' }),
    finding: /M1: no power drift recorded/,
    blocks: false,
  },
  {
    id: 'co-transmission-evaluated',
    why: 'KDB 447498 §4.3.2: a transmitter with neither a measurement nor an exemption',
    breaks: (f) => void (f.lab!.coTransmission[0].status = 'incomplete'),
    finding: /at “body”, US FCC cannot be summed/,
    blocks: true,
  },
  {
    id: 'uncertainty-given',
    why: 'IEEE 1528-2013: expanded uncertainty at most 30 %',
    breaks: (f) => void (f.lab!.uncertainty = { required: true, given: true, expandedPct: 31.4, limitPct: 30 }),
    finding: /expanded uncertainty is 31\.4 %/,
    blocks: true,
  },
  {
    id: 'uncertainty-given',
    why: 'KDB 865664 §2.8: a budget at ≥ 1.5 W/kg',
    breaks: (f) => void (f.lab!.uncertainty = { required: true, given: false }),
    finding: /requires an uncertainty budget/,
    blocks: true,
  },
  {
    id: 'manual-separation',
    why: 'common practice: users are told the tested distance',
    breaks: (f) => void (f.manualSeparations![0].statedSeparationM = 0.005),
    finding: /manual states 5 mm; it was tested at 10 mm/,
    blocks: true,
  },
  {
    id: 'manual-separation-stated',
    why: 'KDB 447498: users are told the body-worn distance; no manual on file says what to upload',
    breaks: (f) => void (f.manualSeparations = null),
    finding: /No user-manual text is on file/,
    blocks: false,
  },
  {
    id: 'manual-separation-stated',
    why: 'a hotspot position the manual says nothing about',
    breaks: (f) => void (f.manualSeparations = f.manualSeparations!.filter((m) => m.usePositionId !== 'hotspot-top')),
    finding: /states no separation for “hotspot-top” \(hotspot\)/,
    blocks: false,
  },
  {
    id: 'report-agrees',
    why: 'common practice: the report read back states the filing’s reported SAR',
    breaks: (f) =>
      void f.reportFindings!.push({ kind: 'reported-sar', text: '“SAR report”: Report page 9 says 1.12 W/kg for body-worn; the filing’s highest reported is 1.19 W/kg.', explained: false }),
    finding: /page 9 says 1\.12 W\/kg/,
    blocks: true,
  },
  {
    id: 'report-agrees',
    why: 'an unreadable report is checked by hand',
    breaks: (f) => void f.reportFindings!.push({ kind: 'unreadable', text: '“SAR report” was stored, but its PDF is encrypted.', explained: false }),
    finding: /its PDF is encrypted/,
    blocks: true,
  },
  {
    id: 'evidence-present',
    why: '§2.1033(b): the test report is an exhibit',
    breaks: (f) => void (f.evidence!.required[0].present = false),
    finding: /Nothing filed under “SAR test report”/,
    blocks: true,
  },
  {
    id: 'hotspot-edges',
    why: 'KDB 941225 D06: an edge with an antenna within 25 mm has its own position',
    breaks: (f) => void (f.hotspotEdges![0].edge = 'bottom'),
    finding: /The bottom edge is 8 mm from A1 and no hotspot use position tests it/,
    blocks: true,
  },
  {
    id: 'hotspot-edges',
    why: 'KDB 941225 D06: 25 mm is the line (the left edge moves from 31 mm to 24 mm)',
    breaks: (f) => void (f.hotspotEdges![1].distanceM = 0.024),
    finding: /The left edge is 24 mm from A2/,
    blocks: true,
  },
  {
    id: 'hotspot-edge-distances',
    why: 'KDB 941225 D06: which edges are tested follows from the drawing; nothing on file says what to upload',
    breaks: (f) => void (f.hotspotEdges = null),
    finding: /No antenna location drawing with readable text is on file/,
    blocks: false,
  },
  {
    id: 'hotspot-edge-distances',
    why: 'an antenna the drawing does not place',
    breaks: (f) => void (f.hotspotEdges = f.hotspotEdges!.filter((e) => e.antennaId !== 'A2')),
    finding: /gives no edge distance for A2/,
    blocks: false,
  },
  {
    id: 'hotspot-edges',
    why: 'KDB 941225 D06: a transmitter on the near antenna is measured',
    breaks: (f) => void (f.lab!.measurements = f.lab!.measurements.filter((m) => m.usePositionId !== 'hotspot-top')),
    finding: /LTE-B2 at hotspot “hotspot-top” \(top edge, 8 mm from A1\) needs SAR and has no measurement/,
    blocks: true,
  },
  {
    id: 'mpe-evaluation',
    why: '§1.1310(e) Table 1: an MPE evaluation on file',
    breaks: (f) => void (f.screening!.rows[1].result = 'evaluate-mpe'),
    finding: /WLAN at “body”, US FCC: needs an MPE evaluation/,
    blocks: false,
  },
  {
    id: 'thin-exemption-margin',
    why: 'common practice: 1 dB margin',
    breaks: (f) => void (f.screening!.rows[1].marginDb = 0.4),
    finding: /exempt with only 0\.40 dB to spare/,
    blocks: false,
  },
];

describe.each(cases)('rule $id ($why)', ({ id, breaks, finding, blocks }) => {
  it('does not fail on the complete filing', () => {
    expect(item(passing(), id).status).not.toBe('fail');
  });
  it('fails, says what to fix, and blocks signing only when it is a blocking rule', () => {
    const f = passing();
    breaks(f);
    const list = evaluateReadiness(f);
    const it = list.items.find((i) => i.id === id)!;
    expect(it.status).toBe('fail');
    expect(it.findings.map((x) => x.text).join('\n')).toMatch(finding);
    expect(list.ready).toBe(!blocks);
    expect(list.counts[blocks ? 'blocking' : 'warnings']).toBeGreaterThanOrEqual(1);
    if (!blocks) expect(list.counts.blocking).toBe(0);
  });
});

describe('rules that do not apply', () => {
  it('a filing with nothing needing SAR, no combinations and no lab, evidence or manual data is judged only on what it has', () => {
    const f = passing();
    f.screening!.rows = f.screening!.rows.map((r) => ({ ...r, result: 'exempt' as const, marginDb: 3 }));
    f.simultaneous = [];
    f.lab = null;
    f.evidence = null;
    f.reportTuneUps = null;
    f.reportFindings = null;
    f.manualSeparations = null;
    f.hotspotEdges = null;
    f.usePositions = f.usePositions.filter((p) => p.kind !== 'hotspot');
    const list = evaluateReadiness(f);
    const na = list.items.filter((i) => i.status === 'not-applicable').map((i) => i.id);
    expect(na).toEqual(
      expect.arrayContaining([
        'sar-measured',
        'co-transmission-evaluated',
        'evidence-present',
        'manual-separation',
        'hotspot-edges',
        'hotspot-edge-distances',
        'uncertainty-given',
        'tune-up-consistent',
        'report-agrees',
        'lab-records-complete',
        'measurements-match-device',
        'tested-at-use-separation',
      ]),
    );
    // Nothing is passed silently: the body-worn position's manual separation is asked for (a warning).
    expect(list.items.find((i) => i.id === 'manual-separation-stated')!.status).toBe('fail');
    expect(list.ready).toBe(true);
  });

  it('without lab results, a combination that needs SAR has no measurement (nothing recorded is not a pass)', () => {
    const f = passing();
    f.lab = null;
    const list = evaluateReadiness(f);
    expect(list.items.find((i) => i.id === 'sar-measured')!.status).toBe('fail');
    expect(list.items.find((i) => i.id === 'co-transmission-evaluated')!.status).toBe('fail');
    expect(list.ready).toBe(false);
  });

  it('a long list of findings is cut at 50 with a count of the rest', () => {
    const f = passing();
    f.transmitters = Array.from({ length: 60 }, (_, i) => ({ id: `T${i}`, antennaId: 'A1', maxTuneUpPowerDbm: 10 }));
    const it = evaluateReadiness(f).items.find((i) => i.id === 'screening-coverage')!;
    expect(it.findings).toHaveLength(51);
    expect(it.findings[50].text).toMatch(/and \d+ more/);
  });
});

describe('explained read-back differences', () => {
  it('a report difference an engineer explained does not fail the check', () => {
    const f = passing();
    f.reportFindings!.push({ kind: 'separation', text: 'Report page 3 gives a body-worn separation of 15 mm.', explained: true });
    f.reportTuneUps!.push({ transmitterId: 'LTE-B2', reportTuneUpPowerDbm: 23, where: 'page 4', explained: true });
    expect(item(f, 'report-agrees').status).toBe('pass');
    expect(item(f, 'tune-up-consistent').status).toBe('pass');
  });
});

describe('hotspot edges and positions', () => {
  it('a position tests an edge when its id names the edge as a word', async () => {
    const { testsEdge } = await import('../../calc/readiness');
    expect(testsEdge('hotspot-top', 'top')).toBe(true);
    expect(testsEdge('HS_Top_edge', 'top')).toBe(true);
    expect(testsEdge('hotspot-topside', 'top')).toBe(false);
    expect(testsEdge('hotspot-back', 'top')).toBe(false);
  });
});
