// A multer 2 storage engine that writes each upload to a temporary folder and
// computes its SHA-256 while writing, so the hash costs no second read. The
// file stays in the temporary folder until its evidence row commits.
import { createHash, randomUUID } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { mkdir, unlink } from 'node:fs/promises';
import path from 'node:path';
import { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Request } from 'express';
import type { StorageEngine } from 'multer';

export interface HashedFile {
  /** The random name inside the temporary folder. */
  tempName: string;
  path: string;
  size: number;
  sha256: string;
}

export type HashedUpload = Express.Multer.File & HashedFile;

export function createHashingDiskEngine(tempDir: string): StorageEngine {
  // Writes still in progress, so a removal during an abort waits for the descriptor to close.
  const writing = new WeakMap<object, Promise<unknown>>();

  return {
    _handleFile(_req: Request, file: Express.Multer.File, callback: (error?: unknown, info?: Partial<HashedFile>) => void) {
      const tempName = `${randomUUID()}.upload`;
      const filePath = path.join(tempDir, tempName);
      // Known before the first byte is written: multer's abort cleanup removes files by path.
      file.path = filePath;
      const hash = createHash('sha256');
      let size = 0;
      const hasher = new Transform({
        transform(chunk: Buffer, _encoding, next) {
          hash.update(chunk);
          size += chunk.length;
          next(null, chunk);
        },
      });
      const work = mkdir(tempDir, { recursive: true }).then(() =>
        pipeline(file.stream, hasher, createWriteStream(filePath, { flags: 'wx', mode: 0o600 })),
      );
      writing.set(file, work.catch(() => undefined));
      work.then(
        () => callback(null, { tempName, path: filePath, size, sha256: hash.digest('hex') }),
        (error) => {
          void unlink(filePath).catch(() => undefined);
          callback(error);
        },
      );
    },
    _removeFile(_req: Request, file: Express.Multer.File, callback: (error: Error | null) => void) {
      const pending = writing.get(file) ?? Promise.resolve();
      void pending
        .then(() => (file.path ? unlink(file.path) : undefined))
        .then(
          () => callback(null),
          (error: NodeJS.ErrnoException) => callback(error.code === 'ENOENT' ? null : error),
        );
    },
  };
}
