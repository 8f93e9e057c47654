/**
 * The device record's identity through the API: grant identifiers (47 CFR §2.926 formats, ISED
 * CN-UPN), HVIN/PMN/FVIN, model variants, a host with a certified module inside whose grant's
 * minimum separation reaches screening, tune-up target ± tolerance, mode/modulation/bandwidth and
 * duty-factor presets; the device file carries them both ways; the next version copies them; a
 * signed version's module grants are frozen; a signature made before these fields existed still
 * verifies.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openDatabase } from '../../db/client';
import { MIGRATIONS_DIR } from '../../db/migrate';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import * as schema from '../../db/schema';
import { versionContentSha256 } from '../../server/services/version-content';
import { DEMO_TRACKER } from '../../seeds/demo-filing';
import { zDeviceFile } from '../../constants/schemas/device-file';
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

/** A host with a certified LTE module inside (fictional grant: 20 mm minimum separation). */
const hostFile = () => {
  const file = structuredClone(zDeviceFile.parse(DEMO_TRACKER));
  file.device.name = 'Trailhound TH-4 with module';
  file.device.integration = 'host-with-module';
  file.device.modules = [
    {
      id: 'LTE-MOD',
      name: 'Kestrel KM-7 LTE module',
      fccGranteeCode: 'XKM',
      fccProductCode: 'KM7-LTE',
      isedCompanyNumber: '30912K',
      isedUpn: 'KM7LTE',
      minSeparationM: 0.02,
      conditions: 'Antenna gain at most 3 dBi.',
    },
  ];
  file.transmitters[0].moduleId = 'LTE-MOD';
  return file;
};

describe('device identity on the Device step', () => {
  let id: number;
  beforeAll(async () => {
    id = (await specialist.post('/api/filings/import').send(DEMO_TRACKER)).body.filing.id;
  });

  it('the demo device carries its FCC ID, ISED number, HVIN, PMN, FVIN and model variants', async () => {
    const device = (await specialist.get(`/api/filings/${id}`)).body.filing.data.device;
    expect(device).toMatchObject({
      fccGranteeCode: '2BHRW',
      fccProductCode: 'TH4LW2',
      isedCompanyNumber: '27861H',
      isedUpn: 'TH4LW2',
      hvin: 'TH4-LW2-C',
      pmn: 'Trailhound TH-4',
      fvin: '2.4',
      integration: 'host',
    });
    expect(device.modelVariants.map((v: { model: string }) => v.model)).toEqual(['TH4-LW2-K', 'TH4-LW2-F']);
  });

  it('an invalid grantee code is answered at its field and kept as a draft; the stored identity stays', async () => {
    const device = (await specialist.get(`/api/filings/${id}`)).body.filing.data.device;
    const res = await specialist.put(`/api/filings/${id}/steps/device`).send({ ...device, fccGranteeCode: '2BH0' });
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toEqual({ fccGranteeCode: 'A grantee code never uses the digits 0 or 1 (FCC grantee-code format).' });
    const after = (await specialist.get(`/api/filings/${id}`)).body.filing;
    expect(after.data.device.fccGranteeCode).toBe('2BHRW');
    expect(after.drafts.device.data.fccGranteeCode).toBe('2BH0');
  });

  it('a valid change is stored in capitals', async () => {
    const device = (await specialist.get(`/api/filings/${id}`)).body.filing.data.device;
    const res = await specialist.put(`/api/filings/${id}/steps/device`).send({ ...device, fccGranteeCode: 'hrq', fccProductCode: 'th4-lw2' });
    expect(res.body.saved).toBe(true);
    expect(res.body.filing.data.device).toMatchObject({ fccGranteeCode: 'HRQ', fccProductCode: 'TH4-LW2' });
    expect(res.body.filing.drafts.device).toBeUndefined();
  });
});

