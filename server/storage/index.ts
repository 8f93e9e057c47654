/** Where the app's bytes live: one ByteStorage per area, built once by createApp(). */
import type { Config } from '../env';
import type { ByteStorage } from './byte-storage';
import { S3Client } from '@aws-sdk/client-s3';
import { createLocalDiskStorage } from './local-disk';
import { createS3Storage } from './s3';

export * from './byte-storage';
export { createLocalDiskStorage } from './local-disk';
export { createS3Storage } from './s3';

export interface Storages {
  /** Evidence files (FIELDFILE_DATA_DIR/uploads). */
  uploads: ByteStorage;
  /** Built submission packages (FIELDFILE_DATA_DIR/packages). */
  packages: ByteStorage;
}

/** The storages config.storage names (FIELDFILE_STORAGE): local disk, or one S3-compatible bucket with a prefix per area. */
export function createStorages(config: Config): Storages {
  const s = config.storage;
  if (s.kind === 'local') return { uploads: createLocalDiskStorage(config.uploadsDir), packages: createLocalDiskStorage(config.packagesDir) };
  const client = new S3Client({ region: s.region, endpoint: s.endpoint, forcePathStyle: s.forcePathStyle });
  return {
    uploads: createS3Storage({ client, bucket: s.bucket, prefix: `${s.prefix}uploads/` }),
    packages: createS3Storage({ client, bucket: s.bucket, prefix: `${s.prefix}packages/` }),
  };
}
