/**
 * The ByteStorage contract, run against both implementations: local disk, and an S3-compatible
 * bucket (a real S3 API served by s3rver on loopback, spoken to by @aws-sdk/client-s3). Content
 * addressing by SHA-256 (FIPS 180-4 test vector for "abc"), atomic puts that leave nothing behind
 * when refused, too large or aborted, and the orphan sweep.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createHash } from 'node:crypto';
import { PassThrough, Readable } from 'node:stream';
import { buffer, text } from 'node:stream/consumers';
import { ListObjectsV2Command, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import S3rver from 's3rver';
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { createLocalDiskStorage, createS3Storage, ObjectNotFoundError, ObjectTooLargeError, type ByteStorage } from '../../server/storage';
import { sweepOrphans } from '../../server/storage/sweep';

// FIPS 180-4 / NIST example: SHA-256("abc").
const ABC_SHA256 = 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad';

/** One storage area of a backend, with a look behind the interface at what it keeps. */
interface Area {
  storage: ByteStorage;
  /** Every object and temporary object the area holds, as "aa/bb/<sha256>" or ".tmp/<name>", sorted. */
  keys(): Promise<string[]>;
  /** Leaves a temporary object behind, as a crashed put would. */
  leaveTemporary(name: string, content: string): Promise<void>;
}

interface Backend {
  name: string;
  setUp(): Promise<void>;
  tearDown(): Promise<void>;
  area(): Promise<Area>;
  cleanUp(): void;
}

/** Every file under dir, relative with "/" separators, sorted. */
function filesUnder(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return (fs.readdirSync(dir, { recursive: true, withFileTypes: true }) as fs.Dirent[])
    .filter((d) => d.isFile())
    .map((d) => path.relative(dir, path.join(d.parentPath, d.name)).split(path.sep).join('/'))
    .sort();
}

function localDisk(): Backend {
  let roots: string[] = [];
  return {
    name: 'local disk',
    setUp: async () => {},
    tearDown: async () => {},
    async area() {
      const root = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-storage-'));
      roots.push(root);
      return {
        storage: createLocalDiskStorage(root),
        keys: async () => filesUnder(root),
        async leaveTemporary(name, content) {
          fs.mkdirSync(path.join(root, '.tmp'), { recursive: true });
          fs.writeFileSync(path.join(root, '.tmp', name), content);
        },
      };
    },
    cleanUp() {
      for (const r of roots) fs.rmSync(r, { recursive: true, force: true });
      roots = [];
    },
  };
}

function s3Bucket(): Backend {
  const bucket = 'fieldfile-test';
  let server: S3rver | undefined;
  let directory = '';
  let client: S3Client | undefined;
  let n = 0;
  return {
    name: 'S3-compatible bucket',
    async setUp() {
      directory = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-s3rver-'));
      server = new S3rver({ address: '127.0.0.1', port: 0, silent: true, directory, configureBuckets: [{ name: bucket, configs: [] }] });
      const { port } = await server.run();
      client = new S3Client({ endpoint: `http://127.0.0.1:${port}`, region: 'us-east-1', forcePathStyle: true, credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' } });
    },
    async tearDown() {
      client?.destroy();
      await server?.close();
      fs.rmSync(directory, { recursive: true, force: true });
    },
    async area() {
      // Each area its own prefix in the one bucket, as uploads and packages are.
      const prefix = `run-${process.pid}/area-${n++}/`;
      const c = client!;
      return {
        storage: createS3Storage({ client: c, bucket, prefix }),
        async keys() {
          const out = await c.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: prefix }));
          return (out.Contents ?? []).map((o) => o.Key!.slice(prefix.length)).sort();
        },
        async leaveTemporary(name, content) {
          await c.send(new PutObjectCommand({ Bucket: bucket, Key: `${prefix}.tmp/${name}`, Body: content }));
        },
      };
    },
    cleanUp() {},
  };
}

const keyOf = (sha256: string) => `${sha256.slice(0, 2)}/${sha256.slice(2, 4)}/${sha256}`;

