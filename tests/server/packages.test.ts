/**
 * Submission packages through the API: a DRAFT preview of the demo filing, and a signed package
 * of the demo filing signed through review (its lab results, uploaded evidence, signature and
 * checklist) are built as jobs, downloaded, unpacked and checked file by file against the
 * manifest; the PDF's text is read back with pdfjs-dist and the DOCX's document.xml with JSZip;
 * two builds give the same bytes; an older version keeps its own data; verify recognises the
 * package and catches a tampered copy; roles and the audit trail.
 */
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import JSZip from 'jszip';
import { parse } from 'csv-parse/sync';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { DEMO_TRACKER } from '../../seeds/demo-filing';
import { createTestApp, seedUsers, signIn, type TestApp } from './support/test-app';
import { requestAndSign, TAG_DEVICE, TAG_LAB, tagFiling, uploadEvidence, type UploadedEvidence } from './support/package-fixtures';
import type { HighestReported, LabRow } from '../../calc/lab/lab-results';
import { fixed } from '../../templates/exhibit/layout';
import { LAB_CSV_HEADER } from '../../templates/exhibit/csv';
import { assembleExhibit } from '../../server/services/exhibit-service';
import { buildPackage, fileSink, type ExhibitRenderer } from '../../server/services/package-builder';
import { createLocalDiskStorage } from '../../server/storage';

type Agent = Awaited<ReturnType<typeof signIn>>;
// Builds render a 50-page PDF on a shared two-core machine: generous limits, no timing asserted.
vi.setConfig({ testTimeout: 120_000, hookTimeout: 60_000 });
const sha256 = (b: Buffer | Uint8Array) => createHash('sha256').update(b).digest('hex');
const transmitterIds = (DEMO_TRACKER.transmitters ?? []).map((x) => x.id);

const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

async function pdfText(bytes: Uint8Array): Promise<string[]> {
  const pdfjs = await import('pdfjs-dist/legacy/build/pdf.mjs');
  const doc = await pdfjs.getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, disableFontFace: true, verbosity: 0 }).promise;
  const pages: string[] = [];
  for (let i = 1; i <= doc.numPages; i++) {
    const content = await (await doc.getPage(i)).getTextContent();
    pages.push(content.items.map((it) => ('str' in it ? it.str : '')).join('\n'));
  }
  return pages;
}

/** Builds through the API and follows the job's Server-Sent Events until it ends. */
async function buildAndWait(agent: Agent, filingId: number, n: number) {
  const start = await agent.post(`/api/filings/${filingId}/versions/${n}/package`);
  expect(start.status).toBe(202);
  const events = await agent
    .get(`/api/jobs/${start.body.job.id}/events`)
    .buffer(true)
    .parse((res, cb) => {
      let text = '';
      res.on('data', (c: Buffer) => (text += c.toString()));
      res.on('end', () => cb(null, text));
    });
  expect(events.headers['content-type']).toMatch(/text\/event-stream/);
  const statuses = String(events.body)
    .split('\n\n')
    .filter((e) => e.startsWith('event: progress'))
    .map((e) => JSON.parse(e.split('data: ')[1]));
  return statuses;
}

async function download(agent: Agent, filingId: number, n: number) {
  const res = await agent.get(`/api/filings/${filingId}/versions/${n}/package`).buffer(true).parse(binary);
  return res;
}

async function checkAgainstManifest(zipBytes: Buffer) {
  // checkCRC32: every entry's CRC-32 as the zip states it (archiver's, taken natively) is right.
  const zip = await JSZip.loadAsync(zipBytes, { checkCRC32: true });
  const manifest = JSON.parse(await zip.file('manifest.json')!.async('string'));
  const names = Object.keys(zip.files).filter((n) => !zip.files[n].dir);
  expect(names.sort()).toEqual(['manifest.json', ...manifest.files.map((f: { path: string }) => f.path)].sort());
  for (const f of manifest.files) {
    const data = await zip.file(f.path)!.async('nodebuffer');
    expect(sha256(data), f.path).toBe(f.sha256);
    expect(data.length, f.path).toBe(f.sizeBytes);
  }
  return { zip, manifest };
}

