/**
 * Evidence API: upload (each category's types, 415 with the sniffed type, 413, aborted upload,
 * duplicates, unsafe names), list with the required categories, download headers, replacement
 * history, removal, role matrix, the frozen signed version, and carry-forward into a new version.
 */
import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EVIDENCE_CATEGORIES, UPLOADABLE_CATEGORIES, type EvidenceList } from '../../constants/schemas/evidence';
import { auditLog, evidenceFiles, filingVersions } from '../../db/schema';
import { carryEvidenceForward } from '../../server/repos/evidence-repo';
import { createTestApp, seedUsers, signIn, type TestApp } from './support/test-app';
import { renamedExecutable, samples, type Sample } from './support/documents';
import { EVIDENCE_DEVICE } from './support/evidence-filing';
import { makePdf } from '../../seeds/documents';

let t: TestApp;
let engineer: Awaited<ReturnType<typeof signIn>>;
let specialist: Awaited<ReturnType<typeof signIn>>;
let approver: Awaited<ReturnType<typeof signIn>>;
let admin: Awaited<ReturnType<typeof signIn>>;
let filingId: number;
let all: Sample[];

/** Every stored object and temporary file under the uploads folder. */
function uploadedFiles(): string[] {
  if (!fs.existsSync(t.config.uploadsDir)) return [];
  return (fs.readdirSync(t.config.uploadsDir, { recursive: true, withFileTypes: true }) as fs.Dirent[]).filter((d) => d.isFile()).map((d) => d.name);
}
const rowCount = () => t.handle.db.select().from(evidenceFiles).all().length;

function send(agent: typeof engineer, sample: Sample, category: string, extra: Record<string, string> = {}, id = filingId) {
  let req = agent.post(`/api/filings/${id}/evidence`).field('category', category);
  for (const [k, v] of Object.entries(extra)) req = req.field(k, v);
  return req.attach('file', sample.bytes, { filename: sample.fileName, contentType: 'application/pdf' });
}

async function newFiling(): Promise<number> {
  const res = await specialist.post('/api/filings/import').send(EVIDENCE_DEVICE);
  expect(res.status).toBe(201);
  return res.body.filing.id;
}

beforeAll(async () => {
  t = await createTestApp();
  await seedUsers(t);
  [engineer, specialist, approver, admin] = await Promise.all(['engineer', 'specialist', 'approver', 'admin'].map((r) => signIn(t, `${r}@fieldfile.test`)));
  filingId = await newFiling();
  all = await samples();
}, 120_000);
afterAll(() => t.close());

describe('evidence categories', () => {
  it('are published with the types each takes', async () => {
    const res = await engineer.get('/api/schema/evidence-categories.json');
    expect(res.status).toBe(200);
    expect(res.body.categories.map((c: { id: string }) => c.id)).toEqual(EVIDENCE_CATEGORIES.map((c) => c.id));
    const cal = res.body.categories.find((c: { id: string }) => c.id === 'calibration-certificate');
    expect(cal.accepts).toEqual([{ mediaType: 'application/pdf', label: 'PDF' }]);
    expect(cal.dateLabel).toBe('Calibration date');
  });

  // About a hundred uploads: allow for a busy shared machine.
  it('take exactly their types, by content: everything else is 415 naming the sniffed type', { timeout: 180_000 }, async () => {
    const id = await newFiling();
    for (const category of UPLOADABLE_CATEGORIES) {
      for (const sample of all) {
        const res = await send(engineer, sample, category.id, {}, id);
        const accepted = (category.accepts as readonly string[]).includes(sample.mime);
        expect({ category: category.id, type: sample.mime, status: res.status }).toEqual({ category: category.id, type: sample.mime, status: accepted ? 201 : 415 });
        if (accepted) expect(res.body.record.mediaType).toBe(sample.mime);
        else expect(res.body.error.message).toContain(sample.mime);
      }
    }
  });
});

