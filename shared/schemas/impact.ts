// Impact on past inspections: the inspections a finding (or an item of
// equipment out of calibration) puts in doubt, and the containment decision
// the quality manager records for each.
import { z } from 'zod';
import { IsoDateSchema } from './common';
import type { InspectionView } from './inspection';

export const CONTAINMENT_DECISIONS = ['reinspect', 'recall_report', 'accept_justified', 'not_affected'] as const;
export type ContainmentDecisionKind = (typeof CONTAINMENT_DECISIONS)[number];
export { CONTAINMENT_DECISION_LABELS } from '../labels/inspections';

export interface ContainmentDecisionView {
  decision: ContainmentDecisionKind;
  reason: string;
  decidedBy: { id: number; name: string };
  decidedAt: string;
}

export interface ImpactRow {
  inspection: InspectionView;
  /** Finding worksheets only; null: not decided yet. */
  decision: ContainmentDecisionView | null;
}

/** Inspections of one customer and part number, with how many are still undecided. */
export interface ImpactGroup {
  customer: string;
  partNumber: string;
  count: number;
  /** Finding worksheets: rows without a decision; null on an equipment view, which records no decisions. */
  undecided: number | null;
}

export interface ImpactRevision {
  id: number;
  revision: string;
  approvedAt: string | null;
  /** The first day whose inspections are in doubt. */
  from: string;
  /** Why this revision is affected. */
  reason: string;
}

export interface FindingImpactView {
  findingId: number;
  techniqueId: number | null;
  techniqueCode: string | null;
  /** The date the quality manager chose; null: from each revision's approval. */
  since: string | null;
  revisions: ImpactRevision[];
  groups: ImpactGroup[];
  rows: ImpactRow[];
  total: number;
  undecided: number;
  /** A major finding in containment cannot leave it while rows are undecided. */
  blocksContainment: boolean;
  /** Why there is nothing to list, when there is nothing. */
  unavailableReason: string | null;
}

export interface EquipmentImpactView {
  equipment: { id: number; kind: string; serialNumber: string; description: string; calibratedOn: string | null; calibrationDueOn: string | null; status: string };
  /** The first day whose inspections are in doubt: the chosen date, else the last calibration. */
  from: string | null;
  /** Why that date. */
  basis: string;
  groups: ImpactGroup[];
  rows: ImpactRow[];
  total: number;
}

export const ImpactScopeSchema = z
  .object({ since: IsoDateSchema.nullable(), version: z.number().int().min(0) })
  .strict();

export const ContainmentDecisionsSchema = z
  .object({
    inspectionIds: z.array(z.number().int().positive()).min(1, 'choose at least one inspection').max(1000, 'at most 1000 inspections at once'),
    decision: z.enum(CONTAINMENT_DECISIONS, { error: `decision must be one of ${CONTAINMENT_DECISIONS.join(', ')}` }),
    reason: z.string({ error: 'a reason is required' }).trim().min(1, 'a reason is required').max(2000, 'the reason is at most 2000 characters'),
  })
  .strict();
export type ContainmentDecisionsInput = z.infer<typeof ContainmentDecisionsSchema>;

export const EquipmentImpactQuerySchema = z.object({ since: IsoDateSchema.optional() }).strict();
