// The tamper-evident trail. Each entry's hash covers the previous entry's hash
// and the entry's canonical JSON (RFC 8785), so changing or removing any entry
// breaks every hash after it. Writers lock the single chain-head row, which
// gives consecutive sequence numbers under concurrency.
import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { TrailEntry, type TrailChanges } from '../models';

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

export function hashEntry(entry: HashableEntry): string {
  return createHash('sha256').update(entry.prevHash).update(canonicalEntry(entry)).digest('hex');
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

/** Convenience: one transaction holding just a trail entry (sign-in events). */
export async function recordTrail(sequelize: Sequelize, input: TrailInput): Promise<void> {
  await sequelize.transaction((transaction) => appendTrail(sequelize, transaction, input).then(() => undefined));
}

export interface TrailVerification {
  ok: boolean;
  entries: number;
  firstBrokenSeq: number | null;
  headSeq: number;
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

/** Recomputes the whole chain in keyset-paged batches. */
export async function verifyTrail(sequelize: Sequelize, batchSize = 10_000): Promise<TrailVerification> {
  let previousHash = '0'.repeat(64);
  let expectedSeq = 1;
  let entries = 0;
  let firstBrokenSeq: number | null = null;
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
      const recomputed = hashEntry({
        seq,
        at: new Date(row.at),
        userId: row.user_id,
        recordType: row.record_type,
        recordId: row.record_id,
        event: row.event,
        changes: row.changes === null ? null : typeof row.changes === 'string' ? JSON.parse(row.changes) : row.changes,
        prevHash: previousHash,
      });
      const broken = seq !== expectedSeq || row.prev_hash !== previousHash || row.hash !== recomputed;
      if (broken && firstBrokenSeq === null) firstBrokenSeq = Math.min(seq, expectedSeq);
      // Continue from the stored hash so one tampered entry is reported once, not as the whole tail.
      previousHash = row.hash;
      expectedSeq = seq + 1;
      entries += 1;
    }
    if (rows.length < batchSize) break;
  }
  const [head] = await sequelize.query<{ seq: number | string; hash: string }>('SELECT seq, hash FROM trail_head WHERE id = 1', {
    type: QueryTypes.SELECT,
  });
  const headSeq = Number(head?.seq ?? 0);
  if (firstBrokenSeq === null && (headSeq !== expectedSeq - 1 || (entries > 0 && head?.hash !== previousHash))) {
    firstBrokenSeq = Math.min(headSeq, expectedSeq - 1) + 1;
  }
  return { ok: firstBrokenSeq === null, entries, firstBrokenSeq, headSeq };
}
