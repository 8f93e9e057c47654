/**
 * Readiness and compare (targets: the checklist of a 20-transmitter × 6-position × 4-market
 * filing with 500 measurements ≤ 20 ms; the comparison of two such versions ≤ 100 ms).
 *
 * - The checklist: the pure rules (calc/readiness) on the input the server builds, whose lab part
 *   comes from the real calc/lab `lab-results` over 500 generated measurements (so every drift,
 *   separation, repeat and calibration check the rules read is there).
 * - The comparison: `compareVersions` of server/services/compare-service.ts on a real SQLite file,
 *   as GET /api/filings/:id/compare runs it: both versions read, screened, their lab results
 *   taken, their evidence and documents read, both checklists and the comparison. Version 2
 *   raises four tune-up powers, moves a separation and re-measures 20 rows, so screening rows,
 *   markets, lab results and checklist items move. Timed twice: with the lab results cached per
 *   input hash (every read after the first), and cold (the cache emptied before each call: the
 *   first read after a change).
 * Data is fictional.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import { evaluateReadiness, type ReadinessInput } from '../../../calc/readiness';
import { computeLabResults, labResultsInput, labScreeningRows } from '../../../calc/lab/lab-results';
import { screenParsed, screeningInput } from '../../../calc/screening';
import { openDatabase, type DbHandle } from '../../../db/client';
import { applyMigrations } from '../../../db/migrate';
import { filingVersions, memberships, membershipRoles, users } from '../../../db/schema';
import { zDeviceFile } from '../../../constants/schemas/device-file';
import type { Role } from '../../../constants/schemas/roles';
import { seedDemo } from '../../../seeds';
import { compareVersions } from '../../../server/services/compare-service';
import { importDeviceFile, saveStep, type FilingActor } from '../../../server/services/filings-service';
import { replaceLabSet } from '../../../server/services/lab-service';
import { clearReadinessCaches, labDeviceDataOf, labFeed, readVersionData, screeningInputOf } from '../../../server/services/readiness-service';
import { findVersion } from '../../../server/repos/review-repo';
import { readLabData } from '../../../server/repos/lab-repo';
import { startNextVersion } from '../../../server/services/review-service';
import type { BenchCase } from '../harness';
import { benchMeasurements } from './lab';
import { largeDeviceFile } from './screening-api';

const SIMULTANEOUS = [
  ['T1', 'T7'],
  ['T2', 'T9', 'T15'],
  ['T5', 'T17'],
];
const LIQUID = [{ id: 'L1', date: '2026-11-10', frequencyHz: 1.9e9, relativePermittivity: 40.2, conductivitySPerM: 1.42 }];
const SYSTEM = [{ id: 'S1', date: '2026-11-10', frequencyHz: 1.9e9, dipoleSerial: 'D1900-7', measuredSarWPerKgPerW: 40.1, targetSarWPerKgPerW: 39.7 }];
const INSTRUMENTS = [
  { id: 'P1', kind: 'probe', model: 'EP-4', serial: '4471', calibrationDate: '2026-05-01', dueDate: '2027-05-01' },
  { id: 'D1', kind: 'dae', model: 'DA-2', serial: '812', calibrationDate: '2026-05-01', dueDate: '2027-05-01' },
];

const measurements = (n: number, powerOffsetDb = 0) => benchMeasurements(n, powerOffsetDb);

/** The checklist input of the bench filing, with the lab part from the real lab results. */
function benchInput(): ReadinessInput {
  const file = largeDeviceFile();
  const screening = screenParsed(screeningInput.parse({ markets: file.markets, antennas: file.antennas, transmitters: file.transmitters, usePositions: file.usePositions }));
  const { derivation: _d, ...results } = computeLabResults(
    labResultsInput.parse({
      markets: file.markets,
      transmitters: file.transmitters,
      usePositions: file.usePositions,
      simultaneous: SIMULTANEOUS,
      screening: labScreeningRows(screening.rows),
      measurements: measurements(500),
      liquidChecks: LIQUID,
      systemChecks: SYSTEM,
      instruments: INSTRUMENTS,
    }),
  );
  return {
    device: { hardwareVersion: 'EVT', firmwareVersion: '0.9', ...file.device },
    unsavedSteps: [],
    antennaIds: file.antennas.map((a) => a.id),
    transmitters: file.transmitters,
    usePositions: file.usePositions,
    regimes: file.markets.map((m) => m.regime as 'fcc'),
    simultaneous: SIMULTANEOUS,
    screening: { rows: screening.rows, gaps: screening.gaps },
    lab: labFeed({ results, orphans: [], stored: 500 }),
    evidence: { required: Array.from({ length: 12 }, (_, i) => ({ category: `c${i}`, label: `Category ${i}`, present: i !== 7 })) },
    reportTuneUps: file.transmitters.map((t) => ({ transmitterId: t.id, reportTuneUpPowerDbm: t.maxTuneUpPowerDbm, where: 'p. 3', explained: false })),
    reportFindings: [{ kind: 'separation', text: 'Report page 4 gives a head separation of 5 mm.', explained: false }],
    manualSeparations: file.usePositions.map((p) => ({ usePositionId: p.id, statedSeparationM: 0.01 })),
    hotspotEdges: file.antennas.flatMap((a, i) => ['top', 'left'].map((edge, j) => ({ edge, antennaId: a.id, distanceM: 0.006 * (i + j + 1) }))),
  };
}