describe.each([localDisk(), s3Bucket()])('byte storage: $name', (backend) => {
  let area: Area;
  let storage: ByteStorage;
  beforeAll(() => backend.setUp(), 30_000);
  afterAll(() => backend.tearDown());
  beforeEach(async () => {
    area = await backend.area();
    storage = area.storage;
  });
  afterEach(() => backend.cleanUp());

  it('stores a stream under its SHA-256 and gives the same bytes back', async () => {
    const stored = await storage.put(Readable.from([Buffer.from('a'), Buffer.from('bc')]));
    expect(stored).toMatchObject({ sha256: ABC_SHA256, sizeBytes: 3, alreadyStored: false });
    expect(stored.head.toString()).toBe('abc');
    expect(await area.keys()).toEqual([keyOf(ABC_SHA256)]);
    expect(await text(await storage.get(ABC_SHA256))).toBe('abc');
    expect(await storage.exists(ABC_SHA256)).toBe(true);
    expect(await storage.size(ABC_SHA256)).toBe(3);
  });

  it('stores the same content once and says so', async () => {
    await storage.put(Readable.from([Buffer.from('abc')]));
    const again = await storage.put(Readable.from([Buffer.from('abc')]));
    expect(again.alreadyStored).toBe(true);
    expect(await area.keys()).toHaveLength(1);
  });

  it('hashes a multi-megabyte stream like a one-shot hash does, keeping only the head', async () => {
    const chunks = Array.from({ length: 40 }, (_, i) => Buffer.alloc(256 * 1024, i));
    const stored = await storage.put(Readable.from(chunks));
    const expected = createHash('sha256');
    for (const c of chunks) expected.update(c);
    expect(stored.sha256).toBe(expected.digest('hex'));
    expect(stored.sizeBytes).toBe(40 * 256 * 1024);
    expect(stored.head).toHaveLength(4100);
  });

  it('writes every byte in order when it gathers small pieces into larger writes', async () => {
    // Odd sizes, so pieces straddle the 1 MB write size and a remainder is left at the end.
    const chunks = Array.from({ length: 70 }, (_, i) => Buffer.alloc(33_333 + i * 517, i));
    const stored = await storage.put(Readable.from(chunks));
    const got = await buffer(await storage.get(stored.sha256));
    expect(got.equals(Buffer.concat(chunks))).toBe(true);
    expect(stored.sha256).toBe(createHash('sha256').update(got).digest('hex'));
  });

  // A hint for local files; a bucket's stream arrives in the pieces the network delivers.
  it.runIf(backend.name === 'local disk')('reads in the chunk size asked for (the package build reads evidence in large chunks)', async () => {
    const bytes = Buffer.alloc(1 << 20, 7);
    const { sha256 } = await storage.put(Readable.from([bytes]));
    const sizes = async (stream: Readable) => {
      const out: number[] = [];
      for await (const chunk of stream) out.push((chunk as Buffer).length);
      return out;
    };
    expect(await sizes(await storage.get(sha256, { chunkBytes: 256 << 10 }))).toEqual([262144, 262144, 262144, 262144]);
    expect(Math.max(...(await sizes(await storage.get(sha256))))).toBe(64 << 10);
  });

  it('keeps nothing when the stream is longer than maxBytes', async () => {
    await expect(storage.put(Readable.from([Buffer.alloc(600), Buffer.alloc(600)]), { maxBytes: 1000 })).rejects.toBeInstanceOf(ObjectTooLargeError);
    expect(await area.keys()).toEqual([]);
  });

  it('keeps nothing when accept() refuses the content', async () => {
    await expect(
      storage.put(Readable.from([Buffer.from('MZ not a pdf')]), {
        accept: (o) => {
          expect(o.head.subarray(0, 2).toString()).toBe('MZ');
          throw new Error('refused');
        },
      }),
    ).rejects.toThrow('refused');
    expect(await area.keys()).toEqual([]);
    expect(await storage.exists(createHash('sha256').update('MZ not a pdf').digest('hex'))).toBe(false);
  });

  it('keeps nothing when the source breaks off half way', async () => {
    const source = new PassThrough();
    const put = storage.put(source);
    source.write(Buffer.alloc(64 * 1024, 1));
    setTimeout(() => source.destroy(new Error('connection reset')), 20);
    await expect(put).rejects.toThrow();
    expect(await area.keys()).toEqual([]);
  });

  it('keeps nothing when the source closes without ending', async () => {
    const source = new PassThrough();
    const put = storage.put(source);
    source.write(Buffer.alloc(1024, 1));
    setTimeout(() => source.destroy(), 20);
    await expect(put).rejects.toThrow();
    expect(await area.keys()).toEqual([]);
  });

  it('says not found for an unknown or malformed hash, and delete is idempotent', async () => {
    await expect(storage.get('0'.repeat(64))).rejects.toBeInstanceOf(ObjectNotFoundError);
    await expect(storage.get('../../etc/passwd')).rejects.toBeInstanceOf(ObjectNotFoundError);
    expect(await storage.exists('../x')).toBe(false);
    await storage.put(Readable.from([Buffer.from('abc')]));
    await storage.delete(ABC_SHA256);
    await storage.delete(ABC_SHA256);
    expect(await storage.exists(ABC_SHA256)).toBe(false);
  });

  it('sweeps unreferenced objects and stale temporary files, and keeps referenced ones', async () => {
    const kept = await storage.put(Readable.from([Buffer.from('kept')]));
    const orphan = await storage.put(Readable.from([Buffer.from('orphan')]));
    await area.leaveTemporary('left-over', 'half a file');
    const report = await storage.sweepOrphans((h) => h === kept.sha256);
    expect(report).toEqual({ removedObjects: [orphan.sha256], removedTemporaryFiles: 1 });
    expect(await area.keys()).toEqual([keyOf(kept.sha256)]);
  });

  it('leaves young files alone when asked for a minimum age', async () => {
    await storage.put(Readable.from([Buffer.from('just uploaded')]));
    const report = await storage.sweepOrphans(() => false, { minAgeMs: 60_000 });
    expect(report.removedObjects).toEqual([]);
    expect(await area.keys()).toHaveLength(1);
  });

  it('sweeps only the areas that registered their references', async () => {
    const other = await backend.area();
    const packages = other.storage;
    await packages.put(Readable.from([Buffer.from('a package')]));
    const orphan = await storage.put(Readable.from([Buffer.from('orphan upload')]));
    const reports = await sweepOrphans({ uploads: storage, packages }, {} as never, [{ area: 'uploads', referenced: () => [] }]);
    expect(reports.uploads?.removedObjects).toEqual([orphan.sha256]);
    expect(reports.packages).toBeUndefined();
    expect(await other.keys()).toHaveLength(1);
  });
});
