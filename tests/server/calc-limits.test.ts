/**
 * One request cannot stall everyone: calculation inputs are bounded by named limits
 * (calc/input-limits.ts), a refused input reports a bounded number of problems, calculations
 * run in worker threads with a time limit, and the API keeps answering meanwhile.
 * (Speed figures live in the bench, tests/bench/cases/calc-under-load.ts; here only outcomes
 * and their order are checked.)
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_CO_TRANSMITTERS, MAX_MEASUREMENTS, MAX_REPORTED_PROBLEMS, MAX_TRANSMITTERS } from '../../calc/input-limits';
import { createTestApp, seedUsers, signIn, type TestApp } from './support/test-app';

const heavyScreening = (transmitters: number, positions: number) => ({
  markets: [{ regime: 'fcc' }, { regime: 'ised' }, { regime: 'eu' }, { regime: 'icnirp-2020' }],
  antennas: [{ id: 'A', gainDbi: 2 }],
  transmitters: Array.from({ length: transmitters }, (_, i) => ({ id: `T${i}`, frequencyMinHz: 2.4e9, frequencyMaxHz: 2.48e9, maxTuneUpPowerDbm: 20, antennaId: 'A' })),
  usePositions: Array.from({ length: positions }, (_, i) => ({ id: `P${i}`, kind: 'body-worn', separations: [{ antennaId: 'A', separationM: 0.005 }] })),
});

describe('calculation limits', () => {
  let t: TestApp;
  let engineer: Awaited<ReturnType<typeof signIn>>;
  beforeAll(async () => {
    t = await createTestApp();
    await seedUsers(t);
    engineer = await signIn(t, 'engineer@fieldfile.test');
  });
  afterAll(() => t.close());

  it('3 000 co-transmitting transmitters: a 422 naming the limit, in a small answer', async () => {
    const transmitters = Array.from({ length: 3000 }, (_, i) => ({ id: `T${i}`, sarWPerKg: 0.1 }));
    const res = await engineer.post('/api/calc/simultaneous-transmission').send({ limitWPerKg: 1.6, transmitters });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(new RegExp(`transmitters: .*${MAX_CO_TRANSMITTERS}`));
    expect(res.text.length).toBeLessThan(10_000);
  });

  it('a screening of 128 × 64 × 4 is refused before it is computed', async () => {
    const res = await engineer.post('/api/calc/screening').send(heavyScreening(128, 64));
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(new RegExp(`transmitters: .*${MAX_TRANSMITTERS}`));
  });

  it('a 300 KB bad input reports at most the capped number of problems and counts the rest', async () => {
    const measurements = Array.from({ length: MAX_MEASUREMENTS }, (_, i) => ({
      id: `M${i}`,
      transmitterId: 'T',
      usePositionId: 'P',
      frequencyHz: -1,
      testSeparationM: 0,
      measuredPowerDbm: 1,
      testDate: 'yesterday',
    }));
    const body = { markets: [], transmitters: [], usePositions: [], measurements };
    expect(JSON.stringify(body).length).toBeGreaterThan(300_000);
    const res = await engineer.post('/api/calc/lab-results').send(body);
    expect(res.status).toBe(422);
    expect(res.body.error.issues).toHaveLength(MAX_REPORTED_PROBLEMS);
    expect(res.body.error.problemCount).toBe(2 * MAX_MEASUREMENTS);
    expect(res.body.error.message).toMatch(/and 9980 more problems/);
    expect(res.text.length).toBeLessThan(50_000);
  });

  it('a wizard step with hundreds of bad fields names the first 200 and says there are more', async () => {
    const specialist = await signIn(t, 'specialist@fieldfile.test');
    const { id } = (await specialist.post('/api/filings').send({ device: { name: 'Limits probe', model: 'LP-1', applicant: 'Halden Ridge Instruments', productType: 'iot-module' } })).body.filing;
    const transmitters = Array.from({ length: 64 }, (_, i) => ({
      id: `T${i}`,
      technology: 1,
      band: 2,
      frequencyMinHz: 'a',
      frequencyMaxHz: 'b',
      maxTuneUpPowerDbm: 'c',
      dutyCycle: 'd',
      antennaId: 3,
    }));
    const res = await specialist.put(`/api/filings/${id}/steps/radios`).send({ antennas: [], transmitters });
    expect(res.status).toBe(422);
    const names = Object.keys(res.body.error.fields);
    expect(names).toHaveLength(MAX_REPORTED_PROBLEMS + 1);
    expect(res.body.error.fields._more).toMatch(/and more problems \(\d+ in all\)/);
  });

  it('the API answers while the heaviest allowed calculation runs in a worker', async () => {
    const order: string[] = [];
    const heavy = engineer
      .post('/api/calc/screening')
      .send(heavyScreening(64, 24))
      .then((r) => {
        order.push('calc');
        return r;
      });
    // Give the request time to reach the pool, then ask for health.
    await new Promise((r) => setTimeout(r, 50));
    const health = await engineer.get('/api/health');
    order.push('health');
    const res = await heavy;
    expect(health.status).toBe(200);
    expect(res.status).toBe(200);
    expect(res.body.rows).toHaveLength(64 * 24 * 4);
    expect(order).toEqual(['health', 'calc']);
  });
});

describe('calculation time limit', () => {
  let t: TestApp;
  let engineer: Awaited<ReturnType<typeof signIn>>;
  beforeAll(async () => {
    // A limit no real calculation meets (a worker's first start alone takes longer).
    t = await createTestApp({ env: { FIELDFILE_CALC_TIME_LIMIT_MS: '100' } });
    await seedUsers(t);
    engineer = await signIn(t, 'engineer@fieldfile.test');
  });
  afterAll(() => t.close());

  it('a calculation past the limit is stopped: 503 with Retry-After and a message saying what to do', async () => {
    const res = await engineer.post('/api/calc/screening').send(heavyScreening(64, 24));
    expect(res.status).toBe(503);
    expect(res.headers['retry-after']).toBe('30');
    expect(res.body.error.code).toBe('calc_time_limit');
    expect(res.body.error.message).toMatch(/longer than 0\.1 s .*Split the input/);
    // The server is fine afterwards.
    expect((await engineer.get('/api/health')).status).toBe(200);
  });
});
