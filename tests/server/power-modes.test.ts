/**
 * Power-reduction modes through the API: the demo tracker's LTE band 12 backs off to 20 dBm on
 * the belt clip (proximity sensor); the use-positions step saves and reads reduced powers by row,
 * so renaming the transmitter or the position keeps them; bad reductions are answered at their
 * field with nothing written; the device file carries them, and a file written before power modes
 * existed (the demo export at commit c3b7b48) imports and exports unchanged; the next version
 * copies them and a signed version's rows refuse changes in SQLite.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
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

type Row = { transmitterId: string; usePositionId: string; regime: string; powerMode: string; powers: { tuneUpPowerMw: number }; derivation: { inputs: Record<string, { value: unknown }> } };
type Position = { id: string; rowId: number; kind: string; separations: unknown[]; powerModes?: { transmitterId: string; reducedTuneUpPowerDbm: number; trigger: string }[] };

const importDemo = async () => (await specialist.post('/api/filings/import').send(DEMO_TRACKER)).body.filing.id as number;
const positionsOf = async (id: number) => (await specialist.get(`/api/filings/${id}`)).body.filing.data['use-positions'].usePositions as Position[];

describe('the demo tracker’s proximity-sensor reduction', () => {
  it('is stored on the belt clip and screened there at 20 dBm; elsewhere band 12 runs at its 24 dBm maximum', async () => {
    const id = await importDemo();
    const belt = (await positionsOf(id)).find((p) => p.id === 'belt-clip')!;
    expect(belt.powerModes).toEqual([{ transmitterId: 'LTE-B12', reducedTuneUpPowerDbm: 20, trigger: 'proximity-sensor' }]);
    const rows = (await specialist.get(`/api/filings/${id}/screening`)).body.rows as Row[];
    const b12 = rows.filter((r) => r.transmitterId === 'LTE-B12' && r.regime === 'fcc');
    const onBelt = b12.find((r) => r.usePositionId === 'belt-clip')!;
    expect(onBelt.powerMode).toBe('proximity-sensor');
    // 20 dBm = 100 mW, 24 dBm = 251.2 mW (P = 10^(P_dBm/10) mW).
    expect(onBelt.powers.tuneUpPowerMw).toBeCloseTo(100, 6);
    expect(onBelt.derivation.inputs.reducedTuneUpPowerDbm.value).toBe(20);
    const inHand = b12.find((r) => r.usePositionId === 'in-hand')!;
    expect(inHand.powerMode).toBe('full');
    expect(inHand.powers.tuneUpPowerMw).toBeCloseTo(251.19, 2);
    expect(rows.filter((r) => r.powerMode !== 'full').map((r) => `${r.transmitterId}@${r.usePositionId}`)).toEqual(['LTE-B12@belt-clip', 'LTE-B12@belt-clip']);
  });
});

describe('saving reduced powers in the use-positions step', () => {
  let id: number;
  beforeAll(async () => {
    id = await importDemo();
  });

  it('saves and reads a hotspot back-off beside the proximity-sensor reduction', async () => {
    const positions = (await positionsOf(id)).map((p) => (p.id === 'in-hand' ? { ...p, powerModes: [{ transmitterId: 'LTE-B2', reducedTuneUpPowerDbm: 19.5, trigger: 'hotspot-back-off' }] } : p));
    const res = await specialist.put(`/api/filings/${id}/steps/use-positions`).send({ usePositions: positions });
    expect(res.status).toBe(200);
    const inHand = (res.body.filing.data['use-positions'].usePositions as Position[]).find((p) => p.id === 'in-hand')!;
    expect(inHand.powerModes).toEqual([{ transmitterId: 'LTE-B2', reducedTuneUpPowerDbm: 19.5, trigger: 'hotspot-back-off' }]);
    // An empty list is the same as none: it saves, and the position reads back without the field.
    const cleared = (await positionsOf(id)).map((p) => (p.id === 'in-hand' ? { ...p, powerModes: [] } : p));
    const again = await specialist.put(`/api/filings/${id}/steps/use-positions`).send({ usePositions: cleared });
    expect(again.status).toBe(200);
    expect((again.body.filing.data['use-positions'].usePositions as Position[]).find((p) => p.id === 'in-hand')).not.toHaveProperty('powerModes');
  });

  it('renaming the transmitter (Radios) and the position keeps the reduction, by row', async () => {
    const radios = (await specialist.get(`/api/filings/${id}`)).body.filing.data.radios;
    const renamed = { ...radios, transmitters: radios.transmitters.map((x: { id: string }) => (x.id === 'LTE-B12' ? { ...x, id: 'LTE-B12-LOW' } : x)) };
    expect((await specialist.put(`/api/filings/${id}/steps/radios`).send(renamed)).status).toBe(200);
    let belt = (await positionsOf(id)).find((p) => p.rowId && p.id === 'belt-clip')!;
    expect(belt.powerModes).toEqual([{ transmitterId: 'LTE-B12-LOW', reducedTuneUpPowerDbm: 20, trigger: 'proximity-sensor' }]);

    const positions = (await positionsOf(id)).map((p) => (p.id === 'belt-clip' ? { ...p, id: 'belt-holster' } : p));
    expect((await specialist.put(`/api/filings/${id}/steps/use-positions`).send({ usePositions: positions })).status).toBe(200);
    belt = (await positionsOf(id)).find((p) => p.id === 'belt-holster')!;
    expect(belt.powerModes).toEqual([{ transmitterId: 'LTE-B12-LOW', reducedTuneUpPowerDbm: 20, trigger: 'proximity-sensor' }]);
    const rows = (await specialist.get(`/api/filings/${id}/screening`)).body.rows as Row[];
    expect(rows.find((r) => r.transmitterId === 'LTE-B12-LOW' && r.usePositionId === 'belt-holster')!.powerMode).toBe('proximity-sensor');
  });

  it('a reduction at or above the maximum, for a transmitter not under Radios, twice for one transmitter, or without a trigger is answered at its field; nothing is written', async () => {
    const before = await positionsOf(id);
    const withModes = (powerModes: unknown[]) => ({ usePositions: before.map((p, i) => (i === 0 ? { ...p, powerModes } : p)) });

    const high = await specialist.put(`/api/filings/${id}/steps/use-positions`).send(withModes([{ transmitterId: 'LTE-B11', reducedTuneUpPowerDbm: 23, trigger: 'proximity-sensor' }]));
    expect(high.status).toBe(422);
    expect(high.body.error.message).toMatch(/Some fields need fixing/);
    expect(high.body.error.fields['usePositions.0.powerModes.0.reducedTuneUpPowerDbm']).toMatch(/below LTE-B11’s maximum tune-up power \(23 dBm\)/);

    const unknown = await specialist.put(`/api/filings/${id}/steps/use-positions`).send(withModes([{ transmitterId: 'LTE-GONE', reducedTuneUpPowerDbm: 10, trigger: 'proximity-sensor' }]));
    expect(unknown.body.error.fields['usePositions.0.powerModes.0.transmitterId']).toMatch(/No transmitter “LTE-GONE” under Radios/);

    const twice = await specialist.put(`/api/filings/${id}/steps/use-positions`).send(
      withModes([
        { transmitterId: 'LTE-B11', reducedTuneUpPowerDbm: 20, trigger: 'proximity-sensor' },
        { transmitterId: 'LTE-B11', reducedTuneUpPowerDbm: 19, trigger: 'time-averaged-sar' },
      ]),
    );
    expect(twice.body.error.fields['usePositions.0.powerModes.1.transmitterId']).toMatch(/already has a reduced power here/);

    const noTrigger = await specialist.put(`/api/filings/${id}/steps/use-positions`).send(withModes([{ transmitterId: 'LTE-B11', reducedTuneUpPowerDbm: 20 }]));
    expect(noTrigger.body.error.fields['usePositions.0.powerModes.0.trigger']).toMatch(/Pick what triggers the reduction/);

    const after = (await specialist.get(`/api/filings/${id}`)).body.filing;
    expect(after.data['use-positions'].usePositions).toEqual(before);
    expect(after.drafts['use-positions']).toBeDefined();
  });
});

describe('the device file and versions carry power modes', () => {
  it('the export names them and imports again unchanged', async () => {
    const id = await importDemo();
    const file = JSON.parse((await specialist.get(`/api/filings/${id}/device.json`)).text);
    expect(file.usePositions[0].powerModes).toEqual([{ transmitterId: 'LTE-B12', reducedTuneUpPowerDbm: 20, trigger: 'proximity-sensor' }]);
    expect(file.usePositions[1]).not.toHaveProperty('powerModes');
    const again = await specialist.post('/api/filings/import').send(file);
    expect(again.status).toBe(201);
    expect(JSON.parse((await specialist.get(`/api/filings/${again.body.filing.id}/device.json`)).text)).toEqual(file);
  });

  it('a file written before power modes existed (the demo export at c3b7b48) imports, screens at full power and exports byte for byte as it was', async () => {
    const text = readFileSync(path.join(__dirname, 'fixtures', 'demo-device-c3b7b48.json'), 'utf8');
    const res = await specialist.post('/api/filings/import').send(JSON.parse(text));
    expect(res.status).toBe(201);
    const id = res.body.filing.id;
    expect((await specialist.get(`/api/filings/${id}/device.json`)).text).toBe(text);
    const rows = (await specialist.get(`/api/filings/${id}/screening`)).body.rows as Row[];
    expect(rows.length).toBeGreaterThan(0);
    expect(rows.every((r) => r.powerMode === 'full')).toBe(true);
  });

  it('a file whose reduction names an unknown transmitter or is not below the maximum is refused with its JSON paths; nothing is created', async () => {
    const file = structuredClone(DEMO_TRACKER) as typeof DEMO_TRACKER & { usePositions: Position[] };
    file.usePositions[1].powerModes = [
      { transmitterId: 'LTE-X', reducedTuneUpPowerDbm: 10, trigger: 'hotspot-back-off' },
      { transmitterId: 'WLAN-5G', reducedTuneUpPowerDbm: 14, trigger: 'time-averaged-sar' },
    ];
    const count = (await specialist.get('/api/filings')).body.filings.length;
    const res = await specialist.post('/api/filings/import').send(file);
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/nothing was created/);
    expect(res.body.error.fields['usePositions.1.powerModes.0.transmitterId']).toMatch(/Unknown transmitter id "LTE-X"/);
    expect(res.body.error.fields['usePositions.1.powerModes.1.reducedTuneUpPowerDbm']).toMatch(/below WLAN-5G’s maximum tune-up power \(14 dBm\)/);
    expect((await specialist.get('/api/filings')).body.filings.length).toBe(count);
  });

  it('the JSON Schema describes the fields with their units', async () => {
    const schema = (await specialist.get('/api/schema/device.json')).body;
    const position = schema.properties.usePositions.items;
    expect(position.required).not.toContain('powerModes');
    const mode = position.properties.powerModes.items;
    expect(mode.properties.reducedTuneUpPowerDbm.description).toMatch(/dBm/);
    expect(mode.properties.trigger.enum).toEqual(['hotspot-back-off', 'proximity-sensor', 'time-averaged-sar']);
    expect(mode.properties.transmitterId.description).toMatch(/transmitter/);
  });

  it('the next version copies them; the signed version refuses changes to them in SQLite', async () => {
    const id = await importDemo();
    const v1 = (await specialist.get(`/api/filings/${id}`)).body.filing;
    markSigned(t.handle, v1.version.id);
    expect((await specialist.post(`/api/filings/${id}/versions`)).status).toBe(201);
    expect((await positionsOf(id)).find((p) => p.id === 'belt-clip')!.powerModes).toEqual([{ transmitterId: 'LTE-B12', reducedTuneUpPowerDbm: 20, trigger: 'proximity-sensor' }]);
    const sqlite = t.handle.sqlite;
    const position = (sqlite.prepare("select id from use_positions where version_id = ? and key = 'belt-clip'").get(v1.version.id) as { id: number }).id;
    const tx = (sqlite.prepare("select id from transmitters where version_id = ? and key = 'LTE-B2'").get(v1.version.id) as { id: number }).id;
    expect(() => sqlite.prepare('update use_position_power_modes set reduced_tune_up_power_dbm = 10 where use_position_id = ?').run(position)).toThrow(/signed version is frozen/);
    expect(() => sqlite.prepare('delete from use_position_power_modes where use_position_id = ?').run(position)).toThrow(/signed version is frozen/);
    expect(() =>
      sqlite
        .prepare("insert into use_position_power_modes (use_position_id, transmitter_id, reduced_tune_up_power_dbm, trigger, sort_order) values (?, ?, 10, 'proximity-sensor', 1)")
        .run(position, tx),
    ).toThrow(/signed version is frozen/);
  });
});
