/**
 * Readiness and compare (targets: the checklist of a 20-transmitter × 6-position × 4-market
 * filing with 500 measurements ≤ 20 ms; the comparison of two such versions ≤ 100 ms). The
 * filing is the screening bench's; the 500 measurements, checks and co-transmission entries are
 * generated (fictional). The comparison's second version raises four tune-up powers and moves a
 * separation, so screening rows, markets and checklist items move.
 */
import { evaluateReadiness, type ReadinessInput, type ReadinessLab } from '../../../calc/readiness';
import { screenParsed, screeningInput } from '../../../calc/screening';
import { compareSnapshots, type VersionSnapshot } from '../../../server/services/compare-service';
import type { VersionData } from '../../../server/services/readiness-service';
import type { BenchCase } from '../harness';
import { screeningBenchFiling } from './screening';

function versionData(raw = screeningBenchFiling()): VersionData {
  const parsed = screeningInput.parse(raw);
  return {
    data: {
      device: { name: 'Bench handset', model: 'BH-1', applicant: 'Halden Ridge Instruments', productType: 'phone', hardwareVersion: 'EVT', firmwareVersion: '0.9' },
      radios: {
        antennas: parsed.antennas.map((a) => ({ id: a.id, gainDbi: a.gainDbi, location: '' })),
        transmitters: parsed.transmitters.map((t) => ({ ...t, technology: t.technology ?? 'LTE', band: t.band ?? 'B' })),
      },
      'use-positions': { usePositions: parsed.usePositions },
      markets: { markets: parsed.markets },
    },
    simultaneous: [
      ['tx1', 'tx13'],
      ['tx2', 'tx14'],
      ['tx5', 'tx17', 'tx13'],
    ],
    unsavedSteps: [],
  };
}

function lab(v: VersionData): ReadinessLab {
  const txs = v.data.radios.transmitters;
  const positions = v.data['use-positions'].usePositions;
  const measurements = Array.from({ length: 500 }, (_, i) => {
    const t = txs[i % txs.length];
    const p = positions[i % positions.length];
    return { measurementId: `M${i + 1}`, transmitterId: t.id, usePositionId: p.id, measuredPowerDbm: t.maxTuneUpPowerDbm - 0.3, tuneUpPowerDbm: t.maxTuneUpPowerDbm, testSeparationM: 0.005 };
  });
  const regimes = v.data.markets.markets.map((m) => m.regime);
  return {
    measurements,
    highest: regimes.flatMap((regime) => (['head', 'body-worn', 'hotspot', 'extremity'] as const).map((usePositionKind, k) => ({ regime, usePositionKind, reportedSarWPerKg: 0.4 + k * 0.2, limitWPerKg: 1.6, transmitterId: 'tx1', usePositionId: 'pos1' }))),
    checks: Array.from({ length: 120 }, (_, i) => ({ kind: 'liquid' as const, ok: i % 40 !== 0, label: `Check ${i + 1}` })),
    coTransmission: v.simultaneous.flatMap((g) => positions.flatMap((p) => regimes.map((regime) => ({ transmitterIds: g, usePositionId: p.id, regime, status: 'within-limit' as const })))),
    uncertainty: { required: true, given: true },
  };
}

function input(v: VersionData): { input: ReadinessInput; screening: ReturnType<typeof screenParsed> } {
  const screening = screenParsed(screeningInput.parse({ markets: v.data.markets.markets, antennas: v.data.radios.antennas, transmitters: v.data.radios.transmitters, usePositions: v.data['use-positions'].usePositions }));
  return {
    screening,
    input: {
      device: v.data.device,
      unsavedSteps: [],
      antennaIds: v.data.radios.antennas.map((a) => a.id),
      transmitters: v.data.radios.transmitters,
      usePositions: v.data['use-positions'].usePositions,
      regimes: v.data.markets.markets.map((m) => m.regime),
      simultaneous: v.simultaneous,
      screening: { rows: screening.rows, gaps: screening.gaps },
      lab: lab(v),
      evidence: { required: Array.from({ length: 12 }, (_, i) => ({ category: `c${i}`, label: `Category ${i}`, present: i !== 7 })) },
      reportTuneUps: v.data.radios.transmitters.map((t) => ({ transmitterId: t.id, reportTuneUpPowerDbm: t.maxTuneUpPowerDbm, where: 'p. 3', explained: false })),
      reportFindings: [],
      manualSeparations: v.data['use-positions'].usePositions.map((p) => ({ usePositionId: p.id, statedSeparationM: 0.01 })),
      hotspotEdges: null,
    },
  };
}

const summary: string[] = [];

export const readinessCase: BenchCase = {
  name: 'readiness checklist: 20 tx × 6 positions × 4 markets, 500 measurements',
  targetMs: 20,
  warmupIterations: 20,
  iterations: 200,
  prepare() {
    const { input: inp, screening } = input(versionData());
    const list = evaluateReadiness(inp);
    summary.length = 0;
    summary.push(`${screening.rows.length} screening rows, ${inp.lab!.measurements.length} measurements; ${list.items.length} items: ${JSON.stringify(list.counts)}`);
    return () => evaluateReadiness(inp);
  },
  describe: () => summary,
};

function snapshot(number: number, v: VersionData): VersionSnapshot {
  const { input: inp, screening } = input(v);
  return { number, state: number === 1 ? 'signed' : 'draft', data: v, screening, checklist: evaluateReadiness(inp), lab: inp.lab };
}

const compareSummary: string[] = [];

export const compareCase: BenchCase = {
  name: 'compare two versions: 20 tx × 6 positions × 4 markets each',
  targetMs: 100,
  warmupIterations: 10,
  iterations: 100,
  prepare() {
    const va = versionData();
    const raw = screeningBenchFiling();
    raw.transmitters.slice(0, 4).forEach((t) => (t.maxTuneUpPowerDbm = (t.maxTuneUpPowerDbm ?? 0) + 3));
    raw.usePositions[1].separations[0].separationM = 0.015;
    const vb = versionData(raw);
    // Timed from each version's data: both screenings, both checklists and the comparison.
    const run = () => compareSnapshots(1, snapshot(1, va), snapshot(2, vb));
    const c = run();
    compareSummary.length = 0;
    compareSummary.push(`${c.fields.length} changed fields; moved: ${c.impact.screening.length} screening rows, ${c.impact.checklist.length} checklist items, ${c.impact.markets.length} markets`);
    return run;
  },
  describe: () => compareSummary,
};