describe('a DRAFT preview of the demo filing', () => {
  let t: TestApp;
  let specialist: Agent;
  let engineer: Agent;
  let admin: Agent;
  let zipBytes: Buffer;

  beforeAll(async () => {
    t = await createTestApp();
    await seedUsers(t);
    [specialist, engineer, admin] = await Promise.all([signIn(t, 'specialist@fieldfile.test'), signIn(t, 'engineer@fieldfile.test'), signIn(t, 'admin@fieldfile.test')]);
  });
  afterAll(() => t.close());

  it('is not there before it is built, and the status says what a build would give', async () => {
    const status = await engineer.get('/api/filings/1/versions/1/package/status');
    expect(status.status).toBe(200);
    expect(status.body).toMatchObject({ kind: 'preview', package: null, upToDate: false, canDownload: true, canBuild: true });
    const res = await engineer.get('/api/filings/1/versions/1/package');
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/build one first/);
  });

  it('is built as a job whose progress streams by stage and percent, and an engineer downloads it', async () => {
    const statuses = await buildAndWait(engineer, 1, 1);
    expect(statuses.at(-1)).toMatchObject({ state: 'done', percent: 100 });
    const stages = new Set(statuses.map((s) => s.stage));
    expect(stages).toContain('exhibit-pdf');
    const percents = statuses.map((s) => s.percent);
    expect(percents).toEqual([...percents].sort((a, b) => a - b));
    const res = await download(engineer, 1, 1);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/zip');
    expect(res.headers['content-disposition']).toBe('attachment; filename="trailhound-th-4-rugged-tracker-v1-draft.zip"');
    zipBytes = res.body;
    expect(res.headers['x-content-sha256']).toBe(sha256(zipBytes));
    expect(res.headers['repr-digest']).toBe(`sha-256=:${createHash('sha256').update(zipBytes).digest('base64')}:`);
  });

  it('holds the manifest, the exhibit, the results, and every file matches its manifest hash', async () => {
    const { manifest, zip } = await checkAgainstManifest(zipBytes);
    expect(manifest).toMatchObject({
      format: 'fieldfile.package/1',
      status: 'draft-preview',
      filing: { id: 1, version: 1 },
      signature: null,
      engine: { version: expect.any(String), ruleSetVersion: expect.any(String) },
    });
    expect(manifest.files.map((f: { path: string }) => f.path)).toEqual([
      'exhibit/trailhound-th-4-rugged-tracker-v1-rf-exposure-exhibit.pdf',
      'exhibit/trailhound-th-4-rugged-tracker-v1-rf-exposure-exhibit.docx',
      'results/screening.csv',
      'results/lab-sar.csv',
    ]);
    const csv = await zip.file('results/screening.csv')!.async('string');
    const lines = csv.trim().split('\r\n');
    expect(lines[0]).toBe(
      'transmitter_id,use_position_id,use_position_kind,market,exposure_tier,rule,frequency_Hz,separation_m,power_mode,evaluated_power_W,evaluated_quantity,threshold,threshold_unit,result,margin_dB,estimated_sar_W_per_kg,appendix_ref',
    );
    for (const id of transmitterIds) expect(csv).toContain(`\r\n${id},`);
  });

  it('says DRAFT on every page of the PDF and every transmitter is in its text', async () => {
    const zip = await JSZip.loadAsync(zipBytes);
    const pdf = await zip.file(/^exhibit\/.*\.pdf$/)[0].async('uint8array');
    const pages = await pdfText(pdf);
    expect(pages.length).toBeGreaterThan(10);
    pages.forEach((p, i) => {
      expect(p, `page ${i + 1}`).toContain('DRAFT');
      expect(p, `page ${i + 1}`).toContain(`Page ${i + 1} of ${pages.length}`);
    });
    const all = pages.join('\n');
    for (const id of transmitterIds) expect(all).toContain(id);
    expect(all).toContain('The certifying body decides on every filing.');
    // The demo's lab results as the lab-results calculation gives them, and today's checklist.
    const lab = (await engineer.get('/api/filings/1/lab-results')).body as { highest: HighestReported[] };
    for (const h of lab.highest.filter((x) => x.reportedSarWPerKg !== null)) expect(all).toContain(`${h.reportedSarWPerKg!.toFixed(2)} W/kg`);
    expect(all).toContain('This version is not signed: the checklist as it stands now.');
  });

  it('shows the demo’s reduced power in the PDF and the DOCX: LTE-B12 at 20 dBm instead of 24 dBm in the belt-clip position, by its proximity sensor', async () => {
    // Demo (seeds/demo-filing.ts): LTE-B12 tuned to 23 ± 1 dB (maximum 24 dBm), backed off to 20 dBm on the belt clip.
    const zip = await JSZip.loadAsync(zipBytes);
    const pdf = (await pdfText(await zip.file(/^exhibit\/.*\.pdf$/)[0].async('uint8array'))).join('\n').replace(/\s+/g, ' ');
    expect(pdf).toContain('Reduced tune-up power per use position');
    expect(pdf).toContain('belt-clip LTE-B12 24 dBm 20 dBm -4.0 dB Proximity sensor');
    expect(pdf).toContain('24 dBm (23 ± 1 dB)');
    // The screening rows say which power they used: reduced on the belt clip, the maximum elsewhere.
    expect(pdf).toMatch(/LTE-B12 belt-clip [^|]{0,120}?Reduced: Proximity sensor/);
    expect(pdf).toMatch(/LTE-B12 in-hand [^|]{0,120}?Maximum/);
    expect(pdf).not.toMatch(/LTE-B11 belt-clip [^|]{0,120}?Reduced/);

    const docx = await JSZip.loadAsync(await zip.file(/^exhibit\/.*\.docx$/)[0].async('nodebuffer'));
    const xml = await docx.file('word/document.xml')!.async('string');
    const cells = [...xml.matchAll(/<w:t(?: [^>]*)?>([^<]*)<\/w:t>/g)].map((x) => x[1]).join('|');
    expect(cells).toContain('Reduced tune-up power per use position');
    expect(cells).toContain('belt-clip|LTE-B12|24 dBm|20 dBm|-4.0 dB|Proximity sensor');
    expect(cells).toContain('24 dBm (23 ± 1 dB)');
    expect(cells).toMatch(/LTE-B12\|belt-clip\|[^|]+\|Reduced: Proximity sensor\|/);
    expect(cells).toMatch(/LTE-B12\|in-hand\|[^|]+\|Maximum\|/);
  });

  it('is refused to an admin, who has no role in filings', async () => {
    expect((await admin.get('/api/filings/1/versions/1/package')).status).toBe(403);
    expect((await admin.post('/api/filings/1/versions/1/package')).status).toBe(403);
  });

  it('is refused without a session and for a version that does not exist', async () => {
    const { default: request } = await import('supertest');
    expect((await request(t.app).get('/api/filings/1/versions/1/package')).status).toBe(401);
    const missing = await specialist.get('/api/filings/1/versions/9/package');
    expect(missing.status).toBe(404);
    expect(missing.body.error.message).toMatch(/No version 9 of filing 1/);
    expect((await specialist.get('/api/filings/1/versions/x/package')).status).toBe(422);
  });

  it('goes stale when the data changes, and is refused until it is built again', async () => {
    const radios = (await specialist.get('/api/filings/1')).body.filing.data.radios;
    // The demo's LTE band 12 states target 23 dBm ± 1 dB; a tighter tolerance lowers its maximum.
    radios.transmitters[0].maxTuneUpPowerDbm = 23.5;
    radios.transmitters[0].tuneUpToleranceDb = 0.5;
    expect((await specialist.put('/api/filings/1/steps/radios').send(radios)).status).toBe(200);
    const status = await engineer.get('/api/filings/1/versions/1/package/status');
    expect(status.body).toMatchObject({ upToDate: false, package: { kind: 'preview' } });
    expect((await engineer.get('/api/filings/1/versions/1/package')).status).toBe(409);
  });
});

