// What npm run backup and npm run restore share: which database and evidence
// folder they work on (DATABASE_URL and STORAGE_DIR, or the local install that
// npm start uses), client credentials in a private option file rather than on
// the command line, and SHA-256 of files.
import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { mkdtemp, readdir, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { loadConfig, type AppConfig } from '../../server/config/env';
import { startLocalMariadb, type LocalInstance } from '../../server/db/local-mariadb';
import { DATA_DIR, ROOT } from './local-config';

export const ARCHIVE_FORMAT = 'whorl-backup';
export const ARCHIVE_VERSION = 1;

export interface BackupManifest {
  format: typeof ARCHIVE_FORMAT;
  version: typeof ARCHIVE_VERSION;
  createdAt: string;
  database: string;
  dump: { file: 'database.sql'; sha256: string; bytes: number };
  /** Null when evidence lives in S3-compatible storage (back that up with the bucket's own tools). */
  evidence: { path: string; sha256: string; bytes: number }[] | null;
}

export interface Connection {
  host: string;
  port: number;
  user: string;
  password: string;
  database: string;
}

export interface Target {
  config: AppConfig;
  connection: Connection;
  /** The evidence objects folder (local storage driver), absolute. */
  objectsDir: string | null;
  /** Stops the local MariaDB when this run started it. */
  release(): Promise<void>;
}

export function parseDatabaseUrl(url: string): Connection {
  const parsed = new URL(url);
  return {
    host: parsed.hostname,
    port: Number(parsed.port || 3306),
    user: decodeURIComponent(parsed.username),
    password: decodeURIComponent(parsed.password),
    database: parsed.pathname.slice(1),
  };
}

/** DATABASE_URL (and DATABASE_OWNER_URL) when set, otherwise the local instance under .data/mariadb (started for the run if it is down). */
export async function resolveTarget(source: Record<string, string | undefined>): Promise<Target> {
  const env = { ...source };
  let local: LocalInstance | undefined;
  if (!env.DATABASE_URL) {
    local = await startLocalMariadb({ dir: path.join(DATA_DIR, 'mariadb'), port: Number(env.DB_PORT ?? 3307), database: 'whorl' });
    env.DATABASE_URL = local.url;
    env.DATABASE_OWNER_URL = local.ownerUrl;
  }
  env.SESSION_SECRET ??= 'x'.repeat(32); // not used: the scripts serve nothing
  const config = loadConfig(env);
  const objectsDir = config.storage.driver === 'local' ? path.resolve(ROOT, config.storage.dir, 'objects') : null;
  return {
    config,
    // The owner account: the application account may not read triggers (a dump
    // without them would restore a trail that accepts UPDATE and DELETE) nor drop tables.
    connection: parseDatabaseUrl(config.databaseOwnerUrl ?? config.databaseUrl),
    objectsDir,
    async release() {
      if (local?.startedHere) await local.stop();
    },
  };
}

/** Runs fn with a 0600 option file holding the credentials (never visible in `ps`), removed afterwards. */
export async function withOptionFile<T>(connection: Connection, fn: (file: string) => Promise<T>): Promise<T> {
  const dir = await mkdtemp(path.join(os.tmpdir(), 'whorl-client-'));
  const file = path.join(dir, 'client.cnf');
  const quote = (value: string) => `"${value.replace(/\\/g, '\\\\').replace(/"/g, '\\"')}"`;
  await writeFile(
    file,
    `[client]\nhost=${connection.host}\nport=${connection.port}\nuser=${quote(connection.user)}\npassword=${quote(connection.password)}\nprotocol=tcp\ndefault-character-set=utf8mb4\n`,
    { mode: 0o600 },
  );
  try {
    return await fn(file);
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

export function sha256File(file: string): Promise<string> {
  return new Promise((resolve, reject) => {
    const hash = createHash('sha256');
    createReadStream(file)
      .on('error', reject)
      .on('data', (chunk) => hash.update(chunk))
      .on('end', () => resolve(hash.digest('hex')));
  });
}

/** Every file below dir, as paths relative to it (skipping in-progress `.part` copies). */
export async function listFiles(dir: string, prefix = ''): Promise<string[]> {
  let entries;
  try {
    entries = await readdir(path.join(dir, prefix), { withFileTypes: true });
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw error;
  }
  const files: string[] = [];
  for (const entry of entries) {
    const relative = path.join(prefix, entry.name);
    if (entry.isDirectory()) files.push(...(await listFiles(dir, relative)));
    else if (entry.isFile() && !entry.name.endsWith('.part')) files.push(relative);
  }
  return files.sort();
}

/** A content-addressed key ends with the file's own SHA-256: a mismatch means a damaged file. */
export function expectedHashOf(relativePath: string): string | null {
  const name = path.basename(relativePath);
  return /^[0-9a-f]{64}$/.test(name) ? name : null;
}
