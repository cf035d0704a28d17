// Secrets and paths of a local run, kept under .data/ (git-ignored).
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import path from 'node:path';

export const ROOT = path.resolve(import.meta.dirname, '../..');
export const DATA_DIR = path.join(ROOT, '.data');

/** A session secret generated once per checkout, unless SESSION_SECRET is given. */
export function localSessionSecret(): string {
  mkdirSync(DATA_DIR, { recursive: true });
  const file = path.join(DATA_DIR, 'session-secret');
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('base64url'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}
