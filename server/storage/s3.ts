/**
 * ByteStorage in an S3-compatible bucket (@aws-sdk/client-s3), for when several app servers
 * share the bytes. Objects live at `<prefix><aa>/<bb>/<sha256>`. S3 has no rename, so a put
 * streams into `<prefix>.tmp/<time>-<random>` (a multipart upload, a few parts in memory at a
 * time) while hashing, then copies that object under its hash and deletes the temporary one: a
 * reader never sees half an object, and an aborted stream leaves at most a temporary object that
 * is removed at once (or by the next sweep, which reads the objects' LastModified).
 */
import { randomBytes } from 'node:crypto';
import { Readable } from 'node:stream';
import { finished } from 'node:stream/promises';
import { CopyObjectCommand, DeleteObjectCommand, GetObjectCommand, HeadObjectCommand, ListObjectsV2Command, type S3Client } from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import { Meter } from './meter';
import { ObjectNotFoundError, isSha256, type ByteStorage, type PutOptions, type StoredObject, type SweepReport } from './byte-storage';

export interface S3StorageOptions {
  client: S3Client;
  bucket: string;
  /** Key prefix of this area, ending in "/" (e.g. "fieldfile/uploads/"). */
  prefix: string;
  /** Multipart part size (S3's minimum, 5 MB, by default); two parts are in flight at a time. */
  partSizeBytes?: number;
}

const TMP = '.tmp/';

const isNotFound = (err: unknown) => {
  const e = err as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e?.name === 'NotFound' || e?.name === 'NoSuchKey' || e?.$metadata?.httpStatusCode === 404;
};

export function createS3Storage({ client, bucket, prefix, partSizeBytes = 5 * 1024 * 1024 }: S3StorageOptions): ByteStorage {
  const keyOf = (sha256: string) => {
    if (!isSha256(sha256)) throw new ObjectNotFoundError(sha256);
    return `${prefix}${sha256.slice(0, 2)}/${sha256.slice(2, 4)}/${sha256}`;
  };
  const head = async (key: string) => {
    try {
      return await client.send(new HeadObjectCommand({ Bucket: bucket, Key: key }));
    } catch (err) {
      if (isNotFound(err)) return undefined;
      throw err;
    }
  };
  const remove = (key: string) => client.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));

  return {
    async put(source: Readable, options: PutOptions = {}): Promise<StoredObject> {
      const tmpKey = `${prefix}${TMP}${Date.now()}-${randomBytes(8).toString('hex')}`;
      const meter = new Meter(options.maxBytes ?? Number.POSITIVE_INFINITY);
      let meterError: unknown;
      meter.once('error', (err) => (meterError = err));
      // A source that errors or closes without ending (a dropped connection) fails the meter,
      // and with it the upload, instead of leaving it waiting.
      finished(source).catch((err: unknown) => meter.destroy(err as Error));
      source.pipe(meter);
      const upload = new Upload({ client, params: { Bucket: bucket, Key: tmpKey, Body: meter }, queueSize: 2, partSize: partSizeBytes, leavePartsOnError: false });
      let uploaded = false;
      try {
        try {
          await upload.done();
          uploaded = true;
        } catch (err) {
          throw meterError ?? err;
        }
        const object = { sha256: meter.hash.digest('hex'), sizeBytes: meter.sizeBytes, head: meter.head() };
        await options.accept?.(object);
        const target = keyOf(object.sha256);
        const alreadyStored = (await head(target)) !== undefined;
        if (!alreadyStored) {
          await client.send(new CopyObjectCommand({ Bucket: bucket, Key: target, CopySource: `${bucket}/${tmpKey.split('/').map(encodeURIComponent).join('/')}` }));
        }
        await remove(tmpKey);
        return { ...object, alreadyStored };
      } catch (err) {
        source.destroy();
        meter.destroy();
        if (uploaded) await remove(tmpKey).catch(() => undefined);
        else await upload.abort().catch(() => undefined);
        throw err;
      }
    },

    async get(sha256) {
      try {
        const out = await client.send(new GetObjectCommand({ Bucket: bucket, Key: keyOf(sha256) }));
        return out.Body as Readable;
      } catch (err) {
        if (isNotFound(err) || err instanceof ObjectNotFoundError) throw new ObjectNotFoundError(sha256);
        throw err;
      }
    },

    async exists(sha256) {
      return isSha256(sha256) && (await head(keyOf(sha256))) !== undefined;
    },

    async size(sha256) {
      if (!isSha256(sha256)) return undefined;
      return (await head(keyOf(sha256)))?.ContentLength;
    },

    async delete(sha256) {
      if (!isSha256(sha256)) return;
      await remove(keyOf(sha256));
    },

    async sweepOrphans(isReferenced, { minAgeMs = 0 } = {}): Promise<SweepReport> {
      const report: SweepReport = { removedObjects: [], removedTemporaryFiles: 0 };
      const cutoff = Date.now() - minAgeMs;
      const oldEnough = (modified: Date | undefined) => minAgeMs <= 0 || (modified?.getTime() ?? Infinity) <= cutoff;
      let token: string | undefined;
      do {
        const page = await client.send(new ListObjectsV2Command({ Bucket: bucket, Prefix: prefix, ContinuationToken: token }));
        for (const o of page.Contents ?? []) {
          const key = o.Key ?? '';
          const rest = key.slice(prefix.length);
          if (rest.startsWith(TMP)) {
            if (!oldEnough(o.LastModified)) continue;
            await remove(key);
            report.removedTemporaryFiles++;
            continue;
          }
          const name = rest.split('/').pop() ?? '';
          if (!isSha256(name) || rest !== `${name.slice(0, 2)}/${name.slice(2, 4)}/${name}` || isReferenced(name) || !oldEnough(o.LastModified)) continue;
          await remove(key);
          report.removedObjects.push(name);
        }
        token = page.IsTruncated ? page.NextContinuationToken : undefined;
      } while (token);
      return report;
    },
  };
}
