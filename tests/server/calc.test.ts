/**
 * The calculation registry over HTTP answers exactly as the CLI does. Reference value: 47 CFR
 * §1.1307(b)(3)(i)(B) at 2.48 GHz and 0.5 cm gives P_th ≈ 2.72 mW (the value printed in an FCC filing exhibit).
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCalculation } from '../../calc/registry';
import { createTestApp, seedUsers, signIn, type TestApp } from './support/test-app';

let t: TestApp;
let engineer: Awaited<ReturnType<typeof signIn>>;
beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  engineer = await signIn(t, 'engineer@fieldfile.test');
});
afterAll(() => t.close());

describe('/api/calc', () => {
  it('needs a session', async () => {
    expect((await request(t.app).get('/api/calc')).status).toBe(401);
    expect((await request(t.app).post('/api/calc/units').send({})).status).toBe(401);
  });

  it('lists every calculation with its input JSON Schema', async () => {
    const res = await engineer.get('/api/calc');
    const names = res.body.calculations.map((c: { name: string }) => c.name);
    for (const name of [
      'medium',
      'tissue-properties',
      'plane-wave-layers',
      'exposure-limit',
      'sar-limit',
      'fcc-sar-exemption',
      'kdb-sar-test-exclusion',
      'reported-sar',
      'simultaneous-transmission',
      'uncertainty-budget',
      'screening',
    ]) {
      expect(names).toContain(name);
    }
    expect(res.body.calculations.every((c: { inputSchema: object; sources: string[] }) => c.inputSchema && c.sources.length > 0)).toBe(true);
  });

  it('computes as the CLI does', async () => {
    const input = { frequencyHz: 2.48e9, separationM: 0.005 };
    const res = await engineer.post('/api/calc/fcc-sar-exemption').send(input);
    expect(res.status).toBe(200);
    expect(res.body.thresholdMw).toBeCloseTo(2.72, 2);
    expect(res.body.derivation.source).toMatch(/1\.1307\(b\)\(3\)\(i\)\(B\)/);
    const direct = runCalculation('fcc-sar-exemption', input);
    expect(direct.ok && res.body).toEqual(direct.ok && JSON.parse(JSON.stringify(direct.result)));
  });

  it('answers 422 with the issues for invalid input and outside the validity range', async () => {
    const bad = await engineer.post('/api/calc/fcc-sar-exemption').send({ frequencyHz: 'fast' });
    expect(bad.status).toBe(422);
    expect(bad.body.error.issues.length).toBeGreaterThan(0);
    const range = await engineer.post('/api/calc/fcc-sar-exemption').send({ frequencyHz: 10e9, separationM: 0.01 });
    expect(range.status).toBe(422);
    expect(range.body.error.message).toMatch(/6 GHz/);
  });

  it('answers 404 for an unknown calculation', async () => {
    const res = await engineer.post('/api/calc/teleport').send({});
    expect(res.status).toBe(404);
    expect(res.body.error.message).toMatch(/GET \/api\/calc lists them/);
  });
});
