// The tamper-evident trail. Each entry's hash is an HMAC-SHA-256, under a key
// kept outside the database (trail-key.ts), of the previous entry's hash and the
// entry's canonical JSON (RFC 8785): changing or removing any entry breaks every
// hash after it, and without the key nobody can re-chain what follows. Entries
// written before the key existed keep their plain SHA-256 (trail_settings says
// from which sequence the key applies). Writers lock the single chain-head row,
// which gives consecutive sequence numbers under concurrency. Verification also
// compares the chain with its anchors outside the database (trail-anchors.ts).
import { createHash, createHmac } from 'node:crypto';
import canonicalize from 'canonicalize';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { TrailEntry, type TrailChanges } from '../models';
import { trailKey } from './trail-key';
import { chainIdentity, readTrailAnchors, type TrailAnchor } from './trail-anchors';

export interface TrailInput {
  userId: number | null;
  recordType: string;
  recordId: string | number;
  event: string;
  changes?: TrailChanges;
  at?: Date;
}

interface HashableEntry {
  seq: number;
  at: Date;
  userId: number | null;
  recordType: string;
  recordId: string;
  event: string;
  changes: TrailChanges;
  prevHash: string;
}

/**
 * The entry's canonical JSON (RFC 8785): keys in sorted order, strings and
 * numbers as JSON.stringify writes them. The fixed fields are written directly
 * and only `changes` goes through canonicalize: the same bytes as
 * canonicalize(wholeEntry), at a third of the cost (verification hashes every entry).
 */
export function canonicalEntry(entry: Omit<HashableEntry, 'prevHash'>): string {
  return (
    `{"at":${JSON.stringify(entry.at.toISOString())}` +
    `,"changes":${canonicalize(entry.changes ?? null)}` +
    `,"event":${JSON.stringify(entry.event)}` +
    `,"recordId":${JSON.stringify(entry.recordId)}` +
    `,"recordType":${JSON.stringify(entry.recordType)}` +
    `,"seq":${JSON.stringify(entry.seq)}` +
    `,"userId":${JSON.stringify(entry.userId)}}`
  );
}

/** The hash of entries written before the trail was keyed (plain SHA-256). */
export function unkeyedEntryHash(entry: HashableEntry): string {
  return createHash('sha256').update(entry.prevHash).update(canonicalEntry(entry)).digest('hex');
}

export function keyedEntryHash(key: Buffer, entry: HashableEntry): string {
  return createHmac('sha256', key).update(entry.prevHash).update(canonicalEntry(entry)).digest('hex');
}

/** The hash of a new entry: keyed with the configured trail key. */
export function hashEntry(entry: HashableEntry): string {
  return keyedEntryHash(trailKey(), entry);
}

/** Appends one entry inside the caller's transaction (the change and its entry commit together). */
export async function appendTrail(sequelize: Sequelize, transaction: Transaction, input: TrailInput): Promise<TrailEntry> {
  const [head] = await sequelize.query<{ seq: number | string; hash: string }>(
    'SELECT seq, hash FROM trail_head WHERE id = 1 FOR UPDATE',
    { type: QueryTypes.SELECT, transaction },
  );
  if (!head) throw new Error('trail_head row is missing: run the migrations');
  const seq = Number(head.seq) + 1;
  // Milliseconds only: the column keeps three fractional digits, so the hash must too.
  const at = new Date(Math.floor((input.at ?? new Date()).getTime()));
  const entry: HashableEntry = {
    seq,
    at,
    userId: input.userId,
    recordType: input.recordType,
    recordId: String(input.recordId),
    event: input.event,
    changes: input.changes ?? null,
    prevHash: head.hash,
  };
  const hash = hashEntry(entry);
  const created = await TrailEntry.create({ ...entry, hash }, { transaction });
  await sequelize.query('UPDATE trail_head SET seq = ?, hash = ? WHERE id = 1', {
    replacements: [seq, hash],
    transaction,
  });
  return created;
}

/** The chain's head now (sequence and hash), as printed on reports and in digests. */
export async function readTrailHead(sequelize: Sequelize): Promise<{ seq: number; hash: string }> {
  const [head] = await sequelize.query<{ seq: number | string; hash: string }>('SELECT seq, hash FROM trail_head WHERE id = 1', { type: QueryTypes.SELECT });
  return { seq: Number(head?.seq ?? 0), hash: head?.hash ?? '0'.repeat(64) };
}