describe('uploading', () => {
  it('stores a report with its hash, size, type and uploader, and downloads it as an attachment', async () => {
    const pdf = await makePdf([['Kestrel KH2-LTE SAR test report']]);
    const res = await send(engineer, { mime: 'application/pdf', fileName: 'KH2 SAR report.pdf', bytes: pdf }, 'test-report', { title: 'SAR report part 1 of 2', note: 'Issued by the lab' });
    expect(res.status).toBe(201);
    const r = res.body.record;
    expect(r).toMatchObject({
      category: 'test-report',
      title: 'SAR report part 1 of 2',
      note: 'Issued by the lab',
      fileName: 'KH2 SAR report.pdf',
      sizeBytes: pdf.length,
      mediaType: 'application/pdf',
      uploadedBy: { name: expect.any(String) },
    });
    expect(r.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(fs.existsSync(path.join(t.config.uploadsDir, r.sha256.slice(0, 2), r.sha256.slice(2, 4), r.sha256))).toBe(true);

    const file = await approver
      .get(`/api/filings/${filingId}/evidence/${r.id}/file`)
      .buffer(true)
      .parse((res2, cb) => {
        const parts: Buffer[] = [];
        res2.on('data', (c: Buffer) => parts.push(c));
        res2.on('end', () => cb(null, Buffer.concat(parts)));
      });
    expect(file.status).toBe(200);
    expect(Buffer.compare(file.body as Buffer, pdf)).toBe(0);
    expect(file.headers['content-type']).toBe('application/pdf');
    expect(file.headers['content-disposition']).toMatch(/^attachment; filename="KH2 SAR report.pdf"/);
    expect(file.headers['x-content-type-options']).toBe('nosniff');
    const actions = t.handle.db
      .select()
      .from(auditLog)
      .all()
      .map((a) => `${a.action}:${a.targetId}`);
    expect(actions).toEqual(expect.arrayContaining([`evidence.upload:${r.id}`, `evidence.download:${r.id}`]));
  });

  it('refuses an executable renamed .pdf with 415 naming what it is, and keeps nothing', async () => {
    const before = { files: uploadedFiles().length, rows: rowCount() };
    const res = await send(engineer, renamedExecutable(), 'test-report');
    expect(res.status).toBe(415);
    expect(res.body.error.message).toContain('application/x-msdownload');
    expect(res.body.error.message).toContain('RF-exposure test report takes PDF');
    expect({ files: uploadedFiles().length, rows: rowCount() }).toEqual(before);
  });

  it('answers 422 for a missing or unknown category and keeps nothing', async () => {
    const before = { files: uploadedFiles().length, rows: rowCount() };
    const res = await engineer.post(`/api/filings/${filingId}/evidence`).attach('file', Buffer.from('%PDF-1.4 unique-422'), 'x.pdf');
    expect(res.status).toBe(422);
    expect(res.body.error.fields.category).toMatch(/Pick a category/);
    const missing = await engineer.post(`/api/filings/${filingId}/evidence`).field('category', 'test-report');
    expect(missing.status).toBe(400);
    expect({ files: uploadedFiles().length, rows: rowCount() }).toEqual(before);
  });

  it('recognises the same content filed twice and points to the first', async () => {
    const bytes = await makePdf([['Probe calibration certificate EX3DV4 SN 7512']]);
    const first = await send(engineer, { mime: 'application/pdf', fileName: 'probe.pdf', bytes }, 'calibration-certificate', { documentDate: '2026-02-01' });
    const second = await send(specialist, { mime: 'application/pdf', fileName: 'probe copy.pdf', bytes }, 'calibration-certificate');
    expect(first.status).toBe(201);
    expect(first.body.record.documentDate).toBe('2026-02-01');
    expect(second.status).toBe(201);
    expect(second.body.duplicateOf).toEqual([first.body.record.id]);
    expect(second.body.notice).toContain(`record ${first.body.record.id}`);
    const list: EvidenceList = (await engineer.get(`/api/filings/${filingId}/evidence`)).body;
    expect(list.records.find((r) => r.id === first.body.record.id)?.duplicateOf).toEqual([second.body.record.id]);
  });

  it('stores a name with path separators, control characters and 300 characters as a display name only', async () => {
    // RFC 7578 §4.2 / RFC 5987: a client sends such a name percent-encoded in filename*.
    const name = `../../etc/\u0007\u202e${'x'.repeat(300)}.pdf`;
    const boundary = 'fieldfile-name';
    const body = Buffer.concat([
      Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="category"\r\n\r\nother\r\n`),
      Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename*=UTF-8''${encodeURIComponent(name)}\r\nContent-Type: application/pdf\r\n\r\n`),
      await makePdf([['odd name']]),
      Buffer.from(`\r\n--${boundary}--\r\n`),
    ]);
    const res = await engineer.post(`/api/filings/${filingId}/evidence`).set('content-type', `multipart/form-data; boundary=${boundary}`).send(body);
    expect(res.status).toBe(201);
    const fileName: string = res.body.record.fileName;
    expect(fileName).not.toMatch(/[/\\\u0000-\u001f\u202e]/);
    expect(fileName).toMatch(/^x+\.pdf$/);
    expect(fileName.length).toBe(200);
    expect(uploadedFiles().some((f) => f.includes('x'))).toBe(false);
  });

  it('answers 400 for a malformed multipart body', async () => {
    const res = await send(engineer, { mime: 'application/pdf', fileName: 'bell\u0007.pdf', bytes: Buffer.from('%PDF-1.4') }, 'other');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/could not be read/);
  });

  it('keeps the replaced file in the version history', async () => {
    const v1 = await send(engineer, { mime: 'application/pdf', fileName: 'label-v1.pdf', bytes: await makePdf([['label v1']]) }, 'label-drawing');
    const v2 = await send(engineer, { mime: 'application/pdf', fileName: 'label-v2.pdf', bytes: await makePdf([['label v2']]) }, 'label-drawing', { replaces: String(v1.body.record.id) });
    expect(v2.status).toBe(201);
    expect(v2.body.record.replacesId).toBe(v1.body.record.id);
    const list: EvidenceList = (await engineer.get(`/api/filings/${filingId}/evidence`)).body;
    expect(list.records.map((r) => r.id)).toContain(v2.body.record.id);
    expect(list.records.map((r) => r.id)).not.toContain(v1.body.record.id);
    expect(list.history.find((r) => r.id === v1.body.record.id)?.replacedById).toBe(v2.body.record.id);
    expect((await engineer.get(`/api/filings/${filingId}/evidence/${v1.body.record.id}/file`)).status).toBe(200);
  });

  it('removes a record, and its bytes once nothing references them', async () => {
    const bytes = await makePdf([['to be removed']]);
    const res = await send(engineer, { mime: 'application/pdf', fileName: 'gone.pdf', bytes }, 'other');
    const sha: string = res.body.record.sha256;
    expect(uploadedFiles()).toContain(sha);
    expect((await approver.delete(`/api/filings/${filingId}/evidence/${res.body.record.id}`)).status).toBe(403);
    expect((await engineer.delete(`/api/filings/${filingId}/evidence/${res.body.record.id}`)).status).toBe(204);
    expect(uploadedFiles()).not.toContain(sha);
    expect((await engineer.get(`/api/filings/${filingId}/evidence/${res.body.record.id}/file`)).status).toBe(404);
  });
});