const summary: string[] = [];

export const readinessCase: BenchCase = {
  name: 'readiness checklist (pure rules): 20 tx × 6 positions × 4 markets, 500 measurements',
  targetMs: 20,
  warmupIterations: 20,
  iterations: 200,
  prepare() {
    const inp = benchInput();
    const list = evaluateReadiness(inp);
    summary.length = 0;
    summary.push(
      `${inp.screening!.rows.length} screening rows, ${inp.lab!.measurements.length} measurements, ${inp.lab!.checks.length} lab checks, ${inp.lab!.coTransmission.length} co-transmission sums; ${list.items.length} items: ${JSON.stringify(list.counts)}`,
    );
    return () => evaluateReadiness(inp);
  },
  describe: () => summary,
};

// ---------------------------------------------------------------------------------------------
// The comparison, from the database.

export interface CompareFixture {
  handle: DbHandle;
  dir: string;
  actor: FilingActor;
  filingId: number;
}

function actorFor(handle: DbHandle, email: string): FilingActor {
  const db = handle.db;
  const m = db
    .select({ id: users.id, organisationId: memberships.organisationId, membershipId: memberships.id })
    .from(users)
    .innerJoin(memberships, eq(memberships.userId, users.id))
    .where(eq(users.email, email))
    .get()!;
  const roles = db
    .select({ role: membershipRoles.role })
    .from(membershipRoles)
    .where(eq(membershipRoles.membershipId, m.membershipId))
    .all()
    .map((r) => r.role as Role);
  return { id: m.id, organisationId: m.organisationId, roles };
}

/** One filing, version 1 signed and version 2 changed. */
export async function compareFixture(): Promise<CompareFixture> {
  {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-bench-'));
    const handle = openDatabase(path.join(dir, 'fieldfile.db'));
    applyMigrations(handle.db);
    await seedDemo(handle.db, 'bench-password-123');
    const db = handle.db;
    const specialist = actorFor(handle, 'specialist@fieldfile.test');
    const engineer = actorFor(handle, 'engineer@fieldfile.test');
    const file = zDeviceFile.parse({ ...largeDeviceFile(), simultaneous: SIMULTANEOUS });
    const filingId = importDeviceFile(db, specialist, file).id;
    replaceLabSet(db, engineer, filingId, 'liquid-checks', { liquidChecks: LIQUID });
    replaceLabSet(db, engineer, filingId, 'system-checks', { systemChecks: SYSTEM });
    replaceLabSet(db, engineer, filingId, 'instruments', { instruments: INSTRUMENTS });
    replaceLabSet(db, engineer, filingId, 'measurements', { measurements: measurements(500) });
    // Signed without the review flow (this filing is not ready): the bench only reads it.
    db.update(filingVersions).set({ state: 'signed' }).where(eq(filingVersions.filingId, filingId)).run();
    startNextVersion(db, specialist, filingId);
    const radios = { antennas: file.antennas, transmitters: file.transmitters.map((t, i) => (i < 4 ? { ...t, maxTuneUpPowerDbm: t.maxTuneUpPowerDbm + 3 } : t)) };
    const usePositions = file.usePositions.map((p, i) => (i === 1 ? { ...p, separations: p.separations.map((s, j) => (j === 0 ? { ...s, separationM: 0.015 } : s)) } : p));
    for (const [step, body] of [
      ['radios', radios],
      ['use-positions', { usePositions }],
    ] as const) {
      const saved = saveStep(db, specialist, filingId, step, body);
      if (!saved.saved) throw new Error(`bench: the ${step} step did not save`);
    }
    replaceLabSet(db, engineer, filingId, 'measurements', { measurements: measurements(500, 0.4) });
    return { handle, dir, actor: specialist, filingId };
  }
}

