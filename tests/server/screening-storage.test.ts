/**
 * Storage does not grow with reading: a draft's screening is computed on demand and cached per
 * app instance, never stored; signing stores exactly the result the version is signed on.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, seedUsers, signIn, type TestApp } from './support/test-app';

const device = { name: 'Kittiwake K2 sensor', model: 'KW2-A', applicant: 'Halden Ridge Instruments', productType: 'iot-module' };
const radios = (powerDbm: number) => ({
  antennas: [{ id: 'ANT-1', gainDbi: 2, location: 'top edge' }],
  transmitters: [{ id: 'BLE', technology: 'Bluetooth LE', band: '2.4 GHz ISM', frequencyMinHz: 2402e6, frequencyMaxHz: 2480e6, maxTuneUpPowerDbm: powerDbm, dutyCycle: 1, antennaId: 'ANT-1' }],
});
const positions = { usePositions: [{ id: 'wrist', kind: 'extremity', separations: [{ antennaId: 'ANT-1', separationM: 0.005 }] }] };
const markets = { markets: [{ regime: 'fcc', tier: 'general' }] };

async function filingWith(t: TestApp, powerDbm: number) {
  const specialist = await signIn(t, 'specialist@fieldfile.test');
  const id = (await specialist.post('/api/filings').send({ device })).body.filing.id as number;
  await specialist.put(`/api/filings/${id}/steps/radios`).send(radios(powerDbm));
  await specialist.put(`/api/filings/${id}/steps/use-positions`).send(positions);
  await specialist.put(`/api/filings/${id}/steps/markets`).send(markets);
  return { specialist, id };
}

const storedCount = (t: TestApp) => (t.handle.sqlite.prepare('select count(*) as n from screening_results').get() as { n: number }).n;

describe('screening storage', () => {
  let a: TestApp;
  let b: TestApp;
  beforeAll(async () => {
    [a, b] = await Promise.all([createTestApp(), createTestApp()]);
    await Promise.all([seedUsers(a), seedUsers(b)]);
  });
  afterAll(async () => {
    await a.close();
    await b.close();
  });

  it('ten edit-and-view cycles of a draft store nothing', async () => {
    const { specialist, id } = await filingWith(a, 4);
    for (let i = 0; i < 10; i++) {
      await specialist.put(`/api/filings/${id}/steps/radios`).send(radios(4 + i));
      const res = await specialist.get(`/api/filings/${id}/screening`).set('Accept-Encoding', i % 2 ? 'gzip' : 'identity');
      expect(res.status).toBe(200);
      expect(res.body.rows[0].powers.conductedPowerMw ?? res.body.rows[0].powers.timeAveragedPowerMw).toBeGreaterThan(0);
    }
    expect(storedCount(a)).toBe(0);
  });

  it('two app instances in one process answer from their own data, even for the same filing id', async () => {
    const one = await filingWith(a, 0);
    const two = await filingWith(b, 20);
    // Line the ids up: instance b creates filings until it reaches instance a's id.
    let idB = two.id;
    while (idB < one.id) idB = (await filingWith(b, 20)).id;
    expect(idB).toBe(one.id);
    for (const encoding of ['gzip', 'identity']) {
      const fromA = (await one.specialist.get(`/api/filings/${one.id}/screening`).set('Accept-Encoding', encoding)).body;
      const fromB = (await two.specialist.get(`/api/filings/${idB}/screening`).set('Accept-Encoding', encoding)).body;
      expect(fromA.rows[0].result).toBe('exempt');
      expect(fromB.rows[0].evaluatedPowerMw).toBeGreaterThan(fromA.rows[0].evaluatedPowerMw * 50);
    }
  });
});
