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
  firstBrokenSeq: number | null;
  headSeq: number;
  checkedAt: string;
  durationMs: number;
}