describe('a signed package', () => {
  let t: TestApp;
  let approver: Agent;
  let engineer: Agent;
  let specialist: Agent;
  let zipBytes: Buffer;
  let evidence: UploadedEvidence[];
  let signature: Awaited<ReturnType<typeof requestAndSign>>['signature'];
  let lab: { rows: LabRow[]; highest: HighestReported[] };
  let id: number;
  const tagTransmitters = TAG_DEVICE.transmitters!.map((x) => x.id);

  beforeAll(async () => {
    t = await createTestApp();
    await seedUsers(t);
    [approver, engineer, specialist] = await Promise.all([signIn(t, 'approver@fieldfile.test'), signIn(t, 'engineer@fieldfile.test'), signIn(t, 'specialist@fieldfile.test')]);
    ({ filingId: id, evidence } = await tagFiling(specialist, engineer));
    signature = (await requestAndSign(specialist, approver, id)).signature;
    lab = (await engineer.get(`/api/filings/${id}/lab-results`)).body;
  });
  afterAll(() => t.close());

  it('is built by itself when the version is signed, and downloaded by the approver; an engineer may neither build nor download it', async () => {
    // Signing queued the build: the status shows its job, requested by the signer, before anyone asks.
    const status = await approver.get(`/api/filings/${id}/versions/1/package/status`);
    expect(status.body).toMatchObject({ kind: 'signed', job: { kind: 'package.build' } });
    const job = t.handle.sqlite.prepare('select requested_by_user_id as by from jobs where id = ?').get(status.body.job.id) as { by: number };
    expect(job.by).toBe((t.handle.sqlite.prepare("select id from users where email = 'approver@fieldfile.test'").get() as { id: number }).id);
    const done = await t.packages.queue.result(status.body.job.id);
    expect(done).toMatchObject({ state: 'done', result: { kind: 'signed', fileName: 'wren-w2-asset-tag-v1.zip' } });
    expect((await engineer.post(`/api/filings/${id}/versions/1/package`)).status).toBe(403);
    const res = await download(approver, id, 1);
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toBe('attachment; filename="wren-w2-asset-tag-v1.zip"');
    zipBytes = res.body;
    const denied = await engineer.get(`/api/filings/${id}/versions/1/package`);
    expect(denied.status).toBe(403);
    expect(denied.body.error.message).toMatch(/approver or specialist/);
  });

  it('records each download in the audit trail', async () => {
    await download(specialist, id, 1);
    const audit = t.handle.sqlite.prepare("select actor_user_id, details from audit_log where action = 'package.download' order by id").all() as { details: string }[];
    expect(audit).toHaveLength(2);
    expect(JSON.parse(audit[0].details)).toMatchObject({ version: 1, kind: 'signed', sha256: sha256(zipBytes) });
  });

  it('states the signature and the checklist as stored at signing in its manifest', async () => {
    const { manifest } = await checkAgainstManifest(zipBytes);
    expect(manifest.status).toBe('signed');
    expect(manifest.signature).toEqual({
      signerName: 'Jonas Weber',
      signerRole: 'Approver',
      signedAt: signature.signedAt,
      statement: signature.statement,
      contentSha256: signature.contentSha256,
      contentFormat: expect.any(String),
    });
    const stored = JSON.parse((t.handle.sqlite.prepare('select checklist from version_signatures').get() as { checklist: string }).checklist);
    expect(manifest.readiness).toMatchObject({ basis: 'at-signing', asOf: signature.signedAt, ready: true, counts: stored.counts });
    expect(manifest.readiness.items).toEqual(stored.items.map((i: { id: string; status: string }) => ({ id: i.id, status: i.status })));
  });

  it('holds the uploaded evidence in folders by category with the upload-time hashes, dated with the signing time, stored or deflated by type', async () => {
    const { manifest, zip } = await checkAgainstManifest(zipBytes);
    const byPath = new Map(manifest.files.map((f: { path: string; sha256: string; category: string; sizeBytes: number }) => [f.path, f]));
    for (const e of evidence) {
      const entry = byPath.get(`evidence/${e.category}/${e.fileName}`);
      expect(entry, e.fileName).toEqual({ path: `evidence/${e.category}/${e.fileName}`, sizeBytes: e.bytes.length, category: `evidence/${e.category}`, sha256: e.sha256 });
      expect((await zip.file(`evidence/${e.category}/${e.fileName}`)!.async('nodebuffer')).equals(e.bytes)).toBe(true);
    }
    // Category order as the evidence step lists them, then file name.
    expect(manifest.files.filter((f: { path: string }) => f.path.startsWith('evidence/')).map((f: { path: string }) => f.path)).toEqual([
      'evidence/test-report/WR2-T SAR report.pdf',
      'evidence/report-appendix/SAR plots.pdf',
      'evidence/calibration-certificate/probe EP-7462 calibration.pdf',
      'evidence/check-records/liquid and system checks.csv',
      'evidence/setup-photos/lanyard back 15 mm.jpg',
      'evidence/tune-up-table/tune-up table.pdf',
      'evidence/user-manual/manual RF exposure.pdf',
      'evidence/label-drawing/label.pdf',
    ]);
    // Every entry is dated with the signing time, to the two seconds a zip entry's date keeps.
    const signedZipTime = new Date(Math.floor(Date.parse(signature.signedAt) / 2000) * 2000).toISOString();
    for (const name of Object.keys(zip.files)) expect(zip.files[name].date.toISOString(), name).toBe(signedZipTime);
    // Compression method per entry from the central directory: 0 stored, 8 deflated.
    const methods = new Map<string, number>();
    for (let at = zipBytes.indexOf(Buffer.from([0x50, 0x4b, 0x01, 0x02])); at >= 0; at = zipBytes.indexOf(Buffer.from([0x50, 0x4b, 0x01, 0x02]), at + 46)) {
      const nameLength = zipBytes.readUInt16LE(at + 28);
      methods.set(zipBytes.toString('utf8', at + 46, at + 46 + nameLength), zipBytes.readUInt16LE(at + 10));
    }
    const method = (name: string) => methods.get(name);
    expect(method('evidence/setup-photos/lanyard back 15 mm.jpg')).toBe(0);
    expect(method('evidence/check-records/liquid and system checks.csv')).toBe(8);
    expect(method('exhibit/wren-w2-asset-tag-v1-rf-exposure-exhibit.pdf')).toBe(0);
    expect(method('results/screening.csv')).toBe(8);
    expect(method('manifest.json')).toBe(8);
  });

  it('has a PDF without DRAFT with the reported SAR of every scan, each highest reported SAR, the evidence hashes and the signer', async () => {
    const zip = await JSZip.loadAsync(zipBytes);
    const pdf = Buffer.from(await zip.file(/^exhibit\/.*\.pdf$/)[0].async('uint8array'));
    const pages = await pdfText(pdf);
    const all = pages.join('\n');
    expect(all).not.toContain('DRAFT');
    for (const tx of tagTransmitters) expect(all).toContain(tx);
    expect(lab.rows).toHaveLength(TAG_LAB.measurements.length);
    for (const r of lab.rows) expect(all, r.measurementId).toContain(`${fixed(r.reportedSar1gWPerKg, 2)} / ${fixed(r.reportedSar10gWPerKg, 2)}`);
    const measured = lab.highest.filter((h) => h.reportedSarWPerKg !== null);
    expect(measured.length).toBe(4);
    for (const h of measured) expect(all, `${h.regime} ${h.usePositionKind}`).toContain(`${h.reportedSarWPerKg!.toFixed(2)} W/kg`);
    for (const e of evidence) expect(all, e.fileName).toContain(e.sha256);
    expect(all).toContain('Jonas Weber (Approver)');
    expect(all).toContain(signature.contentSha256);
    expect(all).toContain('As it stood at signing');
    const { PDFDocument, PDFDict, PDFName } = await import('pdf-lib');
    const parsed = await PDFDocument.load(pdf, { updateMetadata: false });
    const dicts = parsed.context
      .enumerateIndirectObjects()
      .map(([, o]) => o)
      .filter((o) => o instanceof PDFDict);
    const fonts = dicts.filter((d) => d.get(PDFName.of('Type')) === PDFName.of('Font'));
    const descriptors = dicts.filter((d) => d.get(PDFName.of('Type')) === PDFName.of('FontDescriptor'));
    expect(descriptors.length).toBeGreaterThanOrEqual(3);
    for (const d of descriptors) expect(d.has(PDFName.of('FontFile2')), String(d.get(PDFName.of('FontName')))).toBe(true);
    // No standard-14 font: every font is a Type0 with an embedded TrueType descendant.
    for (const f of fonts) expect(['/Type0', '/CIDFontType2']).toContain(String(f.get(PDFName.of('Subtype'))));
    expect(parsed.getAuthor()).toBe('Halden Ridge Instruments');
    expect(parsed.getTitle()).toBe('RF-exposure exhibit — Wren W2 asset tag (WR2-T) v1');
    // PDF dates keep whole seconds.
    expect(parsed.getCreationDate()?.toISOString()).toBe(`${signature.signedAt.slice(0, 19)}.000Z`);
    expect(parsed.getSubject()).toContain(`filing ${id} version 1`);
  });

  it('has a DOCX whose document.xml has real headings and tables and the same figures, hashes and signer', async () => {
    const zip = await JSZip.loadAsync(zipBytes);
    const docx = await JSZip.loadAsync(await zip.file(/^exhibit\/.*\.docx$/)[0].async('nodebuffer'));
    const xml = await docx.file('word/document.xml')!.async('string');
    for (const tx of tagTransmitters) expect(xml).toContain(tx);
    for (const h of lab.highest.filter((x) => x.reportedSarWPerKg !== null)) expect(xml).toContain(`${h.reportedSarWPerKg!.toFixed(2)} W/kg`);
    for (const e of evidence) expect(xml).toContain(e.sha256);
    expect(xml).toContain('Jonas Weber (Approver)');
    expect(xml).toContain('<w:tbl>');
    expect(xml).toMatch(/<w:pStyle w:val="Heading1"\/>/);
    expect(xml).toContain('<w:tblHeader/>');
    expect(xml).not.toContain('DRAFT');
    const core = await docx.file('docProps/core.xml')!.async('string');
    expect(core).toContain(`${signature.signedAt.slice(0, 19)}Z`);
  });

  it('has the lab results as CSV, one row per scan in SI units', async () => {
    const zip = await JSZip.loadAsync(zipBytes);
    const [header, ...rows] = parse(await zip.file('results/lab-sar.csv')!.async('string')) as string[][];
    expect(header).toEqual(LAB_CSV_HEADER);
    expect(rows.map((r) => r[0])).toEqual(lab.rows.map((r) => r.measurementId));
    const col = (name: string) => LAB_CSV_HEADER.indexOf(name);
    for (const [i, r] of lab.rows.entries()) {
      expect(Number(rows[i][col('reported_sar_1g_W_per_kg')])).toBe(r.reportedSar1gWPerKg);
      expect(Number(rows[i][col('reported_sar_10g_W_per_kg')])).toBe(r.reportedSar10gWPerKg);
      expect(Number(rows[i][col('frequency_Hz')])).toBe(r.frequencyHz);
    }
  });

  it('gives the same bytes when built again', async () => {
    await buildAndWait(approver, id, 1);
    const again = await download(approver, id, 1);
    expect(sha256(again.body)).toBe(sha256(zipBytes));
  });

  it('is recognised by verify from its hash and from the zip', async () => {
    const byHash = await engineer.post('/api/packages/verify').send({ sha256: sha256(zipBytes) });
    expect(byHash.status).toBe(200);
    expect(byHash.body).toMatchObject({ verdict: 'intact', signed: true, package: { filingId: id, versionNumber: 1, kind: 'signed' } });
    const byZip = await engineer.post('/api/packages/verify').attach('file', zipBytes, 'package.zip');
    expect(byZip.body).toMatchObject({ verdict: 'intact', signed: true });
  });

  it('catches a tampered copy and names the changed, missing and added files', async () => {
    const zip = await JSZip.loadAsync(zipBytes);
    zip.file('results/screening.csv', 'transmitter_id\r\nLTE-B12\r\n');
    zip.remove('evidence/check-records/liquid and system checks.csv');
    zip.file('evidence/extra.txt', 'slipped in');
    const tampered = await zip.generateAsync({ type: 'nodebuffer' });
    const res = await engineer.post('/api/packages/verify').attach('file', tampered, 'package.zip');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ verdict: 'differs', signed: false, package: { filingId: id, versionNumber: 1 } });
    const bad = res.body.files.filter((f: { status: string }) => f.status !== 'ok');
    expect(bad).toEqual([
      { path: 'results/screening.csv', status: 'changed' },
      { path: 'evidence/check-records/liquid and system checks.csv', status: 'missing' },
      { path: 'evidence/extra.txt', status: 'not-in-manifest' },
    ]);
    expect(res.body.message).toMatch(/3 files differ/);
  });

  it('does not vouch for a zip whose manifest was edited, or for unknown hashes and non-zips', async () => {
    const zip = await JSZip.loadAsync(zipBytes);
    const manifest = JSON.parse(await zip.file('manifest.json')!.async('string'));
    manifest.filing.version = 2;
    zip.file('manifest.json', JSON.stringify(manifest));
    const res = await engineer.post('/api/packages/verify').attach('file', await zip.generateAsync({ type: 'nodebuffer' }), 'package.zip');
    expect(res.body).toMatchObject({ verdict: 'unknown', signed: false, package: null });
    const unknown = await engineer.post('/api/packages/verify').send({ sha256: 'a'.repeat(64) });
    expect(unknown.body).toMatchObject({ verdict: 'unknown' });
    const badHash = await engineer.post('/api/packages/verify').send({ sha256: 'xyz' });
    expect(badHash.status).toBe(422);
    expect(badHash.body.error.fields.sha256).toMatch(/64 hexadecimal/);
    const notZip = await engineer.post('/api/packages/verify').attach('file', Buffer.from('hello'), 'notes.zip');
    expect(notZip.status).toBe(422);
    expect(notZip.body.error.message).toMatch(/not a zip/);
  });

  it('keeps version 1 to its own data once version 2 changes the lab results and the evidence', async () => {
    expect((await specialist.post(`/api/filings/${id}/versions`)).status).toBe(201);
    const measurements = (await engineer.get(`/api/filings/${id}/measurements`)).body.measurements as { id: string; sar1gWPerKg: number | null }[];
    measurements.find((m) => m.id === 'T01')!.sar1gWPerKg = 0.0777;
    expect((await engineer.put(`/api/filings/${id}/measurements`).send({ measurements })).status).toBe(200);
    const [extra] = await uploadEvidence(engineer, id, [{ category: 'other', fileName: 'v2-note.txt', bytes: Buffer.from('Only in version 2.\n') }]);

    await buildAndWait(approver, id, 1);
    const v1 = await download(approver, id, 1);
    expect(sha256(v1.body), 'version 1 rebuilt after version 2 changed').toBe(sha256(zipBytes));

    await buildAndWait(engineer, id, 2);
    const v2 = await download(engineer, id, 2);
    const { manifest } = await checkAgainstManifest(v2.body);
    expect(manifest).toMatchObject({ status: 'draft-preview', filing: { version: 2 }, signature: null, readiness: { basis: 'current' } });
    expect(manifest.files.map((f: { sha256: string }) => f.sha256)).toContain(extra.sha256);
    const [header, ...rows] = parse(await (await JSZip.loadAsync(v2.body)).file('results/lab-sar.csv')!.async('string')) as string[][];
    expect(rows.find((r) => r[0] === 'T01')![header.indexOf('measured_sar_1g_W_per_kg')]).toBe('0.0777');
  });
});

