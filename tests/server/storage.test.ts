/**
 * The local-disk ByteStorage: content addressing by SHA-256 (FIPS 180-4 test vector for "abc"),
 * atomic puts that leave nothing behind when refused, too large or aborted, and the orphan sweep.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createHash } from 'node:crypto';
import { PassThrough, Readable } from 'node:stream';
import { text } from 'node:stream/consumers';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { createLocalDiskStorage, ObjectNotFoundError, ObjectTooLargeError, type ByteStorage } from '../../server/storage';
import { sweepOrphans } from '../../server/storage/sweep';

// FIPS 180-4 / NIST example: SHA-256("abc").
const ABC_SHA256 = 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad';

let root: string;
let storage: ByteStorage;

/** Every file under root, relative, sorted. */
function filesUnder(dir: string): string[] {
  return (fs.readdirSync(dir, { recursive: true, withFileTypes: true }) as fs.Dirent[])
    .filter((d) => d.isFile())
    .map((d) => path.relative(dir, path.join(d.parentPath, d.name)))
    .sort();
}

beforeEach(() => {
  root = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-storage-'));
  storage = createLocalDiskStorage(root);
});
afterEach(() => fs.rmSync(root, { recursive: true, force: true }));

describe('local-disk byte storage', () => {
  it('stores a stream under its SHA-256 and gives the same bytes back', async () => {
    const stored = await storage.put(Readable.from([Buffer.from('a'), Buffer.from('bc')]));
    expect(stored).toMatchObject({ sha256: ABC_SHA256, sizeBytes: 3, alreadyStored: false });
    expect(stored.head.toString()).toBe('abc');
    expect(filesUnder(root)).toEqual([path.join('ba', '78', ABC_SHA256)]);
    expect(await text(await storage.get(ABC_SHA256))).toBe('abc');
    expect(await storage.exists(ABC_SHA256)).toBe(true);
    expect(await storage.size(ABC_SHA256)).toBe(3);
  });

  it('stores the same content once and says so', async () => {
    await storage.put(Readable.from([Buffer.from('abc')]));
    const again = await storage.put(Readable.from([Buffer.from('abc')]));
    expect(again.alreadyStored).toBe(true);
    expect(filesUnder(root)).toHaveLength(1);
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

  it('reads in the chunk size asked for (the package build reads evidence in large chunks)', async () => {
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
    expect(filesUnder(root)).toEqual([]);
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
    expect(filesUnder(root)).toEqual([]);
    expect(await storage.exists(createHash('sha256').update('MZ not a pdf').digest('hex'))).toBe(false);
  });

  it('keeps nothing when the source breaks off half way', async () => {
    const source = new PassThrough();
    const put = storage.put(source);
    source.write(Buffer.alloc(64 * 1024, 1));
    setTimeout(() => source.destroy(new Error('connection reset')), 20);
    await expect(put).rejects.toThrow();
    expect(filesUnder(root)).toEqual([]);
  });

  it('keeps nothing when the source closes without ending', async () => {
    const source = new PassThrough();
    const put = storage.put(source);
    source.write(Buffer.alloc(1024, 1));
    setTimeout(() => source.destroy(), 20);
    await expect(put).rejects.toThrow();
    expect(filesUnder(root)).toEqual([]);
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
    fs.mkdirSync(path.join(root, '.tmp'), { recursive: true });
    fs.writeFileSync(path.join(root, '.tmp', 'left-over'), 'half a file');
    const report = await storage.sweepOrphans((h) => h === kept.sha256);
    expect(report).toEqual({ removedObjects: [orphan.sha256], removedTemporaryFiles: 1 });
    expect(filesUnder(root)).toEqual([path.join(kept.sha256.slice(0, 2), kept.sha256.slice(2, 4), kept.sha256)]);
  });

  it('leaves young files alone when asked for a minimum age', async () => {
    await storage.put(Readable.from([Buffer.from('just uploaded')]));
    const report = await storage.sweepOrphans(() => false, { minAgeMs: 60_000 });
    expect(report.removedObjects).toEqual([]);
    expect(filesUnder(root)).toHaveLength(1);
  });

  it('sweeps only the areas that registered their references', async () => {
    const packagesRoot = fs.mkdtempSync(path.join(os.tmpdir(), 'fieldfile-packages-'));
    try {
      const packages = createLocalDiskStorage(packagesRoot);
      await packages.put(Readable.from([Buffer.from('a package')]));
      const orphan = await storage.put(Readable.from([Buffer.from('orphan upload')]));
      const reports = await sweepOrphans({ uploads: storage, packages }, {} as never, [{ area: 'uploads', referenced: () => [] }]);
      expect(reports.uploads?.removedObjects).toEqual([orphan.sha256]);
      expect(reports.packages).toBeUndefined();
      expect(filesUnder(packagesRoot)).toHaveLength(1);
    } finally {
      fs.rmSync(packagesRoot, { recursive: true, force: true });
    }
  });
});
