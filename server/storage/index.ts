/** Where the app's bytes live: one ByteStorage per area, built once by createApp(). */
import type { Config } from '../env';
import type { ByteStorage } from './byte-storage';
import { createLocalDiskStorage } from './local-disk';

export * from './byte-storage';
export { createLocalDiskStorage } from './local-disk';

export interface Storages {
  /** Evidence files (FIELDFILE_DATA_DIR/uploads). */
  uploads: ByteStorage;
  /** Built submission packages (FIELDFILE_DATA_DIR/packages). */
  packages: ByteStorage;
}

export function createStorages(config: Config): Storages {
  return { uploads: createLocalDiskStorage(config.uploadsDir), packages: createLocalDiskStorage(config.packagesDir) };
}