describe('a host with a certified module inside', () => {
  let id: number;
  beforeAll(async () => {
    const res = await specialist.post('/api/filings/import').send(hostFile());
    expect(res.status).toBe(201);
    id = res.body.filing.id;
  });

  it('screening warns where a use position is closer than the module grant’s minimum separation', async () => {
    const res = await specialist.get(`/api/filings/${id}/screening`);
    // LTE-B12 (module) on ANT-MAIN: belt-clip 10 mm, in-hand 0 mm and wrist-strap 4 mm are under 20 mm; vehicle-dock 200 mm is not.
    expect(res.body.conditions.map((c: { usePositionId: string; antennaId: string }) => `${c.usePositionId}/${c.antennaId}`)).toEqual([
      'belt-clip/ANT-MAIN',
      'in-hand/ANT-MAIN',
      'wrist-strap/ANT-MAIN',
    ]);
    expect(res.body.conditions[0]).toMatchObject({
      moduleId: 'LTE-MOD',
      transmitterId: 'LTE-B12',
      separationM: 0.01,
      minSeparationM: 0.02,
      message: expect.stringMatching(/10 mm, closer than the 20 mm module LTE-MOD/),
    });
    const row = res.body.rows.find((r: { transmitterId: string; usePositionId: string }) => r.transmitterId === 'LTE-B12' && r.usePositionId === 'belt-clip');
    expect(row.derivation.notes.join(' ')).toMatch(/Module grant condition/);
  });

  it('renaming the module keeps its transmitter in it; removing it leaves the transmitter in none', async () => {
    const filing = (await specialist.get(`/api/filings/${id}`)).body.filing;
    const device = filing.data.device;
    const renamed = await specialist.put(`/api/filings/${id}/steps/device`).send({ ...device, modules: [{ ...device.modules[0], id: 'KM7' }] });
    expect(renamed.body.saved).toBe(true);
    expect(renamed.body.filing.data.radios.transmitters[0].moduleId).toBe('KM7');
    // A transmitter naming a module the device does not have is answered at its field.
    const radios = renamed.body.filing.data.radios;
    const bad = await specialist
      .put(`/api/filings/${id}/steps/radios`)
      .send({ ...radios, transmitters: radios.transmitters.map((t: object, i: number) => (i === 1 ? { ...t, moduleId: 'GHOST' } : t)) });
    expect(bad.body.error.fields).toEqual({ 'transmitters.1.moduleId': 'No module “GHOST” under Device.' });
    const removed = await specialist.put(`/api/filings/${id}/steps/device`).send({ ...renamed.body.filing.data.device, integration: 'host', modules: [] });
    expect(removed.body.saved).toBe(true);
    expect(removed.body.filing.data.radios.transmitters[0].moduleId).toBeUndefined();
  });
});

describe('radios: tune-up target ± tolerance, mode, duty-factor preset', () => {
  it('stores the target and tolerance with the upper bound, and refuses a maximum that is not their sum', async () => {
    const id = (await specialist.post('/api/filings/import').send(DEMO_TRACKER)).body.filing.id;
    const radios = (await specialist.get(`/api/filings/${id}`)).body.filing.data.radios;
    expect(radios.transmitters[0]).toMatchObject({ maxTuneUpPowerDbm: 24, tuneUpTargetDbm: 23, tuneUpToleranceDb: 1, mode: 'QPSK, 1 RB', modulation: 'QPSK', bandwidth: '1.4–10 MHz' });
    const bt = { ...radios.transmitters[5], dutyCycle: 0.5, dutyCyclePreset: 'ptt-50' };
    const ok = await specialist.put(`/api/filings/${id}/steps/radios`).send({ ...radios, transmitters: [...radios.transmitters.slice(0, 5), bt] });
    expect(ok.body.saved).toBe(true);
    expect(ok.body.filing.data.radios.transmitters[5]).toMatchObject({ dutyCycle: 0.5, dutyCyclePreset: 'ptt-50' });
    const bad = await specialist.put(`/api/filings/${id}/steps/radios`).send({ ...radios, transmitters: [{ ...radios.transmitters[0], maxTuneUpPowerDbm: 23 }, ...radios.transmitters.slice(1)] });
    expect(bad.body.error.fields).toEqual({ 'transmitters.0.maxTuneUpPowerDbm': 'Target 23 dBm + tolerance 1 dB gives 24 dBm: the maximum is that upper bound.' });
  });

  it('an unchanged save writes nothing (no audit entry for an autosave that changed nothing)', async () => {
    const id = (await specialist.post('/api/filings/import').send(hostFile())).body.filing.id;
    const filing = (await specialist.get(`/api/filings/${id}`)).body.filing;
    const count = () => (t.handle.sqlite.prepare("select count(*) n from audit_log where action = 'filing.step-save' and target_id = ?").get(String(id)) as { n: number }).n;
    await specialist.put(`/api/filings/${id}/steps/device`).send(filing.data.device);
    await specialist.put(`/api/filings/${id}/steps/radios`).send(filing.data.radios);
    expect(count()).toBe(0);
  });
});

