import { z } from 'zod';

export const TrailQuerySchema = z
  .object({
    /** "type:id", e.g. "finding:12". */
    record: z.string().regex(/^[a-z_-]+:[A-Za-z0-9_-]+$/, 'use record=type:id, e.g. finding:12'),
    limit: z.coerce.number().int().min(1).max(1000).default(200),
  })
  .strict();

export interface TrailEntryView {
  seq: number;
  at: string;
  userId: number | null;
  userName: string | null;
  recordType: string;
  recordId: string;
  event: string;
  changes: unknown;
  hash: string;
}

export interface TrailVerificationView {
  ok: boolean;
  entries: number;
  /** The first sequence that no longer matches (for a cut or emptied trail, the first one missing). */
  firstBrokenSeq: number | null;
  headSeq: number;
  /** What was found, in words; null when intact. */
  problem: string | null;
  /** Which check found it: the keyed chain, the head row, an anchor outside the database, or the anchor log itself. */
  caughtBy: 'chain' | 'head' | 'anchor' | 'anchor-log' | null;
  anchor: { seq: number; hash: string; at: string; reason: string } | null;
  anchors: { checked: number; latest: { seq: number; at: string } | null };
  /** Entries from this sequence on are keyed; earlier ones carry the plain hash they were written with. */
  keyedFromSeq: number;
  checkedAt: string;
  durationMs: number;
}
