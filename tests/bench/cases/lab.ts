/**
 * Lab results (issue 9's targets):
 * - recomputing the lab results of a 500-measurement filing (20 transmitters × 6 positions ×
 *   4 markets, with checks and co-transmission), input validation included: under 50 ms;
 * - importing a 5 000-row CSV over real HTTP (multipart upload, sniff, parse, validate, store in
 *   one transaction) and computing its lab results: under 1.5 s, with server memory growth (RSS)
 *   under 100 MB, reported below the timing.
 * Data is fictional: measurements spread over every transmitter and use position.
 */
import type { BenchCase } from '../harness';
import { startServerChild } from '../server-child';
import { computeLabResults, labResultsInput, labScreeningRows, type LabResultsInputRaw } from '../../../calc/lab/lab-results';
import { screenDevice } from '../../../calc/screening';
import { largeDeviceFile } from './screening-api';

export function measurementRows(n: number) {
  const file = largeDeviceFile();
  return Array.from({ length: n }, (_, i) => {
    const tx = file.transmitters[i % file.transmitters.length];
    const pos = file.usePositions[(i * 7) % file.usePositions.length];
    const sep = pos.separations.find((s) => s.antennaId === tx.antennaId)!.separationM;
    return {
      tx: tx.id,
      pos: pos.id,
      mhz: (tx.frequencyMinHz + tx.frequencyMaxHz) / 2e6,
      sepMm: Math.round(sep * 1000 * 10) / 10,
      power: tx.maxTuneUpPowerDbm - 0.1 * (i % 9),
      sar1g: 0.1 + (i % 37) / 40,
      sar10g: 0.05 + (i % 29) / 50,
      drift: ((i % 11) - 5) / 50,
      date: `2026-11-${String(10 + (i % 15)).padStart(2, '0')}`,
      peak: [(i % 50) * 2, (i % 30) * 3] as const,
    };
  });
}

/** The rows as the lab data holds them; the first `lowerPowerRows` are measured `powerOffsetDb` lower. */
export function benchMeasurements(n: number, powerOffsetDb = 0, lowerPowerRows = 20) {
  return measurementRows(n).map((m, i) => ({
    id: `M${i + 1}`,
    transmitterId: m.tx,
    usePositionId: m.pos,
    testPosition: `position ${i % 7}`,
    channel: String(i),
    frequencyHz: m.mhz * 1e6,
    testSeparationM: m.sepMm / 1000,
    measuredPowerDbm: m.power - (i < lowerPowerRows ? powerOffsetDb : 0),
    sar1gWPerKg: m.sar1g,
    sar10gWPerKg: m.sar10g,
    driftDb: m.drift,
    testDate: m.date,
    peakXMm: m.peak[0],
    peakYMm: m.peak[1],
    liquidCheckId: 'L1',
    systemCheckId: 'S1',
  }));
}

function labInput(n: number): LabResultsInputRaw {
  const file = largeDeviceFile();
  const screening = screenDevice(file as never);
  return {
    markets: file.markets.map((m) => ({ regime: m.regime as 'fcc' })),
    transmitters: file.transmitters,
    usePositions: file.usePositions,
    simultaneous: [
      ['T1', 'T7'],
      ['T2', 'T9', 'T15'],
    ],
    screening: labScreeningRows(screening.rows),
    measurements: benchMeasurements(n),
    liquidChecks: [{ id: 'L1', date: '2026-11-10', frequencyHz: 1.9e9, relativePermittivity: 40.2, conductivitySPerM: 1.42 }],
    systemChecks: [{ id: 'S1', date: '2026-11-10', frequencyHz: 1.9e9, measuredSarWPerKgPerW: 40.1, targetSarWPerKgPerW: 39.7 }],
    instruments: [{ id: 'P1', kind: 'probe', calibrationDate: '2026-05-01', dueDate: '2027-05-01' }],
  };
}

export const labRecomputeCase: BenchCase = {
  name: 'lab results recompute (500 measurements, 20 tx × 6 positions × 4 markets)',
  targetMs: 50,
  warmupIterations: 10,
  iterations: 60,
  prepare() {
    const raw = labInput(500);
    return () => {
      const r = computeLabResults(labResultsInput.parse(raw));
      if (r.rows.length !== 500) throw new Error('expected 500 rows');
    };
  },
  describe: () => ['validation (zod) + scaling, margins, highest per market × condition, every check, coverage and co-transmission'],
};

