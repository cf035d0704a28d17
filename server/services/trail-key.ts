// The trail's HMAC key, kept outside the database: TRAIL_HMAC_KEY, or a file
// (TRAIL_KEY_FILE, `.data/trail-key` by default) generated on first use with
// mode 0600. Someone who can write to the database but does not hold the key
// cannot compute a valid hash for a changed or invented entry.
import { createHmac, randomBytes } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import type { AppConfig } from '../config/env';

let activeKey: Buffer | null = null;

/** The key from the configuration, or from the key file (created when missing; two processes racing read the winner's). */
export function loadTrailKey(config: Pick<AppConfig, 'trail'>): Buffer {
  if (config.trail.hmacKey) return Buffer.from(config.trail.hmacKey, 'utf8');
  const file = path.resolve(config.trail.keyFile);
  mkdirSync(path.dirname(file), { recursive: true });
  try {
    writeFileSync(file, randomBytes(32).toString('base64url'), { flag: 'wx', mode: 0o600 });
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
  }
  const text = readFileSync(file, 'utf8').trim();
  if (text.length < 32) throw new Error(`The trail key in ${file} is shorter than 32 characters`);
  return Buffer.from(text, 'utf8');
}

export function setTrailKey(key: Buffer): void {
  activeKey = key;
}

export function trailKey(): Buffer {
  if (!activeKey) throw new Error('The trail key is not configured: call configureTrail(config) before writing or checking the trail');
  return activeKey;
}

/** A short public fingerprint of a key: anchors carry it, so a wrong key reads as such and not as tampering. */
export function trailKeyId(key: Buffer = trailKey()): string {
  return createHmac('sha256', key).update('whorl trail key id').digest('hex').slice(0, 16);
}
