import type { AppConfig } from '../../config';
import { DiskStorage } from './disk-storage';
import type { ObjectStorage } from './object-storage';
import { S3Storage } from './s3-storage';

/** The storage the configuration asks for: local disk by default, S3-compatible when STORAGE_DRIVER=s3. */
export function createStorage(uploads: AppConfig['uploads']): ObjectStorage {
  if (uploads.driver === 's3') {
    if (!uploads.s3) throw new Error('Storage: STORAGE_DRIVER=s3 needs S3_BUCKET (and S3_ENDPOINT, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY).');
    return new S3Storage(uploads.s3);
  }
  return new DiskStorage(uploads.dir);
}
