// Anchors: the trail's head (sequence and hash) written outside MariaDB, to an
// append-only file (one JSON line per anchor) and, when evidence goes to an
// object store, to that store too. Each line carries the MAC of the line before
// it and its own MAC under the trail key, so lines cannot be removed, edited or
// invented unnoticed. Verification compares the chain in the database with every
// anchor of the same chain: a trail rewritten, cut short or emptied no longer
// shows the hashes its anchors recorded.
import { createHmac } from 'node:crypto';
import { mkdirSync, openSync, closeSync, fstatSync, readSync, readFileSync, writeSync, existsSync, writeFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import canonicalize from 'canonicalize';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { AppConfig } from '../config/env';
import { storageFor, type EvidenceStorage } from '../storage';
import { loadTrailKey, setTrailKey, trailKey, trailKeyId } from './trail-key';

export interface TrailAnchor {
  /** The chain's id (trail_settings), so one file can serve several databases. */
  chain: string;
  seq: number;
  hash: string;
  at: string;
  /** Why it was written: daily, signature, verification, start. */
  reason: string;
  keyId: string;
  /** MAC of the previous line of the file ("" for the first). */
  prev: string;
  mac: string;
}

let anchorFile: string | null = null;
let objectStore: EvidenceStorage | null = null;
let queue: Promise<unknown> = Promise.resolve();

/** Sets the key and where anchors go; every process that writes or checks the trail calls it once. */
export function configureTrail(config: AppConfig): void {
  setTrailKey(loadTrailKey(config));
  anchorFile = path.resolve(config.trail.anchorFile);
  objectStore = config.storage.driver === 's3' ? storageFor(config) : null;
}

export function anchorFilePath(): string | null {
  return anchorFile;
}

const GENESIS = '';

function macOf(key: Buffer, line: Omit<TrailAnchor, 'mac'>): string {
  return createHmac('sha256', key).update(canonicalize(line)!).digest('hex');
}

/** The last complete line of the file (read from its end, so the file may grow without limit). */
function lastLine(file: string): string | null {
  if (!existsSync(file)) return null;
  const fd = openSync(file, 'r');
  try {
    const size = fstatSync(fd).size;
    const length = Math.min(size, 16_384);
    const buffer = Buffer.alloc(length);
    readSync(fd, buffer, 0, length, size - length);
    const lines = buffer.toString('utf8').split('\n').filter((line) => line.trim());
    return lines.length ? lines[lines.length - 1] : null;
  } finally {
    closeSync(fd);
  }
}

export interface ChainIdentity {
  chainId: string;
  keyedFromSeq: number;
}

export async function chainIdentity(sequelize: Sequelize): Promise<ChainIdentity> {
  const [row] = await sequelize.query<{ chain_id: string; keyed_from_seq: number | string }>(
    'SELECT chain_id, keyed_from_seq FROM trail_settings WHERE id = 1',
    { type: QueryTypes.SELECT },
  );
  if (!row) throw new Error('trail_settings row is missing: run the migrations');
  return { chainId: row.chain_id, keyedFromSeq: Number(row.keyed_from_seq) };
}

/**
 * Writes the current head as an anchor. Safe to call after any commit (a
 * signature, the daily job); anchors are written one at a time per process.
 */
export function writeTrailAnchor(sequelize: Sequelize, reason: string): Promise<TrailAnchor> {
  const run = queue.then(async () => {
    if (!anchorFile) throw new Error('Trail anchors are not configured: call configureTrail(config)');
    const key = trailKey();
    const { chainId } = await chainIdentity(sequelize);
    const [head] = await sequelize.query<{ seq: number | string; hash: string }>('SELECT seq, hash FROM trail_head WHERE id = 1', {
      type: QueryTypes.SELECT,
    });
    const file = anchorFile;
    mkdirSync(path.dirname(file), { recursive: true });
    // Several app servers on one host may share the file: read the last line and append under one lock.
    const { anchor, line } = await withFileLock(file, async () => {
      const previous = lastLine(file);
      const prev = previous ? (JSON.parse(previous) as TrailAnchor).mac : GENESIS;
      const body = { chain: chainId, seq: Number(head.seq), hash: head.hash, at: new Date().toISOString(), reason, keyId: trailKeyId(key), prev };
      const written: TrailAnchor = { ...body, mac: macOf(key, body) };
      const text = `${JSON.stringify(written)}\n`;
      const fd = openSync(file, 'a', 0o600);
      try {
        writeSync(fd, text);
      } finally {
        closeSync(fd);
      }
      return { anchor: written, line: text };
    });
    if (objectStore) await copyToObjectStore(objectStore, anchor, line);
    return anchor;
  });
  queue = run.catch(() => undefined);
  return run;
}

/** An exclusive lock file beside the log (O_EXCL); one left by a process that died is taken over after 10 s. */
async function withFileLock<T>(file: string, fn: () => Promise<T>): Promise<T> {
  const lock = `${file}.lock`;
  const deadline = Date.now() + 5_000;
  for (;;) {
    try {
      closeSync(openSync(lock, 'wx', 0o600));
      break;
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
      try {
        if (Date.now() - statSync(lock).mtimeMs > 10_000) rmSync(lock, { force: true });
      } catch {
        /* released meanwhile */
      }
      if (Date.now() > deadline) throw new Error(`The anchor log ${file} stays locked (${lock})`);
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
  }
  try {
    return await fn();
  } finally {
    rmSync(lock, { force: true });
  }
}

/** Objects are never overwritten, so the store keeps every anchor as written. */
async function copyToObjectStore(store: EvidenceStorage, anchor: TrailAnchor, line: string): Promise<void> {
  const temp = path.join(tmpdir(), `whorl-anchor-${process.pid}-${anchor.mac.slice(0, 16)}.json`);
  writeFileSync(temp, line);
  try {
    await store.putFile(`trail-anchors/${anchor.chain}/${String(anchor.seq).padStart(12, '0')}-${anchor.mac.slice(0, 16)}.json`, temp, 'application/json');
  } finally {
    rmSync(temp, { force: true });
  }
}

export interface AnchorLog {
  /** This chain's anchors, in file order. */
  anchors: TrailAnchor[];
  /** Words for the first defect of the file itself (a line removed, edited or invented), or null. */
  problem: string | null;
  /** True when this chain's anchors were written with another key than the one configured. */
  otherKey: boolean;
}

export function readTrailAnchors(chainId: string): AnchorLog {
  const empty: AnchorLog = { anchors: [], problem: null, otherKey: false };
  if (!anchorFile || !existsSync(anchorFile)) return empty;
  const key = trailKey();
  const keyId = trailKeyId(key);
  const anchors: TrailAnchor[] = [];
  let problem: string | null = null;
  let otherKey = false;
  let prev = GENESIS;
  const lines = readFileSync(anchorFile, 'utf8').split('\n');
  lines.forEach((text, index) => {
    if (!text.trim()) return;
    let anchor: TrailAnchor;
    try {
      anchor = JSON.parse(text) as TrailAnchor;
    } catch {
      problem ??= `Line ${index + 1} of the anchor log is not a readable anchor.`;
      return;
    }
    if (anchor.prev !== prev) problem ??= `The anchor log does not follow on at line ${index + 1}: a line before it was removed or changed.`;
    prev = anchor.mac;
    if (anchor.chain !== chainId) return;
    if (anchor.keyId !== keyId) {
      otherKey = true;
      return;
    }
    const { mac, ...body } = anchor;
    if (macOf(key, body) !== mac) {
      problem ??= `Line ${index + 1} of the anchor log does not match its signature: it was edited or invented.`;
      return;
    }
    anchors.push(anchor);
  });
  return { anchors, problem, otherKey };
}