const compareSummary: string[] = [];

/** CPU ms per call (user + system) after a few untimed calls, so the JIT has compiled it. */
const cpuMsOf = (fn: () => unknown, n: number) => {
  for (let i = 0; i < 3; i++) fn();
  const cpu0 = process.cpuUsage();
  for (let i = 0; i < n; i++) fn();
  const cpu = process.cpuUsage(cpu0);
  return (cpu.user + cpu.system) / 1000 / n;
};

/**
 * The engine's share of a cold comparison: both versions' screening and lab results computed
 * alone from the same (already validated) inputs, CPU ms per comparison. What the comparison
 * spends beyond it is the services' part: reads, validation, hashing, the checklist feeds and
 * rules, the diff, and the collections of what they allocate.
 */
function engineShare(f: CompareFixture, n: number): { screeningMs: number; labMs: number } {
  const inputs = [1, 2].map((number) => {
    const version = findVersion(f.handle.db, f.filingId, number)!;
    const data = readVersionData(f.handle.db, version, 0);
    const screening = screeningInputOf(data)!;
    const device = labDeviceDataOf(data);
    const lab = readLabData(f.handle.db, version.id);
    const labInput = labResultsInput.parse({
      ...device,
      screening: labScreeningRows(screenParsed(screening).rows),
      measurements: lab.measurements,
      liquidChecks: lab.liquidChecks,
      systemChecks: lab.systemChecks,
      instruments: lab.instruments,
      uncertainty: lab.components,
    });
    return { screening, labInput };
  });
  return {
    screeningMs: cpuMsOf(() => inputs.forEach((i) => screenParsed(i.screening)), n),
    labMs: cpuMsOf(() => inputs.forEach((i) => computeLabResults(i.labInput)), n),
  };
}

function compareCase(cold: boolean): BenchCase {
  let release: (() => void) | undefined;
  let cpuNote = '';
  return {
    name: `compare two versions from SQLite (compare-service), 20 tx × 6 positions × 4 markets, 500 measurements each; screening and lab results ${cold ? 'computed (caches emptied each call)' : 'cached per input hash'}`,
    targetMs: 100,
    warmupIterations: cold ? 3 : 10,
    iterations: cold ? 30 : 100,
    async prepare() {
      const f = await compareFixture();
      release = () => {
        f.handle.sqlite.close();
        fs.rmSync(f.dir, { recursive: true, force: true });
      };
      const run = () => {
        if (cold) clearReadinessCaches();
        return compareVersions(f.handle.db, f.actor, f.filingId, 1, 2);
      };
      const c = run();
      if (!cold) {
        compareSummary.length = 0;
        compareSummary.push(
          `${c.fields.length} changed fields; moved: ${c.impact.screening.length} screening rows, ${c.impact.checklist.length} checklist items, ${c.impact.markets.length} markets, ${c.impact.lab.length} highest reported SAR`,
        );
      }
      // CPU time per call (user + system), which a busy machine inflates less than the wall clock.
      const n = cold ? 10 : 30;
      const perCallMs = cpuMsOf(run, n);
      cpuNote = `CPU time per call: ${perCallMs.toFixed(1)} ms (mean of ${n})`;
      if (cold) {
        const { screeningMs, labMs } = engineShare(f, n);
        cpuNote += `; of it the engine alone (both versions, same inputs): screening ${screeningMs.toFixed(1)} ms + lab results ${labMs.toFixed(1)} ms = ${(screeningMs + labMs).toFixed(
          1,
        )} ms, services ${(perCallMs - screeningMs - labMs).toFixed(1)} ms (reads, validation, hashes, checklist, diff, collections)`;
      }
      return run;
    },
    teardown: () => release?.(),
    describe: () => [cpuNote, ...(cold ? [] : compareSummary)],
  };
}

export const compareCachedCase = compareCase(false);
export const compareColdCase = compareCase(true);