/** Convenience: one transaction holding just a trail entry (sign-in events). */
export async function recordTrail(sequelize: Sequelize, input: TrailInput): Promise<void> {
  await sequelize.transaction((transaction) => appendTrail(sequelize, transaction, input).then(() => undefined));
}

export interface TrailVerification {
  ok: boolean;
  entries: number;
  /** The first sequence number that no longer matches (for a cut or emptied trail: the first one missing). */
  firstBrokenSeq: number | null;
  headSeq: number;
  /** What was found, in words for the administrator; null when the trail is intact. */
  problem: string | null;
  /** Which check caught it: the keyed chain itself, the head row, or an anchor outside the database. */
  caughtBy: 'chain' | 'head' | 'anchor' | 'anchor-log' | null;
  /** The anchor that caught it, when one did. */
  anchor: { seq: number; hash: string; at: string; reason: string } | null;
  anchors: { checked: number; latest: { seq: number; at: string } | null };
  keyedFromSeq: number;
}

interface RawEntry {
  seq: number | string;
  at: Date;
  user_id: number | null;
  record_type: string;
  record_id: string;
  event: string;
  changes: string | null;
  prev_hash: string;
  hash: string;
}

const GENESIS_HASH = '0'.repeat(64);
const anchorView = (anchor: TrailAnchor) => ({ seq: anchor.seq, hash: anchor.hash, at: anchor.at, reason: anchor.reason });
const when = (iso: string) => `${iso.slice(0, 16).replace('T', ' ')} UTC`;

/**
 * Recomputes the whole chain in keyset-paged batches (entries before
 * `keyedFromSeq` with plain SHA-256, the rest with the key), checks the head
 * row, then checks every anchor of this chain: an anchored sequence must still
 * be there with the anchored hash.
 */