describe('the device file carries the identity both ways', () => {
  it('exports every new field and imports the export unchanged', async () => {
    const file = hostFile();
    const id = (await specialist.post('/api/filings/import').send(file)).body.filing.id;
    const exported = JSON.parse((await specialist.get(`/api/filings/${id}/device.json`)).text);
    expect(exported).toEqual(file);
    const again = await specialist.post('/api/filings/import').send(exported);
    expect(again.status).toBe(201);
    expect(JSON.parse((await specialist.get(`/api/filings/${again.body.filing.id}/device.json`)).text)).toEqual(file);
  });

  it('refuses a transmitter naming an unknown module, at its path', async () => {
    const file = hostFile();
    file.transmitters[1].moduleId = 'NOPE';
    const res = await specialist.post('/api/filings/import').send(file);
    expect(res.status).toBe(422);
    expect(res.body.error.fields['transmitters.1.moduleId']).toMatch(/Unknown module id "NOPE"/);
  });

  it('the JSON Schema says what the new fields mean', async () => {
    const schema = (await specialist.get('/api/schema/device.json')).body;
    expect(schema.properties.device.properties.fccGranteeCode.description).toMatch(/§2\.926/);
    expect(schema.properties.transmitters.items.properties.tuneUpToleranceDb.description).toMatch(/± dB/);
  });
});

describe('versions', () => {
  it('the next version copies the identity, the module grants and the transmitters’ module and tune-up', async () => {
    const id = (await specialist.post('/api/filings/import').send(hostFile())).body.filing.id;
    const v1 = (await specialist.get(`/api/filings/${id}`)).body.filing;
    markSigned(t.handle, v1.version.id);
    const next = await specialist.post(`/api/filings/${id}/versions`);
    expect(next.status).toBe(201);
    const v2 = (await specialist.get(`/api/filings/${id}`)).body.filing;
    expect(v2.version.number).toBe(2);
    const strip = (d: { modules: { rowId?: number }[] }) => ({ ...d, modules: d.modules.map(({ rowId: _r, ...m }) => m) });
    expect(strip(v2.data.device)).toEqual(strip(v1.data.device));
    expect(v2.data.device.modules[0].rowId).not.toBe(v1.data.device.modules[0].rowId);
    const tx = (f: typeof v1) => f.data.radios.transmitters.map(({ rowId: _r, ...x }: { rowId: number }) => x);
    expect(tx(v2)).toEqual(tx(v1));
    expect(v2.data.radios.transmitters[0]).toMatchObject({ moduleId: 'LTE-MOD', tuneUpTargetDbm: 23, tuneUpToleranceDb: 1 });

    // Version 1 is signed: its device's module grants refuse any change in SQLite itself.
    const sqlite = t.handle.sqlite;
    const deviceId = (sqlite.prepare('select device_id from filing_versions where id = ?').get(v1.version.id) as { device_id: number }).device_id;
    expect(() => sqlite.prepare('update device_modules set min_separation_m = 0 where device_id = ?').run(deviceId)).toThrow(/signed version is frozen/);
    expect(() => sqlite.prepare("insert into device_modules (device_id, key, sort_order) values (?, 'X', 9)").run(deviceId)).toThrow(/signed version is frozen/);
    expect(() => sqlite.prepare('delete from device_modules where device_id = ?').run(deviceId)).toThrow(/signed version is frozen/);
  });
});

/**
 * An independent build of the "fieldfile.version-content/1" text for the tables a version had
 * before the device identity (server/services/version-content.ts as it was then): the listed
 * tables in order, each row's columns sorted by name, rows sorted by their serialisation.
 */