describe('required categories', () => {
  it('follow the filing: SAR evaluation, hotspot, Canada; present and missing', async () => {
    const id = await newFiling();
    let list: EvidenceList = (await engineer.get(`/api/filings/${id}/evidence`)).body;
    const categories = list.required.map((r) => r.category);
    // LTE Band 12 at 24 dBm, 5 mm from the body, is over the FCC §1.1307(b)(3) SAR exemption.
    expect(categories).toEqual(expect.arrayContaining(['test-report', 'calibration-certificate', 'check-records', 'antenna-drawing', 'user-manual-bilingual', 'tune-up-table']));
    expect(categories).not.toContain('user-manual');
    expect(categories).not.toContain('exemption-analysis');
    expect(list.required.every((r) => !r.present)).toBe(true);
    await send(engineer, all[0], 'antenna-drawing', {}, id);
    list = (await engineer.get(`/api/filings/${id}/evidence`)).body;
    expect(list.required.find((r) => r.category === 'antenna-drawing')).toMatchObject({ present: true, evidenceIds: [expect.any(Number)] });
    expect(list.required.find((r) => r.category === 'test-report')?.present).toBe(false);
  });
});

describe('roles', () => {
  it('engineer and specialist upload; approver and admin read but cannot upload; signed out is 401', async () => {
    const sample = await makePdf([['role matrix']]);
    const pdf = { mime: 'application/pdf', fileName: 'r.pdf', bytes: sample };
    expect((await send(engineer, pdf, 'other')).status).toBe(201);
    expect((await send(specialist, pdf, 'other')).status).toBe(201);
    const refused = await send(approver, pdf, 'other');
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/engineer or specialist/);
    expect((await send(admin, pdf, 'other')).status).toBe(403);
    for (const reader of [approver, admin]) expect((await reader.get(`/api/filings/${filingId}/evidence`)).status).toBe(200);
    const { default: request } = await import('supertest');
    expect((await request(t.app).get(`/api/filings/${filingId}/evidence`)).status).toBe(401);
  });
});

