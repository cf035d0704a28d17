// Picks the evidence storage driver from the configuration, once per configuration.
import path from 'node:path';
import type { AppConfig } from '../config/env';
import { createLocalStorage } from './local-storage';
import { createS3Storage } from './s3-storage';
import type { EvidenceStorage } from './storage';

export type { EvidenceStorage } from './storage';
export { contentKey } from './storage';

const drivers = new WeakMap<AppConfig, EvidenceStorage>();

export function storageFor(config: AppConfig): EvidenceStorage {
  let storage = drivers.get(config);
  if (!storage) {
    if (config.storage.driver === 's3') {
      const { bucket, region, endpoint, accessKeyId, secretAccessKey } = config.storage.s3;
      if (!bucket) throw new Error('STORAGE_DRIVER=s3 needs S3_BUCKET');
      storage = createS3Storage({ bucket, region, endpoint, accessKeyId, secretAccessKey });
    } else {
      storage = createLocalStorage(path.join(config.storage.dir, 'objects'));
    }
    drivers.set(config, storage);
  }
  return storage;
}

/** Uploads land here first (always on local disk), and move to storage once their row commits. */
export function uploadTempDir(config: AppConfig): string {
  return path.resolve(config.storage.dir, 'tmp');
}
