// The default driver: files under STORAGE_DIR, read-only once written.
import { constants, createReadStream } from 'node:fs';
import { randomUUID } from 'node:crypto';
import { chmod, copyFile, link, mkdir, stat, unlink } from 'node:fs/promises';
import path from 'node:path';
import type { Readable } from 'node:stream';
import type { EvidenceStorage } from './storage';

export function createLocalStorage(rootDir: string): EvidenceStorage {
  const root = path.resolve(rootDir);
  const resolve = (key: string) => {
    const full = path.resolve(root, key);
    if (!full.startsWith(root + path.sep)) throw new Error(`Storage key escapes the storage folder: ${key}`);
    return full;
  };
  const exists = async (key: string) => {
    try {
      return (await stat(resolve(key))).isFile();
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') return false;
      throw error;
    }
  };
  return {
    name: 'local',
    exists,
    async putFile(key, filePath) {
      const target = resolve(key);
      await mkdir(path.dirname(target), { recursive: true });
      // Copy beside the target, then link it into place: link() is atomic and
      // refuses an existing name, so a reader never sees half a file and nothing is overwritten.
      const part = `${target}.${randomUUID()}.part`;
      await copyFile(filePath, part, constants.COPYFILE_EXCL);
      try {
        await chmod(part, 0o444);
        await link(part, target);
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
      } finally {
        await unlink(part).catch(() => undefined);
      }
    },
    async read(key): Promise<Readable | null> {
      if (!(await exists(key))) return null;
      return createReadStream(resolve(key));
    },
  };
}