describe('limits and interruptions', () => {
  it('answers 413 over the per-file and per-filing limits and keeps nothing', async () => {
    const small = await createTestApp({ env: { FIELDFILE_EVIDENCE_MAX_FILE_BYTES: '4000', FIELDFILE_EVIDENCE_MAX_FILING_BYTES: '6000' } });
    try {
      await seedUsers(small);
      const spec = await signIn(small, 'specialist@fieldfile.test');
      const id = (await spec.post('/api/filings/import').send(EVIDENCE_DEVICE)).body.filing.id;
      const big = await spec.post(`/api/filings/${id}/evidence`).field('category', 'other').attach('file', Buffer.alloc(5000, 'a'), 'big.txt');
      expect(big.status).toBe(413);
      expect(big.body.error.message).toMatch(/limit/);
      const a = await spec.post(`/api/filings/${id}/evidence`).field('category', 'other').attach('file', Buffer.alloc(3500, 'b'), 'a.txt');
      expect(a.status).toBe(201);
      const b = await spec.post(`/api/filings/${id}/evidence`).field('category', 'other').attach('file', Buffer.alloc(3500, 'c'), 'b.txt');
      expect(b.status).toBe(413);
      expect(b.body.error.message).toMatch(/filing version already holds/);
      const stored = (fs.readdirSync(small.config.uploadsDir, { recursive: true, withFileTypes: true }) as fs.Dirent[]).filter((d) => d.isFile());
      expect(stored.map((d) => d.name)).toEqual([a.body.record.sha256]);
    } finally {
      await small.close();
    }
  });

  it('leaves no file and no row when the upload breaks off', async () => {
    const before = { files: uploadedFiles(), rows: rowCount() };
    const server = http.createServer(t.app).listen(0);
    try {
      const port = (server.address() as AddressInfo).port;
      const cookie = (await engineer.get('/api/auth/me')).request.getHeader?.('cookie') as string | undefined;
      const login = await new Promise<string>((resolve, reject) => {
        const r = http.request({ port, method: 'POST', path: '/api/auth/login', headers: { 'content-type': 'application/json' } }, (res) => {
          res.resume();
          resolve(String(res.headers['set-cookie']?.[0] ?? '').split(';')[0]);
        });
        r.on('error', reject);
        r.end(JSON.stringify({ email: 'engineer@fieldfile.test', password: 'test-password-123' }));
      });
      expect(login || cookie).toBeTruthy();
      const boundary = 'fieldfile-abort';
      const req = http.request({
        port,
        method: 'POST',
        path: `/api/filings/${filingId}/evidence`,
        headers: { cookie: login, 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': '10000000' },
      });
      req.on('error', () => {});
      req.write(
        `--${boundary}\r\nContent-Disposition: form-data; name="category"\r\n\r\nother\r\n--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="half.txt"\r\nContent-Type: text/plain\r\n\r\n`,
      );
      req.write(Buffer.alloc(256 * 1024, 'h'));
      // Wait until the server has started writing the temporary file, then drop the connection.
      const tmp = path.join(t.config.uploadsDir, '.tmp');
      await expect.poll(() => (fs.existsSync(tmp) ? fs.readdirSync(tmp).length : 0), { timeout: 10_000 }).toBeGreaterThan(0);
      req.destroy();
      await expect.poll(() => fs.readdirSync(tmp).length, { timeout: 10_000 }).toBe(0);
      expect({ files: uploadedFiles(), rows: rowCount() }).toEqual(before);
    } finally {
      server.closeAllConnections();
      server.close();
    }
  });
});

describe('versions', () => {
  it('a signed version is frozen: upload and removal are 403, reading still works', async () => {
    const id = await newFiling();
    const res = await send(engineer, all[0], 'other', {}, id);
    const version = t.handle.db.select().from(filingVersions).where(eq(filingVersions.filingId, id)).get()!;
    t.handle.db.update(filingVersions).set({ state: 'signed' }).where(eq(filingVersions.id, version.id)).run();
    const refused = await send(engineer, all[0], 'other', {}, id);
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/signed; its evidence is frozen/);
    expect((await engineer.delete(`/api/filings/${id}/evidence/${res.body.record.id}`)).status).toBe(403);
    expect((await approver.get(`/api/filings/${id}/evidence/${res.body.record.id}/file`)).status).toBe(200);
    const list: EvidenceList = (await engineer.get(`/api/filings/${id}/evidence`)).body;
    expect(list.editable).toBe(false);
  });

  it('a new version carries the evidence forward by reference: same hash, no copy', async () => {
    const id = await newFiling();
    const res = await send(engineer, { mime: 'application/pdf', fileName: 'carry.pdf', bytes: await makePdf([['carried forward']]) }, 'tune-up-table', {}, id);
    const filesBefore = uploadedFiles().length;
    const v1 = t.handle.db.select().from(filingVersions).where(eq(filingVersions.filingId, id)).get()!;
    t.handle.db.transaction((tx) => {
      tx.update(filingVersions).set({ state: 'signed' }).where(eq(filingVersions.id, v1.id)).run();
      const v2 = tx.insert(filingVersions).values({ filingId: id, number: 2 }).returning().get();
      expect(carryEvidenceForward(tx, v1.id, v2.id)).toBe(1);
    });
    const list: EvidenceList = (await engineer.get(`/api/filings/${id}/evidence`)).body;
    expect(list.version.number).toBe(2);
    expect(list.records).toHaveLength(1);
    expect(list.records[0]).toMatchObject({ sha256: res.body.record.sha256, carriedFromVersion: 1, versionNumber: 2 });
    expect(list.records[0].id).not.toBe(res.body.record.id);
    expect(uploadedFiles().length).toBe(filesBefore);
    expect(list.required.find((r) => r.category === 'tune-up-table')?.present).toBe(true);
  });
});