function oldFormatSha256(sqlite: ReturnType<typeof openDatabase>['sqlite'], v: number): string {
  const tables: [string, string][] = [
    ['filing_versions', `id = ${v}`],
    ['devices', `id = (select device_id from filing_versions where id = ${v})`],
    ['antennas', `version_id = ${v}`],
    ['transmitters', `version_id = ${v}`],
    ['use_positions', `version_id = ${v}`],
    ['use_position_separations', `use_position_id in (select id from use_positions where version_id = ${v})`],
    ['market_selections', `version_id = ${v}`],
    ['simultaneous_groups', `version_id = ${v}`],
    ['step_drafts', `version_id = ${v}`],
    ['screening_results', `version_id = ${v}`],
    ['simultaneous_group_members', `group_id in (select id from simultaneous_groups where version_id = ${v})`],
    ...['lab_measurements', 'lab_liquid_checks', 'lab_system_checks', 'lab_instruments', 'lab_uncertainty_components', 'evidence_files', 'evidence_explanations'].map((n): [string, string] => [
      n,
      `version_id = ${v}`,
    ]),
  ];
  const parts = tables.map(([table, where]) => {
    const rows = (sqlite.prepare(`select * from "${table}" where ${where}`).all() as Record<string, unknown>[]).map((r) =>
      JSON.stringify(
        Object.fromEntries(
          Object.keys(r)
            .filter((k) => !(table === 'filing_versions' && k === 'state'))
            .sort()
            .map((k) => [k, r[k]]),
        ),
      ),
    );
    return `{"table":${JSON.stringify(table)},"rows":[${rows.sort().join(',')}]}`;
  });
  return createHash('sha256')
    .update(`{"format":"fieldfile.version-content/1","tables":[${parts.join(',')}]}`, 'utf8')
    .digest('hex');
}

describe('signatures made before the identity fields existed', () => {
  it('hash the same after the migrations that add them; a value typed later changes the hash', () => {
    // A database migrated only up to 0009 (before the device identity), with one version in it.
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-old-'));
    fs.cpSync(MIGRATIONS_DIR, dir, { recursive: true });
    const journal = JSON.parse(fs.readFileSync(path.join(dir, 'meta', '_journal.json'), 'utf8')) as { entries: { tag: string }[] };
    const upTo = journal.entries.findIndex((e) => e.tag.startsWith('0009_'));
    journal.entries = journal.entries.slice(0, upTo + 1);
    fs.writeFileSync(path.join(dir, 'meta', '_journal.json'), JSON.stringify(journal));
    const handle = openDatabase(':memory:');
    try {
      migrate(handle.db, { migrationsFolder: dir });
      const run = (q: string) => handle.sqlite.exec(q);
      run("insert into organisations (id, name, slug) values (1, 'Halden Ridge Instruments', 'halden')");
      run("insert into users (id, email, name) values (1, 'a@fieldfile.test', 'A')");
      run("insert into devices (id, organisation_id, name, model, applicant, product_type) values (1, 1, 'Old', 'O-1', 'Halden Ridge Instruments', 'phone')");
      run('insert into filings (id, organisation_id, device_id, owner_user_id) values (1, 1, 1, 1)');
      run('insert into filing_versions (id, filing_id, number, device_id) values (1, 1, 1, 1)');
      run("insert into antennas (id, version_id, key, gain_dbi, sort_order) values (1, 1, 'A', 0, 0)");
      run(
        "insert into transmitters (id, version_id, key, technology, band, frequency_min_hz, frequency_max_hz, max_tune_up_power_dbm, duty_cycle, antenna_id, sort_order) values (1, 1, 'T', 'LTE', 'B2', 1.85e9, 1.91e9, 23, 1, 1, 0)",
      );
      // The hash as the code of that time computed it: every row of its tables, columns sorted.
      const before = oldFormatSha256(handle.sqlite, 1);
      migrate(handle.db, { migrationsFolder: MIGRATIONS_DIR });
      const db = drizzle(handle.sqlite, { schema });
      expect(versionContentSha256(db, 1)).toBe(before);
      run("update devices set fcc_grantee_code = '2BHRW' where id = 1");
      expect(versionContentSha256(db, 1)).not.toBe(before);
    } finally {
      handle.sqlite.close();
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
