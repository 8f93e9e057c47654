/**
 * Optimistic concurrency on wizard steps: a save names the step revision it started from
 * (If-Match); when someone saved different data since, it is refused with 409 and the current
 * data, and nothing is written. Fifty saves racing from one revision: exactly one lands.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, seedUsers, signIn, type TestApp } from './support/test-app';

let t: TestApp;
let specialist: Awaited<ReturnType<typeof signIn>>;
let id: number;
const device = { name: 'Kittiwake K2 sensor', model: 'KW2-A', applicant: 'Halden Ridge Instruments', productType: 'iot-module' };
const radios = {
  antennas: [{ id: 'ANT-1', gainDbi: 2, location: 'top edge' }],
  transmitters: [{ id: 'BLE', technology: 'Bluetooth LE', band: '2.4 GHz ISM', frequencyMinHz: 2402e6, frequencyMaxHz: 2480e6, maxTuneUpPowerDbm: 8, dutyCycle: 1, antennaId: 'ANT-1' }],
};

beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  specialist = await signIn(t, 'specialist@fieldfile.test');
  id = (await specialist.post('/api/filings').send({ device })).body.filing.id;
});
afterAll(() => t.close());

const revisionOf = async (step: string) => (await specialist.get(`/api/filings/${id}`)).body.filing.revisions[step] as string;

describe('step saves with If-Match', () => {
  it('fifty saves from one revision: one is stored, forty-nine answer 409 with the stored data', async () => {
    const base = await revisionOf('radios');
    const answers = await Promise.all(
      Array.from({ length: 50 }, (_, i) =>
        specialist
          .put(`/api/filings/${id}/steps/radios`)
          .set('If-Match', `"${base}"`)
          .send({ ...radios, antennas: [{ ...radios.antennas[0], location: `edit ${i}` }] }),
      ),
    );
    const ok = answers.filter((a) => a.status === 200);
    const stale = answers.filter((a) => a.status === 409);
    expect(ok).toHaveLength(1);
    expect(stale).toHaveLength(49);
    const stored = (await specialist.get(`/api/filings/${id}`)).body.filing;
    const winner = ok[0].body.filing.data.radios.antennas[0].location;
    expect(stored.data.radios.antennas[0].location).toBe(winner);
    expect(stale[0].body.error.code).toBe('stale_step');
    expect(stale[0].body.error.message).toMatch(/nothing of yours was saved/);
    expect(stale[0].body.current.revision).toBe(stored.revisions.radios);
    expect(stale[0].body.current.data.antennas[0].location).toBe(winner);
    expect(stale[0].headers.etag).toBe(`"${stored.revisions.radios}"`);
  });

  it('a save based on the current revision lands and moves the revision on', async () => {
    const before = await revisionOf('radios');
    const res = await specialist
      .put(`/api/filings/${id}/steps/radios`)
      .set('If-Match', `"${before}"`)
      .send({ ...radios, antennas: [{ ...radios.antennas[0], location: 'bottom edge' }] });
    expect(res.status).toBe(200);
    expect(res.body.filing.revisions.radios).not.toBe(before);
    // Other steps keep their revisions: a radios save does not make a device save stale.
    const device = await specialist
      .put(`/api/filings/${id}/steps/device`)
      .set('If-Match', `"${res.body.filing.revisions.device}"`)
      .send({ ...res.body.filing.data.device, model: 'KW2-B' });
    expect(device.status).toBe(200);
  });

  it('a stale draft (invalid input) is refused too, and the stored data and drafts stay as they were', async () => {
    const before = (await specialist.get(`/api/filings/${id}`)).body.filing;
    const res = await specialist
      .put(`/api/filings/${id}/steps/radios`)
      .set('If-Match', '"0123456789abcdef01234567"')
      .send({ antennas: [{ id: '', gainDbi: 'x' }], transmitters: [] });
    expect(res.status).toBe(409);
    const after = (await specialist.get(`/api/filings/${id}`)).body.filing;
    expect(after.data.radios).toEqual(before.data.radios);
    expect(after.drafts.radios).toBeUndefined();
  });

  it('saving exactly the stored data is never stale; W/ tags, lists and * are understood', async () => {
    const filing = (await specialist.get(`/api/filings/${id}`)).body.filing;
    const same = await specialist.put(`/api/filings/${id}/steps/radios`).set('If-Match', '"an-old-revision"').send(filing.data.radios);
    expect(same.status).toBe(200);
    const rev = filing.revisions.radios;
    for (const header of [`W/"${rev}"`, `"nope", "${rev}"`, '*']) {
      const res = await specialist
        .put(`/api/filings/${id}/steps/radios`)
        .set('If-Match', header)
        .send({ ...filing.data.radios, antennas: [{ ...filing.data.radios.antennas[0], location: header }] });
      expect(res.status, header).toBe(200);
      // Put it back so the next header matches again.
      await specialist.put(`/api/filings/${id}/steps/radios`).send(filing.data.radios);
    }
  });

  it('without If-Match a save is accepted as before (API scripts); the app always sends it', async () => {
    const res = await specialist.put(`/api/filings/${id}/steps/device`).send({ ...device, model: 'KW2-C' });
    expect(res.status).toBe(200);
    expect(res.body.filing.data.device.model).toBe('KW2-C');
  });
});