export async function verifyTrail(
  sequelize: Sequelize,
  { batchSize = 10_000, anchors = true }: { batchSize?: number; /** false: the chain alone (a restored backup is older than its latest anchors). */ anchors?: boolean } = {},
): Promise<TrailVerification> {
  const key = trailKey();
  const { chainId, keyedFromSeq } = await chainIdentity(sequelize);
  const anchorLog = anchors ? readTrailAnchors(chainId) : { anchors: [], problem: null, otherKey: false };
  const anchorsBySeq = new Map<number, TrailAnchor[]>();
  for (const anchor of anchorLog.anchors) anchorsBySeq.set(anchor.seq, [...(anchorsBySeq.get(anchor.seq) ?? []), anchor]);

  let previousHash = GENESIS_HASH;
  let expectedSeq = 1;
  let entries = 0;
  let firstBrokenSeq: number | null = null;
  // The last anchored sequence found intact, and the first anchor whose entry differs.
  let lastGoodAnchorSeq = 0;
  let mismatchedAnchor: TrailAnchor | null = null;
  const fetchFrom = (fromSeq: number) =>
    sequelize.query<RawEntry>(
      `SELECT seq, at, user_id, record_type, record_id, event, changes, prev_hash, hash
         FROM trail_entries WHERE seq >= ? ORDER BY seq LIMIT ?`,
      { replacements: [fromSeq, batchSize], type: QueryTypes.SELECT, raw: true },
    );
  let pending = fetchFrom(expectedSeq);
  for (;;) {
    const rows = await pending;
    // Fetch the next batch while this one is hashed (keyset paging on seq).
    const lastSeq = rows.length ? Number(rows[rows.length - 1].seq) : expectedSeq;
    if (rows.length === batchSize) pending = fetchFrom(lastSeq + 1);
    for (const row of rows) {
      const seq = Number(row.seq);
      const entry: HashableEntry = {
        seq,
        at: new Date(row.at),
        userId: row.user_id,
        recordType: row.record_type,
        recordId: row.record_id,
        event: row.event,
        changes: row.changes === null ? null : typeof row.changes === 'string' ? JSON.parse(row.changes) : row.changes,
        prevHash: previousHash,
      };
      const recomputed = seq >= keyedFromSeq ? keyedEntryHash(key, entry) : unkeyedEntryHash(entry);
      const broken = seq !== expectedSeq || row.prev_hash !== previousHash || row.hash !== recomputed;
      if (broken && firstBrokenSeq === null) firstBrokenSeq = Math.min(seq, expectedSeq);
      for (const anchor of anchorsBySeq.get(seq) ?? []) {
        if (anchor.hash === row.hash) {
          if (!mismatchedAnchor) lastGoodAnchorSeq = seq;
        } else mismatchedAnchor ??= anchor;
      }
      // Continue from the stored hash so one tampered entry is reported once, not as the whole tail.
      previousHash = row.hash;
      expectedSeq = seq + 1;
      entries += 1;
    }
    if (rows.length < batchSize) break;
  }
  const lastStoredSeq = expectedSeq - 1;
  const [head] = await sequelize.query<{ seq: number | string; hash: string }>('SELECT seq, hash FROM trail_head WHERE id = 1', {
    type: QueryTypes.SELECT,
  });
  const headSeq = Number(head?.seq ?? 0);
  const latestAnchor = anchorLog.anchors.reduce<TrailAnchor | null>((latest, anchor) => (!latest || anchor.seq >= latest.seq ? anchor : latest), null);
  const result = (found: Pick<TrailVerification, 'firstBrokenSeq' | 'problem' | 'caughtBy' | 'anchor'>): TrailVerification => ({
    ok: found.problem === null,
    entries,
    headSeq,
    ...found,
    anchors: { checked: anchorLog.anchors.length, latest: latestAnchor ? { seq: latestAnchor.seq, at: latestAnchor.at } : null },
    keyedFromSeq,
  });

  if (firstBrokenSeq !== null) {
    return result({
      firstBrokenSeq,
      caughtBy: 'chain',
      anchor: null,
      problem:
        `Entry ${firstBrokenSeq} does not match its hash: it was changed, removed or inserted directly in the database, ` +
        'or the entries from it on were re-chained without the trail key.' +
        (anchorLog.otherKey && !anchorLog.anchors.length ? ' The anchors were written with another trail key: check that this server holds the original key.' : ''),
    });
  }
  if (headSeq !== lastStoredSeq || (entries > 0 && head?.hash !== previousHash)) {
    return result({
      firstBrokenSeq: Math.min(headSeq, lastStoredSeq) + 1,
      caughtBy: 'head',
      anchor: null,
      problem: `The chain ends at entry ${lastStoredSeq} but the head row says ${headSeq}: entries were removed or the head was moved.`,
    });
  }
  if (mismatchedAnchor) {
    return result({
      firstBrokenSeq: lastGoodAnchorSeq + 1,
      caughtBy: 'anchor',
      anchor: anchorView(mismatchedAnchor),
      problem:
        `Entry ${mismatchedAnchor.seq} no longer has the hash the anchor of ${when(mismatchedAnchor.at)} recorded: ` +
        `the trail was rewritten from entry ${lastGoodAnchorSeq + 1} at the latest.`,
    });
  }
  const beyond = anchorLog.anchors.filter((anchor) => anchor.seq > lastStoredSeq).sort((a, b) => a.seq - b.seq)[0];
  if (beyond) {
    return result({
      firstBrokenSeq: lastStoredSeq + 1,
      caughtBy: 'anchor',
      anchor: anchorView(beyond),
      problem:
        lastStoredSeq === 0
          ? `The trail is empty, but the anchor of ${when(beyond.at)} recorded ${beyond.seq} entries: the trail was emptied.`
          : `The trail ends at entry ${lastStoredSeq}, but the anchor of ${when(beyond.at)} recorded entry ${beyond.seq}: ` +
            `entries from ${lastStoredSeq + 1} on were removed.`,
    });
  }
  if (anchorLog.problem) {
    return result({ firstBrokenSeq: null, caughtBy: 'anchor-log', anchor: null, problem: anchorLog.problem });
  }
  if (anchorLog.otherKey) {
    return result({
      firstBrokenSeq: null,
      caughtBy: 'anchor-log',
      anchor: null,
      problem: 'Anchors of this trail were written with another trail key than the one this server holds: configure the original key to check them.',
    });
  }
  return result({ firstBrokenSeq: null, caughtBy: null, anchor: null, problem: null });
}