describe('the builder on its own', () => {
  it('gives byte-identical zips for the same version, built twice in a row', async () => {
    const t = await createTestApp();
    try {
      const seeded = await seedUsers(t);
      const a = assembleExhibit(t.handle.db, seeded.organisationId, 1, 1, { evidence: () => [] })!;
      const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-build-'));
      const one = await buildPackage(a, fileSink(path.join(dir, 'one.zip')), { producer: 'Fieldfile test' });
      const b = assembleExhibit(t.handle.db, seeded.organisationId, 1, 1, { evidence: () => [] })!;
      const two = await buildPackage(b, fileSink(path.join(dir, 'two.zip')), { producer: 'Fieldfile test' });
      expect(two.sha256).toBe(one.sha256);
      expect(sha256(fs.readFileSync(path.join(dir, 'one.zip')))).toBe(one.sha256);
      expect(fs.readFileSync(path.join(dir, 'two.zip')).equals(fs.readFileSync(path.join(dir, 'one.zip')))).toBe(true);
      fs.rmSync(dir, { recursive: true, force: true });
    } finally {
      await t.close();
    }
  });

  it('stops the other renderer and keeps nothing when one of the two renders fails', async () => {
    const t = await createTestApp();
    try {
      const seeded = await seedUsers(t);
      const a = assembleExhibit(t.handle.db, seeded.organisationId, 1, 1, { evidence: () => [] })!;
      const root = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-build-'));
      const storage = createLocalDiskStorage(root);
      let pdfStopped: unknown;
      // The PDF renders until it is told to stop; the DOCX fails once the PDF has started.
      let pdfStarted: () => void = () => {};
      const started = new Promise<void>((resolve) => (pdfStarted = resolve));
      const render: ExhibitRenderer = (document, _model, _producer, signal) =>
        document === 'pdf'
          ? new Promise((_resolve, reject) => {
              pdfStarted();
              signal.addEventListener('abort', () => {
                pdfStopped = signal.reason;
                reject(signal.reason);
              });
            })
          : started.then(() => Promise.reject(new Error('DOCX renderer broke')));
      await expect(buildPackage(a, (zip) => storage.put(zip), { producer: 'Fieldfile test', render })).rejects.toThrow('DOCX renderer broke');
      expect(String(pdfStopped)).toContain('DOCX renderer broke');
      const files = (fs.readdirSync(root, { recursive: true, withFileTypes: true }) as fs.Dirent[]).filter((d) => d.isFile());
      expect(files).toEqual([]);
      fs.rmSync(root, { recursive: true, force: true });
    } finally {
      await t.close();
    }
  });
});
