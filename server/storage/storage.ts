// Where evidence bytes live. Keys are content-addressed (sha256/ab/cd/<hash>),
// so an object once written is never overwritten: writing the same content
// again is a no-op, and nothing here deletes a stored object.
import type { Readable } from 'node:stream';

export interface EvidenceStorage {
  readonly name: 'local' | 's3';
  /** Copies a finished temporary file to `key`; does nothing when the key already exists. */
  putFile(key: string, filePath: string, mediaType: string): Promise<void>;
  /** The stored bytes, or null when nothing is stored under `key`. */
  read(key: string): Promise<Readable | null>;
  exists(key: string): Promise<boolean>;
}

export function contentKey(sha256: string): string {
  if (!/^[0-9a-f]{64}$/.test(sha256)) throw new TypeError('contentKey needs a lowercase hex SHA-256');
  return `sha256/${sha256.slice(0, 2)}/${sha256.slice(2, 4)}/${sha256}`;
}
