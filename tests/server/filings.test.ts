/**
 * Filings through the API: create, autosave steps (valid → stored, invalid → kept as a draft,
 * stored data untouched), role checks, device file import/export, screening rows.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import { DEMO_TRACKER } from '../../seeds/demo-filing';
import { screenDevice } from '../../calc/screening';
import { zDeviceFile } from '../../constants/schemas/device-file';
import { createTestApp, seedUsers, signIn, type TestApp } from './support/test-app';

let t: TestApp;
let specialist: Awaited<ReturnType<typeof signIn>>;
let engineer: Awaited<ReturnType<typeof signIn>>;
let approver: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  [specialist, engineer, approver] = await Promise.all([signIn(t, 'specialist@fieldfile.test'), signIn(t, 'engineer@fieldfile.test'), signIn(t, 'approver@fieldfile.test')]);
});
afterAll(() => t.close());

const device = { name: 'Kittiwake K2 sensor', model: 'KW2-A', applicant: 'Halden Ridge Instruments', productType: 'iot-module' };

describe('the demo seed', () => {
  it('gives the organisation a partly finished tracker filing and a just-started one', async () => {
    const res = await specialist.get('/api/filings');
    expect(res.status).toBe(200);
    const names = res.body.filings.map((f: { device: { name: string } }) => f.device.name);
    expect(names).toContain('Trailhound TH-4 rugged tracker');
    const tracker = res.body.filings.find((f: { device: { name: string } }) => f.device.name.startsWith('Trailhound TH-4'));
    expect(tracker.markets).toEqual(['fcc', 'eu']);
    const detail = (await specialist.get(`/api/filings/${tracker.id}`)).body.filing;
    const positions = detail.steps.find((s: { step: string }) => s.step === 'use-positions');
    expect(positions.complete).toBe(false);
    expect(positions.problems.join(' ')).toMatch(/wrist-strap.*ANT-WLAN/);
  });
});

describe('creating and editing a filing', () => {
  let id: number;

  it('a specialist creates a filing from the device identity', async () => {
    const res = await specialist.post('/api/filings').send({ device });
    expect(res.status).toBe(201);
    id = res.body.filing.id;
    expect(res.body.filing.version).toMatchObject({ number: 1, state: 'draft' });
    expect(res.body.filing.steps.map((s: { step: string; complete: boolean }) => [s.step, s.complete])).toEqual([
      ['device', true],
      ['radios', false],
      ['use-positions', false],
      ['markets', false],
      ['screening', false],
      ['measurements', false],
      ['co-transmission', false],
      ['evidence', false],
    ]);
  });

  it('engineers and approvers read filings but cannot change device data (403)', async () => {
    expect((await engineer.get(`/api/filings/${id}`)).status).toBe(200);
    expect((await approver.get(`/api/filings/${id}`)).body.filing.editable).toBe(false);
    for (const agent of [engineer, approver]) {
      expect((await agent.post('/api/filings').send({ device })).status).toBe(403);
      const res = await agent.put(`/api/filings/${id}/steps/device`).send({ ...device, name: 'Changed' });
      expect(res.status).toBe(403);
      expect(res.body.error.message).toMatch(/specialist/);
      expect((await agent.post('/api/filings/import').send(DEMO_TRACKER)).status).toBe(403);
    }
    expect((await specialist.get(`/api/filings/${id}`)).body.filing.device.name).toBe(device.name);
  });

  it('saves a valid step and answers an invalid one field by field, keeping it as a draft', async () => {
    const radios = {
      antennas: [{ id: 'A1', gainDbi: 0, location: 'top' }],
      transmitters: [{ id: 'LTE-B13', technology: 'LTE', band: 'Band 13', frequencyMinHz: 777e6, frequencyMaxHz: 787e6, maxTuneUpPowerDbm: 23, dutyCycle: 1, antennaId: 'A1' }],
    };
    const ok = await specialist.put(`/api/filings/${id}/steps/radios`).send(radios);
    expect(ok.status).toBe(200);
    expect(ok.body.filing.data.radios.transmitters[0].id).toBe('LTE-B13');

    const bad = {
      antennas: radios.antennas,
      transmitters: [{ ...radios.transmitters[0], frequencyMinHz: 900e6, frequencyMaxHz: 800e6, antennaId: 'NOPE', maxTuneUpPowerDbm: 'loud' }],
    };
    const res = await specialist.put(`/api/filings/${id}/steps/radios`).send(bad);
    expect(res.status).toBe(422);
    expect(res.body.error.fields['transmitters.0.maxTuneUpPowerDbm']).toMatch(/number/);
    expect(res.body.draftSavedAt).toBeTruthy();

    const detail = (await specialist.get(`/api/filings/${id}`)).body.filing;
    expect(detail.data.radios).toMatchObject(radios); // the stored data is untouched
    expect(detail.drafts.radios.data).toEqual(bad); // what was typed survives a reload
    expect(detail.steps.find((s: { step: string }) => s.step === 'radios').hasDraft).toBe(true);

    await specialist.put(`/api/filings/${id}/steps/radios`).send(radios);
    expect((await specialist.get(`/api/filings/${id}`)).body.filing.drafts.radios).toBeUndefined();
  });

  it('refuses a reversed band, a negative separation and an unknown antenna in a position', async () => {
    const reversed = await specialist.put(`/api/filings/${id}/steps/radios`).send({
      antennas: [{ id: 'A1', gainDbi: 0, location: '' }],
      transmitters: [{ id: 'T', technology: 'LTE', band: 'x', frequencyMinHz: 2e9, frequencyMaxHz: 1e9, maxTuneUpPowerDbm: 20, dutyCycle: 1, antennaId: 'A1' }],
    });
    expect(reversed.body.error.fields['transmitters.0.frequencyMaxHz']).toMatch(/not be below/);
    const positions = await specialist.put(`/api/filings/${id}/steps/use-positions`).send({
      usePositions: [
        {
          id: 'head',
          kind: 'head',
          separations: [
            { antennaId: 'A1', separationM: -0.001 },
            { antennaId: 'ZZ', separationM: 0.01 },
          ],
        },
      ],
    });
    expect(positions.status).toBe(422);
    expect(positions.body.error.fields['usePositions.0.separations.0.separationM']).toMatch(/negative/);
    expect((await specialist.get(`/api/filings/${id}`)).body.filing.steps.find((s: { step: string }) => s.step === 'radios').problems).toContain('Some changes have errors and are not saved yet.');
    // Fixing the input clears the draft.
    await specialist.put(`/api/filings/${id}/steps/radios`).send({
      antennas: [{ id: 'A1', gainDbi: 0, location: 'top' }],
      transmitters: [{ id: 'LTE-B13', technology: 'LTE', band: 'Band 13', frequencyMinHz: 777e6, frequencyMaxHz: 787e6, maxTuneUpPowerDbm: 23, dutyCycle: 1, antennaId: 'A1' }],
    });
  });

  it('completes use positions and markets, then screens every combination', async () => {
    const pos = await specialist.put(`/api/filings/${id}/steps/use-positions`).send({
      usePositions: [
        { id: 'head', kind: 'head', separations: [{ antennaId: 'A1', separationM: 0.005 }] },
        { id: 'desk', kind: 'far-field', separations: [{ antennaId: 'A1', separationM: 0.2 }] },
      ],
    });
    expect(pos.status).toBe(200);
    const markets = await specialist.put(`/api/filings/${id}/steps/markets`).send({
      markets: [
        { regime: 'fcc', tier: 'general' },
        { regime: 'ised', tier: 'general' },
      ],
    });
    expect(markets.status).toBe(200);
    // Every device-data step and screening are complete; the lab steps wait for measurements, Evidence for its files.
    expect(markets.body.filing.steps.filter((s: { step: string }) => !['measurements', 'co-transmission', 'evidence'].includes(s.step)).every((s: { complete: boolean }) => s.complete)).toBe(true);
    // Canada: a warning in the filing's checks (it does not block), naming the superseded RSS-102 issue.
    const marketsStep = markets.body.filing.steps.find((s: { step: string }) => s.step === 'markets');
    expect(marketsStep.warnings.join(' ')).toMatch(/RSS-102 Issue 5.*Issue 6/);
    expect(markets.body.filing.steps.find((s: { step: string }) => s.step === 'radios').warnings).toEqual([]);

    const screening = await specialist.get(`/api/filings/${id}/screening`);
    expect(screening.status).toBe(200);
    expect(screening.body.rows).toHaveLength(1 * 2 * 2);
    expect(screening.body.ruleSetVersion).toMatch(/rss102-issue5/);
    expect(screening.body.warnings.map((w: { code: string }) => w.code)).toEqual(['ised-rss102-issue5']);
    expect(screening.body.engineVersion).toBeTruthy();
    expect(screening.body.ruleSetVersion).toBeTruthy();
    expect(screening.body.cautions.join(' ')).toMatch(/certifying body decides/);
    const fccHead = screening.body.rows.find((r: { regime: string; usePositionId: string }) => r.regime === 'fcc' && r.usePositionId === 'head');
    // 23 dBm = 199.5 mW far above the §1.1307(b)(3)(i)(B) threshold at 0.5 cm → SAR evaluation.
    expect(fccHead.result).toBe('evaluate-sar');
    expect(fccHead.marginDb).toBeLessThan(0);
    expect(fccHead.derivation.source).toBeTruthy();
    expect(screening.body.summary.byRegime.fcc.combinations).toBe(2);
  });

  it('refuses to save a step of a filing in another state or that does not exist', async () => {
    expect((await specialist.put('/api/filings/99999/steps/device').send(device)).status).toBe(404);
    expect((await specialist.put(`/api/filings/${id}/steps/nonsense`).send({})).status).toBe(422);
  });
});

describe('device description file', () => {
  it('publishes its JSON Schema', async () => {
    const res = await request(t.app).get('/api/schema/device.json');
    expect(res.status).toBe(200);
    expect(res.body.properties.format.const).toBe('fieldfile.device/1');
    expect(res.body.properties.usePositions.items.properties.kind.enum).toContain('far-field');
  });

  it('imports a file and exports the same content back', async () => {
    const res = await specialist.post('/api/filings/import').send(DEMO_TRACKER);
    expect(res.status).toBe(201);
    const exported = await specialist.get(`/api/filings/${res.body.filing.id}/device.json`);
    expect(exported.status).toBe(200);
    expect(exported.headers['content-disposition']).toMatch(/trailhound-th-4-rugged-tracker-th4-lw2\.device\.json/);
    expect(JSON.parse(exported.text)).toEqual(zDeviceFile.parse(DEMO_TRACKER));
  });

  it('refuses an inconsistent file with every problem at its JSON path, and creates nothing', async () => {
    const before = (await specialist.get('/api/filings')).body.filings.length;
    const bad = structuredClone(DEMO_TRACKER) as typeof DEMO_TRACKER & Record<string, unknown>;
    bad.transmitters![0].antennaId = 'ANT-NOWHERE';
    bad.transmitters![1].frequencyMinHz = 3e9;
    bad.usePositions![0].separations[0].separationM = -0.01;
    bad.antennas!.push({ id: 'ANT-MAIN', gainDbi: 0, location: '' });
    const res = await specialist.post('/api/filings/import').send(bad);
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/nothing was created/);
    expect(res.body.error.fields).toMatchObject({
      'transmitters.0.antennaId': expect.stringMatching(/Unknown antenna id "ANT-NOWHERE"/),
      'transmitters.1.frequencyMaxHz': expect.stringMatching(/not be below/),
      'usePositions.0.separations.0.separationM': expect.stringMatching(/negative/),
      'antennas.3.id': expect.stringMatching(/Duplicate id "ANT-MAIN"/),
    });
    expect((await specialist.get('/api/filings')).body.filings.length).toBe(before);
  });

  it('lists reference problems together with shape problems in one answer', async () => {
    const bad = structuredClone(DEMO_TRACKER) as typeof DEMO_TRACKER & Record<string, unknown>;
    bad.device = { ...bad.device!, name: '' };
    bad.transmitters![0].antennaId = 'ANT-NOWHERE';
    bad.simultaneous = [['LTE-B2', 'TX-GHOST']];
    const res = await specialist.post('/api/filings/import').send(bad);
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toMatchObject({
      'device.name': expect.stringMatching(/device name/),
      'transmitters.0.antennaId': expect.stringMatching(/Unknown antenna id "ANT-NOWHERE"/),
      'simultaneous.0.1': expect.stringMatching(/Unknown transmitter id "TX-GHOST"/),
    });
  });

  it('refuses a file of another format', async () => {
    const res = await specialist.post('/api/filings/import').send({ ...DEMO_TRACKER, format: 'something/2' });
    expect(res.status).toBe(422);
    expect(res.body.error.fields.format).toMatch(/fieldfile\.device\/1/);
  });
});

describe('screening of the demo tracker', () => {
  it('returns exactly the engine’s rows for the device file, with gaps for missing separations', async () => {
    const filing = (await specialist.post('/api/filings/import').send(DEMO_TRACKER)).body.filing;
    const res = await specialist.get(`/api/filings/${filing.id}/screening`);
    const engine = screenDevice(DEMO_TRACKER as never);
    expect(
      res.body.rows.map((r: { transmitterId: string; usePositionId: string; regime: string; result: string; marginDb: number }) => [r.transmitterId, r.usePositionId, r.regime, r.result, r.marginDb]),
    ).toEqual(engine.rows.map((r) => [r.transmitterId, r.usePositionId, r.regime, r.result, r.marginDb]));
    expect(res.body.gaps.map((g: { transmitterId: string; usePositionId: string }) => `${g.transmitterId}@${g.usePositionId}`).sort()).toEqual([
      'BT-LE@wrist-strap',
      'WLAN-2G4@wrist-strap',
      'WLAN-5G@wrist-strap',
    ]);
    expect(res.body.complete).toBe(false);
    // Compressed for clients that accept gzip (supertest does), the same JSON for those that do not.
    expect(res.headers['content-encoding']).toBe('gzip');
    const plain = await specialist.get(`/api/filings/${filing.id}/screening`).set('Accept-Encoding', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.body).toEqual(res.body);
  });

  it('draws SAR against depth for a transmitter at a use position', async () => {
    const list = (await specialist.get('/api/filings?q=TH4-LW2')).body.filings;
    const res = await specialist.get(`/api/filings/${list[0].id}/screening/depth-profile?transmitterId=WLAN-2G4&usePositionId=belt-clip`);
    expect(res.status).toBe(200);
    expect(res.body.cautions.join(' ')).toMatch(/never replaces a SAR measurement/);
    // The chart uses the table's figures: the row's EIRP at the row's most restrictive frequency.
    const table = (await specialist.get(`/api/filings/${list[0].id}/screening`)).body;
    const row = table.rows.find((r: { transmitterId: string; usePositionId: string }) => r.transmitterId === 'WLAN-2G4' && r.usePositionId === 'belt-clip');
    expect(res.body.basis).toMatchObject({ regime: row.regime, frequencyHz: row.frequencyHz, eirpW: row.powers.eirpMw / 1000, separationM: row.separationM });
    expect(res.body.derivation.inputs.frequencyHz.value).toBe(row.frequencyHz);
    // A belt clip faces the trunk (skin/fat/muscle), not a head stack; closer than λ/2π only the shape is given (no W/kg).
    expect(res.body.stack.map((l: { name: string }) => l.name)).toEqual(['skin', 'fat', 'muscle']);
    expect(res.body.scale).toBe(row.separationM > res.body.reactiveNearFieldBoundaryM ? 'absolute' : 'relative');
    if (res.body.scale === 'relative') expect(res.body.absolute).toBeNull();
    const ised = await specialist.get(`/api/filings/${list[0].id}/screening/depth-profile?transmitterId=WLAN-2G4&usePositionId=belt-clip&regime=ised`);
    const isedRow = table.rows.find((r: { transmitterId: string; usePositionId: string; regime: string }) => r.transmitterId === 'WLAN-2G4' && r.usePositionId === 'belt-clip' && r.regime === 'ised');
    if (isedRow) expect(ised.body.basis.frequencyHz).toBe(isedRow.frequencyHz);
    else expect(ised.status).toBe(422);
    const missing = await specialist.get(`/api/filings/${list[0].id}/screening/depth-profile?transmitterId=BT-LE&usePositionId=wrist-strap`);
    expect(missing.status).toBe(422);
  });
});

describe('the filings list', () => {
  it('searches and sorts', async () => {
    const all = (await specialist.get('/api/filings?sort=name')).body.filings;
    const names = all.map((f: { device: { name: string } }) => f.device.name);
    expect(names).toEqual([...names].sort((a, b) => (a.toLowerCase() < b.toLowerCase() ? -1 : 1)));
    const found = (await specialist.get('/api/filings?q=kittiwake')).body.filings;
    expect(found).toHaveLength(1);
    expect((await specialist.get('/api/filings?q=%25')).body.filings).toHaveLength(0);
    expect((await specialist.get('/api/filings?sort=bogus')).status).toBe(422);
  });
});

describe('renames carry through; removals take their dependents', () => {
  type Row = { id: string; rowId: number; antennaId?: string; moreAntennaIds?: string[]; separations?: { antennaId: string; separationM: number }[] };
  let id: number;
  let filing: { data: { radios: { antennas: Row[]; transmitters: Row[] }; 'use-positions': { usePositions: Row[] } }; simultaneous: string[][] };
  const reload = async () => {
    filing = (await specialist.get(`/api/filings/${id}`)).body.filing;
    return filing;
  };

  beforeAll(async () => {
    id = (await specialist.post('/api/filings/import').send(DEMO_TRACKER)).body.filing.id;
    await reload();
  });

  it('renaming an antenna keeps its separations in every use position and its transmitters', async () => {
    const radios = structuredClone(filing.data.radios);
    const main = radios.antennas.find((a) => a.id === 'ANT-MAIN')!;
    main.id = 'ANT-TOP';
    for (const t of radios.transmitters) {
      if (t.antennaId === 'ANT-MAIN') t.antennaId = 'ANT-TOP';
      t.moreAntennaIds = t.moreAntennaIds!.map((x) => (x === 'ANT-MAIN' ? 'ANT-TOP' : x));
    }
    const res = await specialist.put(`/api/filings/${id}/steps/radios`).send(radios);
    expect(res.status).toBe(200);
    await reload();
    expect(filing.data.radios.antennas.find((a) => a.id === 'ANT-TOP')!.rowId).toBe(main.rowId);
    const seps = filing.data['use-positions'].usePositions.map((p) => [p.id, p.separations!.find((s) => s.antennaId === 'ANT-TOP')?.separationM]);
    // The demo's ANT-MAIN separations: belt-clip 10 mm, in-hand 0, wrist-strap 4 mm, vehicle-dock 200 mm.
    expect(seps).toEqual([
      ['belt-clip', 0.01],
      ['in-hand', 0],
      ['wrist-strap', 0.004],
      ['vehicle-dock', 0.2],
    ]);
    expect(filing.data.radios.transmitters.filter((t) => t.antennaId === 'ANT-TOP').map((t) => t.id)).toEqual(['LTE-B12', 'LTE-B11']);
    // LTE-B2 switches to it as its further antenna, by row.
    expect(filing.data.radios.transmitters.find((t) => t.id === 'LTE-B2')!.moreAntennaIds).toEqual(['ANT-TOP']);
  });

  it('two antennas can swap labels in one save', async () => {
    const radios = structuredClone(filing.data.radios);
    const [a, b] = radios.antennas;
    const swap = (x: string) => (x === b.id ? a.id : x === a.id ? b.id : x);
    [a.id, b.id] = [b.id, a.id];
    for (const t of radios.transmitters) {
      t.antennaId = swap(t.antennaId!);
      t.moreAntennaIds = t.moreAntennaIds!.map(swap);
    }
    expect((await specialist.put(`/api/filings/${id}/steps/radios`).send(radios)).status).toBe(200);
    await reload();
    expect(filing.data.radios.antennas.slice(0, 2).map((x) => [x.id, x.rowId])).toEqual([
      [a.id, a.rowId],
      [b.id, b.rowId],
    ]);
    // Swap back for the next cases.
    [a.id, b.id] = [b.id, a.id];
    for (const t of radios.transmitters) {
      t.antennaId = swap(t.antennaId!);
      t.moreAntennaIds = t.moreAntennaIds!.map(swap);
    }
    expect((await specialist.put(`/api/filings/${id}/steps/radios`).send(radios)).status).toBe(200);
    await reload();
  });

  it('renaming a transmitter renames it in the co-transmission combinations, and the export re-imports', async () => {
    const radios = structuredClone(filing.data.radios);
    radios.transmitters.find((t) => t.id === 'WLAN-2G4')!.id = 'WIFI-2G4';
    expect((await specialist.put(`/api/filings/${id}/steps/radios`).send(radios)).status).toBe(200);
    await reload();
    expect(filing.simultaneous).toEqual([
      ['LTE-B2', 'WIFI-2G4'],
      ['LTE-B12', 'WLAN-5G', 'BT-LE'],
    ]);
    const exported = JSON.parse((await specialist.get(`/api/filings/${id}/device.json`)).text);
    expect(JSON.stringify(exported)).not.toMatch(/rowId/);
    expect(exported.simultaneous[0]).toEqual(['LTE-B2', 'WIFI-2G4']);
    expect(exported.antennas[0].id).toBe('ANT-TOP');
    const again = await specialist.post('/api/filings/import').send(exported);
    expect(again.status).toBe(201);
    expect(JSON.parse((await specialist.get(`/api/filings/${again.body.filing.id}/device.json`)).text)).toEqual(exported);
  });

  it('renaming a use position keeps its row and separations', async () => {
    const step = structuredClone(filing.data['use-positions']);
    const belt = step.usePositions[0];
    belt.id = 'belt-holster';
    expect((await specialist.put(`/api/filings/${id}/steps/use-positions`).send(step)).status).toBe(200);
    await reload();
    expect(filing.data['use-positions'].usePositions[0]).toMatchObject({ id: 'belt-holster', rowId: belt.rowId, separations: belt.separations });
  });

  it('removing a transmitter drops it from combinations, and a combination left with one member goes', async () => {
    const radios = structuredClone(filing.data.radios);
    radios.transmitters = radios.transmitters.filter((t) => t.id !== 'LTE-B2');
    expect((await specialist.put(`/api/filings/${id}/steps/radios`).send(radios)).status).toBe(200);
    await reload();
    expect(filing.simultaneous).toEqual([['LTE-B12', 'WLAN-5G', 'BT-LE']]);
  });

  it('removing an antenna takes its separations; one still used by a transmitter is refused', async () => {
    const radios = structuredClone(filing.data.radios);
    const refused = await specialist.put(`/api/filings/${id}/steps/radios`).send({ ...radios, antennas: radios.antennas.filter((a) => a.id !== 'ANT-WLAN') });
    expect(refused.status).toBe(422);
    expect(Object.values(refused.body.error.fields).join(' ')).toMatch(/no antenna "ANT-WLAN"/);
    await specialist.put(`/api/filings/${id}/steps/radios`).send(radios); // clears the draft
    const unused = radios.antennas.find((a) => a.id === 'ANT-DIV')!; // LTE-B2 was its only transmitter
    const ok = await specialist.put(`/api/filings/${id}/steps/radios`).send({ ...radios, antennas: radios.antennas.filter((a) => a !== unused) });
    expect(ok.status).toBe(200);
    await reload();
    expect(filing.data['use-positions'].usePositions.flatMap((p) => p.separations!.map((s) => s.antennaId))).not.toContain('ANT-DIV');
    // Adding an antenna of the same label later starts empty: a new row.
    const re = await specialist.put(`/api/filings/${id}/steps/radios`).send({ ...filing.data.radios, antennas: [...filing.data.radios.antennas, { id: 'ANT-DIV', gainDbi: 0, location: '' }] });
    expect(re.status).toBe(200);
    expect((await reload()).data['use-positions'].usePositions.flatMap((p) => p.separations!.map((s) => s.antennaId))).not.toContain('ANT-DIV');
  });

  it('a rowId from another filing is not taken: the row is matched by label or added', async () => {
    const other = (await specialist.get(`/api/filings/${id}`)).body.filing.data.radios;
    const fresh = (await specialist.post('/api/filings').send({ device })).body.filing.id;
    const res = await specialist.put(`/api/filings/${fresh}/steps/radios`).send(other);
    expect(res.status).toBe(200);
    const mine = res.body.filing.data.radios.antennas.map((a: Row) => a.rowId);
    expect(mine.some((r: number) => other.antennas.some((a: Row) => a.rowId === r))).toBe(false);
    expect((await reload()).data.radios.antennas.map((a) => a.id)).toEqual(other.antennas.map((a: Row) => a.id));
  });
});

describe('device files written before this version', () => {
  it('the demo export saved before the device record grew imports unchanged', async () => {
    const file = JSON.parse(fs.readFileSync(path.join(__dirname, '../fixtures/demo-tracker-before-device-fields.device.json'), 'utf8'));
    const res = await specialist.post('/api/filings/import').send(file);
    expect(res.status).toBe(201);
    const exported = JSON.parse((await specialist.get(`/api/filings/${res.body.filing.id}/device.json`)).text);
    expect(exported).toMatchObject(file);
  });
});
