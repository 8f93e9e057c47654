/**
 * Issue 4's target: GET /api/filings/:id/screening for a 20-transmitter × 6-position × 4-market
 * filing, over real HTTP on loopback against the real app and a SQLite file, under 50 ms.
 */
import type { BenchCase } from '../harness';
import { startBenchServer } from '../bench-server';
import { DEVICE_FILE_FORMAT, USE_POSITION_KINDS } from '../../../constants/schemas/device-file';

/** 20 transmitters on 5 antennas spread from 700 MHz to 5.8 GHz, 6 positions, 4 markets. */
export function largeDeviceFile() {
  const antennas = Array.from({ length: 5 }, (_, i) => ({ id: `A${i + 1}`, gainDbi: -1 + i, location: '' }));
  const transmitters = Array.from({ length: 20 }, (_, i) => {
    const minHz = 700e6 + i * 250e6;
    return { id: `T${i + 1}`, technology: 'LTE', band: `B${i + 1}`, frequencyMinHz: minHz, frequencyMaxHz: minHz + 60e6, maxTuneUpPowerDbm: 10 + (i % 14), dutyCycle: 1, antennaId: `A${(i % 5) + 1}` };
  });
  const kinds = [...USE_POSITION_KINDS, 'body-worn'] as const;
  const usePositions = kinds.map((kind, i) => ({
    id: `P${i + 1}`,
    kind,
    separations: antennas.map((a, j) => ({ antennaId: a.id, separationM: kind === 'far-field' ? 0.2 + j * 0.1 : 0.002 * (i + j) })),
  }));
  return {
    format: DEVICE_FILE_FORMAT,
    device: { name: 'Bench device', model: 'B-1', applicant: 'Bench', productType: 'phone' },
    markets: [{ regime: 'fcc' }, { regime: 'ised' }, { regime: 'eu' }, { regime: 'icnirp-2020' }],
    antennas,
    transmitters,
    usePositions,
    simultaneous: [],
  };
}

let cleanup: (() => Promise<void>) | undefined;

export const screeningApiCase: BenchCase = {
  name: 'GET /api/filings/:id/screening (20 tx × 6 positions × 4 markets, HTTP + SQLite)',
  targetMs: 50,
  warmupIterations: 5,
  iterations: 60,
  async prepare() {
    const server = await startBenchServer();
    const imported = await server.post('/filings/import', largeDeviceFile());
    const { filing } = (await imported.json()) as { filing: { id: number } };
    const { base, cookie } = server;
    cleanup = () => server.close();
    return async () => {
      const res = await fetch(`${base}/filings/${filing.id}/screening`, { headers: { cookie } });
      const body = (await res.json()) as { rows: unknown[] };
      if (body.rows.length !== 480) throw new Error(`expected 480 rows, got ${body.rows.length}`);
    };
  },
  teardown: () => cleanup?.(),
  describe: () => ['includes session lookup, reading the filing, the engine, storing a new result only when the input changed, and JSON over loopback'],
};