let cleanup: (() => Promise<void>) | undefined;
let serverNote = '';

/** Memory growth the issue allows the server for this import, MB (RSS peak over the runs minus RSS before them). */
const SERVER_GROWTH_TARGET_MB = 100;

export const labImportCase: BenchCase = {
  name: 'POST measurements/import 5 000-row CSV + GET lab-results (HTTP + SQLite)',
  targetMs: 1500,
  warmupIterations: 1,
  iterations: 5,
  async prepare() {
    // The server runs in its own process, so its memory and CPU are its own (the client parses a
    // 5 000-row answer here, which is not the server's memory).
    const server = await startServerChild();
    if (typeof server === 'string') return server;
    cleanup = () => server.close();
    const { base } = server;
    const [specialist, engineer] = [await server.login('specialist@fieldfile.test'), await server.login('engineer@fieldfile.test')];
    const imported = await fetch(`${base}/filings/import`, { method: 'POST', headers: { 'content-type': 'application/json', cookie: specialist }, body: JSON.stringify(largeDeviceFile()) });
    const { filing } = (await imported.json()) as { filing: { id: number } };
    const header =
      'transmitter_id,use_position_id,test_position,channel,frequency_mhz,test_separation_mm,measured_power_dbm,tune_up_power_dbm,test_duty_cycle,sar_1g_w_kg,sar_10g_w_kg,drift_db,test_date,peak_x_mm,peak_y_mm';
    const rows = measurementRows(5000);
    // Each run's file differs (the run number is in the test position), so every run stores and recomputes.
    let run = 0;
    const csvFor = (r: number) =>
      [
        header,
        ...rows.map(
          (m, i) => `${m.tx},${m.pos},back ${r},${i},${m.mhz},${m.sepMm},${m.power.toFixed(2)},,,${m.sar1g.toFixed(3)},${m.sar10g.toFixed(3)},${m.drift},${m.date},${m.peak[0]},${m.peak[1]}`,
        ),
      ].join('\n');
    const rssStartBytes = server.memory().rssBytes;
    const cpuStartMs = server.cpuMs();
    let calls = 0;
    return async () => {
      const form = new FormData();
      form.append('file', new Blob([csvFor(run++)], { type: 'text/csv' }), 'lab.csv');
      const res = await fetch(`${base}/filings/${filing.id}/measurements/import`, { method: 'POST', headers: { cookie: engineer }, body: form });
      if (res.status !== 201) throw new Error(`import answered ${res.status}: ${(await res.text()).slice(0, 300)}`);
      const results = await fetch(`${base}/filings/${filing.id}/lab-results`, { headers: { cookie: engineer } });
      const body = (await results.json()) as { rows: unknown[] };
      if (body.rows.length !== 5000) throw new Error(`expected 5000 rows, got ${body.rows.length}`);
      calls++;
      const { peakRssBytes, rssBytes } = server.memory();
      const growthMb = (peakRssBytes - rssStartBytes) / 1024 / 1024;
      serverNote = [
        `server memory growth ${growthMb.toFixed(0)} MB (peak RSS over ${calls} runs ${(peakRssBytes / 1024 / 1024).toFixed(0)} MB − ${(rssStartBytes / 1024 / 1024).toFixed(0)} MB before; now ${(rssBytes / 1024 / 1024).toFixed(0)} MB), target ≤ ${SERVER_GROWTH_TARGET_MB} MB: ${growthMb <= SERVER_GROWTH_TARGET_MB ? 'under target' : 'OVER TARGET'}`,
        `server CPU ${((server.cpuMs() - cpuStartMs) / calls).toFixed(0)} ms per run (its own process; the CPU figure above is the bench client’s)`,
      ].join('\n      ');
    };
  },
  teardown: () => cleanup?.(),
  describe: () => ['CSV of 5 000 rows (about 0.45 MB), different in each run, so each run replaces the measurements and recomputes; building the CSV text is inside the timing too', serverNote],
};
