/**
 * The app with FIELDFILE_STORAGE=s3, against a real S3 API on loopback (s3rver): evidence is
 * uploaded, read back, listed, downloaded and removed, and a package is built with that evidence
 * and downloaded, with every byte in the bucket and none under the data folder.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createHash } from 'node:crypto';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import S3rver from 's3rver';
import JSZip from 'jszip';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { EvidenceList } from '../../constants/schemas/evidence';
import { makePdf } from '../../seeds/documents';
import { EVIDENCE_DEVICE } from './support/evidence-filing';
import { createTestApp, seedUsers, signIn, type TestApp } from './support/test-app';

vi.setConfig({ testTimeout: 120_000, hookTimeout: 60_000 });
const BUCKET = 'fieldfile-app';
const CREDENTIALS = { AWS_ACCESS_KEY_ID: 'S3RVER', AWS_SECRET_ACCESS_KEY: 'S3RVER' };
const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');
const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

let s3dir: string;
let server: S3rver;
let client: S3Client;
let t: TestApp;
let engineer: Awaited<ReturnType<typeof signIn>>;
let filingId: number;
const saved: Record<string, string | undefined> = {};

/** Every key in the bucket, sorted. */
async function bucketKeys(): Promise<string[]> {
  const out = await client.send(new ListObjectsV2Command({ Bucket: BUCKET }));
  return (out.Contents ?? []).map((o) => o.Key!).sort();
}

/** Every file under the app's data folder except the database's. */
function dataFiles(): string[] {
  return (fs.readdirSync(t.config.dataDir, { recursive: true, withFileTypes: true }) as fs.Dirent[])
    .filter((d) => d.isFile() && !d.name.startsWith('fieldfile.db') && d.name !== 'session-secret')
    .map((d) => path.relative(t.config.dataDir, path.join(d.parentPath, d.name)));
}

beforeAll(async () => {
  s3dir = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-s3rver-'));
  server = new S3rver({ address: '127.0.0.1', port: 0, silent: true, directory: s3dir, configureBuckets: [{ name: BUCKET, configs: [] }] });
  const { port } = await server.run();
  const endpoint = `http://127.0.0.1:${port}`;
  client = new S3Client({ endpoint, region: 'us-east-1', forcePathStyle: true, credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' } });
  // The SDK takes credentials from the environment, as in a deployment.
  for (const [k, v] of Object.entries(CREDENTIALS)) {
    saved[k] = process.env[k];
    process.env[k] = v;
  }
  t = await createTestApp({ env: { FIELDFILE_STORAGE: 's3', FIELDFILE_S3_BUCKET: BUCKET, FIELDFILE_S3_ENDPOINT: endpoint, FIELDFILE_S3_PREFIX: 'ff' } });
  await seedUsers(t);
  engineer = await signIn(t, 'engineer@fieldfile.test');
  const specialist = await signIn(t, 'specialist@fieldfile.test');
  const res = await specialist.post('/api/filings/import').send(EVIDENCE_DEVICE);
  expect(res.status).toBe(201);
  filingId = res.body.filing.id;
});

afterAll(async () => {
  await t?.close();
  client?.destroy();
  await server?.close();
  fs.rmSync(s3dir, { recursive: true, force: true });
  for (const [k, v] of Object.entries(saved)) {
    if (v === undefined) delete process.env[k];
    else process.env[k] = v;
  }
});

describe('the app on an S3-compatible bucket', () => {
  let report: Buffer;
  let recordId: number;

  it('stores an upload in the bucket under the uploads prefix, and nothing on local disk', async () => {
    report = await makePdf([['SAR test report for model KH2-LTE'], ['LTE Band 12 maximum tune-up power: 23.5 dBm']]);
    const res = await engineer.post(`/api/filings/${filingId}/evidence`).field('category', 'test-report').attach('file', report, { filename: 'report.pdf', contentType: 'application/pdf' });
    expect(res.status).toBe(201);
    recordId = res.body.record.id;
    const hash = sha256(report);
    expect(res.body.record.sha256).toBe(hash);
    expect(await bucketKeys()).toEqual([`ff/uploads/${hash.slice(0, 2)}/${hash.slice(2, 4)}/${hash}`]);
    expect(dataFiles()).toEqual([]);
  });

  it('reads the report back from the bucket and lists its disagreement', async () => {
    const list = (await engineer.get(`/api/filings/${filingId}/evidence`)).body as EvidenceList;
    expect(list.records.map((r) => r.id)).toEqual([recordId]);
    expect(list.findings.map((f) => f.message)).toContain('Report page 2 gives a tune-up power of 23.5 dBm for Band 12; the filing’s is 24 dBm.');
  });

  it('gives the same bytes back on download', async () => {
    const res = await engineer.get(`/api/filings/${filingId}/evidence/${recordId}/file`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(Buffer.compare(res.body as Buffer, report)).toBe(0);
  });

  it('builds the package into the bucket with the evidence inside, and serves it', async () => {
    const start = await engineer.post(`/api/filings/${filingId}/versions/1/package`);
    expect(start.status).toBe(202);
    await engineer
      .get(`/api/jobs/${start.body.job.id}/events`)
      .buffer(true)
      .parse((res, cb) => {
        res.on('data', () => {});
        res.on('end', () => cb(null, ''));
      });
    const res = await engineer.get(`/api/filings/${filingId}/versions/1/package`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    const zipBytes = res.body as Buffer;
    expect(await bucketKeys()).toContain(`ff/packages/${sha256(zipBytes).slice(0, 2)}/${sha256(zipBytes).slice(2, 4)}/${sha256(zipBytes)}`);
    const zip = await JSZip.loadAsync(zipBytes);
    const inside = Object.keys(zip.files).find((n) => n.endsWith('report.pdf'));
    expect(inside).toBeDefined();
    expect(Buffer.compare(await zip.file(inside!)!.async('nodebuffer'), report)).toBe(0);
    expect(dataFiles()).toEqual([]);
  });

  it('removes the bytes from the bucket when the record goes', async () => {
    expect((await engineer.delete(`/api/filings/${filingId}/evidence/${recordId}`)).status).toBe(204);
    expect((await bucketKeys()).filter((k) => k.startsWith('ff/uploads/'))).toEqual([]);
  });
});

describe('choosing the storage from the environment', () => {
  it('is local disk by default, and S3 needs a bucket', async () => {
    const { loadConfig } = await import('../../server/env');
    expect(loadConfig({ NODE_ENV: 'test' }).storage).toEqual({ kind: 'local' });
    expect(() => loadConfig({ NODE_ENV: 'test', FIELDFILE_STORAGE: 's3' })).toThrow(/FIELDFILE_S3_BUCKET/);
    expect(loadConfig({ NODE_ENV: 'test', FIELDFILE_STORAGE: 's3', FIELDFILE_S3_BUCKET: 'b', FIELDFILE_S3_PREFIX: 'team' }).storage).toEqual({
      kind: 's3',
      bucket: 'b',
      prefix: 'team/',
      region: 'us-east-1',
      endpoint: undefined,
      forcePathStyle: false,
    });
    expect(() => loadConfig({ NODE_ENV: 'test', FIELDFILE_STORAGE: 'ftp' })).toThrow(/FIELDFILE_STORAGE/);
  });
});
