/**
 * The demo a first start seeds (with its byte storage, as server/start.ts does): the tracker is
 * filing 1 (the browser tests open it by number), and every review state shows — a badge in
 * review with a comment thread, a gateway whose version 1 is signed (and verifies) with a
 * version 2 in draft whose change the comparison shows. Seeding again adds nothing.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../seeds';
import { createStorages } from '../../server/storage';
import { createTestApp, signIn, TEST_PASSWORD, type TestApp } from './support/test-app';

type Agent = Awaited<ReturnType<typeof signIn>>;
let t: TestApp;
let approver: Agent;
let byName: Record<string, { id: number; version: { number: number; state: string } }>;

beforeAll(async () => {
  t = await createTestApp();
  const seeded = await seedDemo(t.handle.db, TEST_PASSWORD, createStorages(t.config).uploads);
  expect(seeded.createdFilings).toBe(4);
  approver = await signIn(t, 'approver@fieldfile.test');
  const list = (await approver.get('/api/filings?sort=name')).body.filings as { id: number; device: { name: string }; version: { number: number; state: string } }[];
  byName = Object.fromEntries(list.map((f) => [f.device.name, f]));
}, 60_000);
afterAll(() => t.close());

describe('the demo seed', () => {
  it('keeps the tracker as filing 1, in draft, and adds the review demo after the dock', () => {
    expect(byName['Trailhound TH-4 rugged tracker']).toMatchObject({ id: 1, version: { number: 1, state: 'draft' } });
    expect(Object.keys(byName)).toHaveLength(4);
    expect(byName['Wren W1 crew badge'].id).toBeGreaterThan(2);
    expect(byName['Kestrel K1 site gateway'].id).toBeGreaterThan(2);
  });

  it('has a badge in review with a comment thread the specialist answered', async () => {
    const badge = byName['Wren W1 crew badge'];
    expect(badge.version).toMatchObject({ number: 1, state: 'in-review' });
    const review = (await approver.get(`/api/filings/${badge.id}/review`)).body.review;
    expect(review.threads).toHaveLength(1);
    expect(review.threads[0]).toMatchObject({ step: 'use-positions', rowRef: 'lanyard', state: 'open' });
    expect(review.threads[0].comments.map((c: { author: { name: string } }) => c.author.name)).toEqual(['Jonas Weber', 'Tomas Lindqvist']);
    // The approver can act on it at once: sign or return.
    expect(review.can.sign.allowed).toBe(true);
    expect(review.can.return.allowed).toBe(true);
    const readiness = (await approver.get(`/api/filings/${badge.id}/readiness`)).body;
    expect(readiness.items.filter((i: { status: string; severity: string }) => i.status === 'fail' && i.severity === 'blocks-signing')).toEqual([]);
    expect(readiness.ready).toBe(true);
  });

  it('has a gateway signed as version 1 (its hash verifies) with version 2 in draft', async () => {
    const gateway = byName['Kestrel K1 site gateway'];
    expect(gateway.version).toMatchObject({ number: 2, state: 'draft' });
    const review = (await approver.get(`/api/filings/${gateway.id}/review`)).body.review;
    expect(review.versions.map((v: { number: number; state: string }) => [v.number, v.state])).toEqual([
      [1, 'signed'],
      [2, 'draft'],
    ]);
    expect(review.versions[0].signature.signer).toMatchObject({ name: 'Jonas Weber', role: 'approver' });
    const verify = await approver.post(`/api/filings/${gateway.id}/versions/1/verify`);
    expect(verify.body.verification.matches).toBe(true);
    // The evidence it was signed with is carried into version 2 by reference.
    const evidence = (await approver.get(`/api/filings/${gateway.id}/evidence`)).body;
    expect(JSON.stringify(evidence)).toContain('user-manual-bilingual');
  });

  it('the gateway’s comparison shows the one change (the Wi-Fi tune-up power) and the results it moved', async () => {
    const gateway = byName['Kestrel K1 site gateway'];
    const c = (await approver.get(`/api/filings/${gateway.id}/compare?from=1&to=2`)).body.comparison;
    expect(c.fields).toEqual([{ step: 'radios', label: 'Transmitter WLAN-2G4 · maximum tune-up power', before: '17 dBm', after: '20 dBm' }]);
    expect(c.impact.screening.length).toBeGreaterThan(0);
    for (const m of c.impact.screening) expect(m.transmitterId).toBe('WLAN-2G4');
  });

  it('seeding again adds no filing', async () => {
    const again = await seedDemo(t.handle.db, TEST_PASSWORD, createStorages(t.config).uploads);
    expect(again.createdFilings).toBe(0);
    expect((await approver.get('/api/filings')).body.filings).toHaveLength(4);
  });
});
