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
      { measurementId: 'M2', transmitterId: 'LTE-B2', usePositionId: 'hotspot-back', measuredPowerDbm: 23.1, tuneUpPowerDbm: 23.5, testSeparationM: 0.01 },
    ],
    highest: [{ regime: 'fcc', usePositionKind: 'body-worn', reportedSarWPerKg: 1.19, limitWPerKg: 1.6, transmitterId: 'LTE-B2', usePositionId: 'body' }],
    checks: [{ kind: 'liquid', ok: true, label: 'Liquid 1880 MHz, εr −2.1 %, σ +3.0 % (±5 %)' }],
    coTransmission: ['body', 'hotspot-back'].flatMap((usePositionId) =>
      (['fcc', 'eu'] as const).map((regime) => ({ transmitterIds: ['LTE-B2', 'WLAN'], usePositionId, regime, status: 'within-limit' as const })),
    ),
    uncertainty: { required: true, given: true },
  };
  const positions = [
    { id: 'body', kind: 'body-worn' as const, separations: [{ antennaId: 'A1', separationM: 0.01 }, { antennaId: 'A2', separationM: 0.01 }] },
    { id: 'hotspot-back', kind: 'hotspot' as const, separations: [{ antennaId: 'A1', separationM: 0.01 }, { antennaId: 'A2', separationM: 0.03 }] },
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
    manualSeparations: [{ usePositionId: 'body', statedSeparationM: 0.015 }],
    hotspotEdges: [{ edge: 'top', antennaId: 'A1', distanceM: 0.008, usePositionId: 'hotspot-back' }],
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
    finding: /“hotspot-back”, EU needs a simultaneous measurement/,
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
    id: 'evidence-present',
    why: '§2.1033(b): the test report is an exhibit',
    breaks: (f) => void (f.evidence!.required[0].present = false),
    finding: /Nothing filed under “SAR test report”/,
    blocks: true,
  },
  {
    id: 'hotspot-edges',
    why: 'KDB 941225 D06: an edge with an antenna within 25 mm has its own position',
    breaks: (f) => void (f.hotspotEdges![0].usePositionId = null),
    finding: /Edge “top” is 8 mm from A1 and has no hotspot use position/,
    blocks: true,
  },
  {
    id: 'hotspot-edges',
    why: 'KDB 941225 D06: a transmitter on the near antenna is measured',
    breaks: (f) => void (f.lab!.measurements = f.lab!.measurements.filter((m) => m.usePositionId !== 'hotspot-back')),
    finding: /LTE-B2 at hotspot “hotspot-back” needs SAR and has no measurement/,
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
    f.manualSeparations = null;
    f.hotspotEdges = null;
    f.usePositions = f.usePositions.filter((p) => p.kind !== 'hotspot');
    const list = evaluateReadiness(f);
    const na = list.items.filter((i) => i.status === 'not-applicable').map((i) => i.id);
    expect(na).toEqual(expect.arrayContaining(['sar-measured', 'co-transmission-evaluated', 'evidence-present', 'manual-separation', 'hotspot-edges', 'uncertainty-given', 'tune-up-consistent']));
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
