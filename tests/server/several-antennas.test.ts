/**
 * Several antennas per transmitter through the API: the demo tracker's LTE band 2 switches
 * between ANT-DIV and ANT-MAIN; every antenna × use position is screened and the row names the
 * least favourable antenna; renaming an antenna keeps it in the transmitter's list; the device
 * file, the next version and the signed version's triggers carry the list.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_TRACKER } from '../../seeds/demo-filing';
import { markSigned } from './support/versions';
import { createTestApp, seedUsers, signIn, type TestApp } from './support/test-app';

let t: TestApp;
let specialist: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  specialist = await signIn(t, 'specialist@fieldfile.test');
});
afterAll(() => t.close());

type Row = { transmitterId: string; usePositionId: string; regime: string; antennaId: string; antennaCount: number; separationM: number; derivation: { notes: string[] } };

describe('a transmitter that switches between two antennas', () => {
  let id: number;
  beforeAll(async () => {
    id = (await specialist.post('/api/filings/import').send(DEMO_TRACKER)).body.filing.id;
  });

  it('is stored with both antennas and how it uses them', async () => {
    const tx = (await specialist.get(`/api/filings/${id}`)).body.filing.data.radios.transmitters.find((x: { id: string }) => x.id === 'LTE-B2');
    expect(tx).toMatchObject({ antennaId: 'ANT-DIV', moreAntennaIds: ['ANT-MAIN'], antennaUse: 'switched' });
  });

  it('screening evaluates both and names the least favourable: ANT-MAIN at 4 mm at the wrist strap (ANT-DIV is at 20 mm)', async () => {
    const rows = (await specialist.get(`/api/filings/${id}/screening`)).body.rows as Row[];
    const wrist = rows.find((r) => r.transmitterId === 'LTE-B2' && r.usePositionId === 'wrist-strap' && r.regime === 'fcc')!;
    expect(wrist).toMatchObject({ antennaId: 'ANT-MAIN', antennaCount: 2, separationM: 0.004 });
    expect(wrist.derivation.notes.join(' ')).toMatch(/switched: one at a time.*ANT-DIV at 20 mm.*ANT-MAIN at 4 mm/);
    const single = rows.find((r) => r.transmitterId === 'LTE-B12')!;
    expect(single).toMatchObject({ antennaId: 'ANT-MAIN', antennaCount: 1 });
  });

  it('renaming the further antenna keeps it in the list; dropping an antenna still named is answered at its field', async () => {
    const radios = (await specialist.get(`/api/filings/${id}`)).body.filing.data.radios;
    const renamed = {
      ...radios,
      antennas: radios.antennas.map((a: { id: string }) => (a.id === 'ANT-MAIN' ? { ...a, id: 'ANT-TOP' } : a)),
      transmitters: radios.transmitters.map((x: { antennaId: string; moreAntennaIds: string[] }) => ({
        ...x,
        antennaId: x.antennaId === 'ANT-MAIN' ? 'ANT-TOP' : x.antennaId,
        moreAntennaIds: x.moreAntennaIds.map((a) => (a === 'ANT-MAIN' ? 'ANT-TOP' : a)),
      })),
    };
    const res = await specialist.put(`/api/filings/${id}/steps/radios`).send(renamed);
    expect(res.status).toBe(200);
    expect(res.body.filing.data.radios.transmitters[2]).toMatchObject({ id: 'LTE-B2', moreAntennaIds: ['ANT-TOP'] });
    // The separations of the renamed antenna stayed (by row).
    expect(res.body.filing.data['use-positions'].usePositions[2].separations).toContainEqual({ antennaId: 'ANT-TOP', separationM: 0.004 });

    const bad = await specialist
      .put(`/api/filings/${id}/steps/radios`)
      .send({ ...renamed, transmitters: renamed.transmitters.map((x: object, i: number) => (i === 2 ? { ...x, moreAntennaIds: ['ANT-GONE'] } : x)) });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields['transmitters.2.moreAntennaIds.0']).toMatch(/no antenna "ANT-GONE"/);
    const twice = await specialist
      .put(`/api/filings/${id}/steps/radios`)
      .send({ ...renamed, transmitters: renamed.transmitters.map((x: object, i: number) => (i === 2 ? { ...x, moreAntennaIds: ['ANT-DIV'] } : x)) });
    expect(twice.body.error.fields['transmitters.2.moreAntennaIds.0']).toMatch(/already one of this transmitter’s antennas/);
  });

  it('a use position without a separation for a further antenna is named under Use positions', async () => {
    const filing = (await specialist.get(`/api/filings/${id}`)).body.filing;
    const positions = filing.data['use-positions'].usePositions.map((p: { id: string; separations: { antennaId: string }[] }) =>
      p.id === 'belt-clip' ? { ...p, separations: p.separations.filter((s) => s.antennaId !== 'ANT-TOP') } : p,
    );
    const res = await specialist.put(`/api/filings/${id}/steps/use-positions`).send({ usePositions: positions });
    const step = res.body.filing.steps.find((s: { step: string }) => s.step === 'use-positions');
    expect(step.problems.join(' ')).toMatch(/belt-clip.*ANT-TOP/);
    const gaps = (await specialist.get(`/api/filings/${id}/screening`)).body.gaps as { transmitterId: string; usePositionId: string; message: string }[];
    expect(
      gaps
        .filter((g) => g.usePositionId === 'belt-clip')
        .map((g) => g.transmitterId)
        .sort(),
    ).toEqual(['LTE-B11', 'LTE-B12', 'LTE-B2']);
  });
});

describe('the device file and versions carry several antennas', () => {
  it('the export names both antennas and imports again unchanged', async () => {
    const id = (await specialist.post('/api/filings/import').send(DEMO_TRACKER)).body.filing.id;
    const file = JSON.parse((await specialist.get(`/api/filings/${id}/device.json`)).text);
    expect(file.transmitters[2]).toMatchObject({ moreAntennaIds: ['ANT-MAIN'], antennaUse: 'switched' });
    const again = await specialist.post('/api/filings/import').send(file);
    expect(again.status).toBe(201);
    expect(JSON.parse((await specialist.get(`/api/filings/${again.body.filing.id}/device.json`)).text)).toEqual(file);
  });

  it('the next version copies them; the signed version refuses changes to them in SQLite', async () => {
    const id = (await specialist.post('/api/filings/import').send(DEMO_TRACKER)).body.filing.id;
    const v1 = (await specialist.get(`/api/filings/${id}`)).body.filing;
    markSigned(t.handle, v1.version.id);
    expect((await specialist.post(`/api/filings/${id}/versions`)).status).toBe(201);
    const v2 = (await specialist.get(`/api/filings/${id}`)).body.filing;
    expect(v2.data.radios.transmitters[2]).toMatchObject({ moreAntennaIds: ['ANT-MAIN'], antennaUse: 'switched' });
    const sqlite = t.handle.sqlite;
    const txRow = (sqlite.prepare("select id from transmitters where version_id = ? and key = 'LTE-B2'").get(v1.version.id) as { id: number }).id;
    expect(() => sqlite.prepare('delete from transmitter_antennas where transmitter_id = ?').run(txRow)).toThrow(/signed version is frozen/);
    expect(() => sqlite.prepare('update transmitter_antennas set sort_order = 5 where transmitter_id = ?').run(txRow)).toThrow(/signed version is frozen/);
    const antenna = (sqlite.prepare("select id from antennas where version_id = ? and key = 'ANT-WLAN'").get(v1.version.id) as { id: number }).id;
    expect(() => sqlite.prepare('insert into transmitter_antennas (transmitter_id, antenna_id, sort_order) values (?, ?, 1)').run(txRow, antenna)).toThrow(/signed version is frozen/);
  });
});
