/**
 * ByteStorage on the local disk: `<root>/<aa>/<bb>/<sha256>`. A put streams into
 * `<root>/.tmp/<random>` while hashing, fsyncs, then renames into place (rename within one
 * file system is atomic), so a reader never sees half a file and an aborted stream leaves only a
 * temporary file that is removed at once (or by the next sweep).
 */
import fs from 'node:fs';
import fsp from 'node:fs/promises';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import type { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { Meter } from './meter';
import { ObjectNotFoundError, isSha256, type ByteStorage, type PutOptions, type StoredObject, type SweepReport } from './byte-storage';

const TMP = '.tmp';
/**
 * What a put may hold ahead of the disk. With the stream default (16 KB) the source pauses after
 * every chunk until its write is done, so hashing and producing the next chunk cannot overlap a
 * write; 2 MB lets them run while a write is in flight (a package of a gigabyte is mostly
 * writes). 4 MB held more memory for no gain the shared machine could measure.
 */
const WRITE_BUFFER_BYTES = 2 << 20;

export function createLocalDiskStorage(root: string): ByteStorage {
  const tmpDir = path.join(root, TMP);
  const objectPath = (sha256: string) => {
    if (!isSha256(sha256)) throw new ObjectNotFoundError(sha256);
    return path.join(root, sha256.slice(0, 2), sha256.slice(2, 4), sha256);
  };
  const statOf = async (sha256: string) => {
    try {
      return await fsp.stat(objectPath(sha256));
    } catch {
      return undefined;
    }
  };

  return {
    async put(source: Readable, options: PutOptions = {}): Promise<StoredObject> {
      await fsp.mkdir(tmpDir, { recursive: true });
      const tmp = path.join(tmpDir, `${Date.now()}-${randomBytes(8).toString('hex')}`);
      const meter = new Meter(options.maxBytes ?? Number.POSITIVE_INFINITY);
      try {
        const out = fs.createWriteStream(tmp, { flags: 'wx', mode: 0o640, highWaterMark: WRITE_BUFFER_BYTES });
        // A source that closes without ending (a dropped connection) must fail the put, not hang.
        await pipeline(source, meter, out);
        const handle = await fsp.open(tmp, 'r');
        try {
          await handle.sync();
        } finally {
          await handle.close();
        }
        const object = { sha256: meter.hash.digest('hex'), sizeBytes: meter.sizeBytes, head: meter.head() };
        await options.accept?.(object);
        const target = objectPath(object.sha256);
        const alreadyStored = (await statOf(object.sha256)) !== undefined;
        if (alreadyStored) {
          await fsp.rm(tmp, { force: true });
        } else {
          await fsp.mkdir(path.dirname(target), { recursive: true });
          await fsp.rename(tmp, target);
        }
        return { ...object, alreadyStored };
      } catch (err) {
        source.destroy();
        await fsp.rm(tmp, { force: true });
        throw err;
      }
    },

    async get(sha256, options = {}) {
      const file = objectPath(sha256);
      try {
        const handle = await fsp.open(file, 'r');
        return handle.createReadStream(options.chunkBytes ? { highWaterMark: options.chunkBytes } : {});
      } catch {
        throw new ObjectNotFoundError(sha256);
      }
    },

    async exists(sha256) {
      return isSha256(sha256) && (await statOf(sha256)) !== undefined;
    },

    async size(sha256) {
      if (!isSha256(sha256)) return undefined;
      return (await statOf(sha256))?.size;
    },

    async delete(sha256) {
      if (!isSha256(sha256)) return;
      await fsp.rm(objectPath(sha256), { force: true });
    },

    async sweepOrphans(isReferenced, { minAgeMs = 0 } = {}): Promise<SweepReport> {
      const report: SweepReport = { removedObjects: [], removedTemporaryFiles: 0 };
      const cutoff = Date.now() - minAgeMs;
      const oldEnough = async (file: string) => minAgeMs <= 0 || ((await fsp.stat(file).catch(() => undefined))?.mtimeMs ?? Infinity) <= cutoff;
      for (const name of await fsp.readdir(tmpDir).catch(() => [] as string[])) {
        const file = path.join(tmpDir, name);
        if (await oldEnough(file)) {
          await fsp.rm(file, { force: true });
          report.removedTemporaryFiles++;
        }
      }
      const level = async (dir: string) => (await fsp.readdir(dir, { withFileTypes: true }).catch(() => [])).filter((d) => d.name !== TMP);
      for (const a of await level(root)) {
        if (!a.isDirectory()) continue;
        for (const b of await level(path.join(root, a.name))) {
          if (!b.isDirectory()) continue;
          for (const f of await level(path.join(root, a.name, b.name))) {
            if (!isSha256(f.name) || isReferenced(f.name)) continue;
            const file = path.join(root, a.name, b.name, f.name);
            if (!(await oldEnough(file))) continue;
            await fsp.rm(file, { force: true });
            report.removedObjects.push(f.name);
          }
        }
      }
      return report;
    },
  };
}
