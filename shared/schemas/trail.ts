import { z } from 'zod';

export const TrailQuerySchema = z
  .object({
    /** A record number ("F-2026-0015", "CA-2026-0003"), a technique code, or "type:id" ("finding:12"). */
    record: z
      .string()
      .trim()
      .min(1, 'enter a record number such as F-2026-0015, or type:id such as finding:12')
      .max(80)
      .regex(/^[A-Za-z0-9 :_./-]+$/, 'enter a record number such as F-2026-0015, or type:id such as finding:12'),
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

/** One line of what changed, in words: "Area: Wheel and Brake Shop → Structures Bay". */
export interface TrailChangeLine {
  label: string;
  /** Set for a change of value. */
  before?: string;
  after?: string;
  /** Set for a value recorded with the event. */
  value?: string;
}

/** A trail entry as people read it: the event and its details in words. */
export interface PresentedTrailEntryView extends TrailEntryView {
  eventLabel: string;
  recordLabel: string;
  details: TrailChangeLine[];
}

export interface RecordTrailView {
  /** The record found for the text searched, in words ("Finding F-2026-0015"). */
  record: { type: string; id: string; label: string } | null;
  items: PresentedTrailEntryView[];
  total: number;
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
