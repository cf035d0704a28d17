// Extent of condition: which other approved techniques fail the rule a finding
// was raised on, and the findings raised from that list.
import { z } from 'zod';
import { FINDING_CLASSES, type FindingClass, type FindingState } from '../../machines/finding.machine';
import type { ResultValue, RuleId } from '../domain/checklist/types';

/** One failing result of the finding's rule on another technique. */
export interface ExtentFailure {
  message: string;
  flaw: string | null;
  flawOrientation: string | null;
  coil: number | null;
  coilType: string | null;
  values: Record<string, ResultValue>;
}

/** One approved revision as the run evaluated it; no failures: it passes the rule. */
export interface ExtentTechnique {
  techniqueId: number;
  revisionId: number;
  code: string;
  title: string;
  revision: string;
  failures: ExtentFailure[];
  /** Some failure is about a flaw of the finding's flaw orientation. */
  sameOrientation: boolean;
  /** Some failure is about a coil of the finding's coil type. */
  sameCoilType: boolean;
  /** The technique the finding itself is about. */
  isFindingTechnique: boolean;
}

export interface ExtentRunView {
  id: number;
  findingId: number;
  rule: RuleId;
  flawOrientation: string | null;
  coilType: string | null;
  engineVersion: string;
  /** "Checked with engine 1.0 on 2 Dec 2026; the current engine is 2.0." */
  engineNote: string;
  policyVersion: number;
  runAt: string;
  runBy: { id: number; name: string };
  evaluatedCount: number;
  /** Every evaluated revision that fails the rule, the finding's own technique first. */
  failing: ExtentTechnique[];
  /** What changed since the finding's previous extent run; null for its first run. */
  changes: {
    previousRunId: number;
    previousRunAt: string;
    previousEngineVersion: string;
    /** One line per technique revision whose standing on the rule changed, in words; empty when nothing changed. */
    lines: string[];
  } | null;
  /** Findings already raised against these techniques from this finding. */
  linked: Array<{ techniqueId: number; findingId: number; number: string; state: FindingState }>;
}

/** The family of a finding: the finding it extends, and the findings raised from its extent runs. */
export interface FindingFamilyView {
  extentOf: { id: number; number: string; title: string; state: FindingState } | null;
  members: Array<{
    id: number;
    number: string;
    title: string;
    techniqueCode: string | null;
    state: FindingState;
    class: FindingClass | null;
    proposedClass: FindingClass | null;
  }>;
  /** Whether the finding names a checklist rule, so that an extent run is possible. */
  extentPossible: boolean;
  /** Why not, when it is not. */
  extentUnavailableReason: string | null;
  latestRun: ExtentRunView | null;
}

export const RaiseExtentFindingsSchema = z
  .object({
    runId: z.number({ error: 'runId is required: linked findings come from a recorded run' }).int().positive(),
    revisionIds: z
      .array(z.number().int().positive(), { error: 'choose the techniques to raise findings against' })
      .min(1, 'choose at least one technique')
      .max(100, 'at most 100 techniques at once'),
    /** null: propose the original finding's class. */
    proposedClass: z.enum(FINDING_CLASSES).nullable().default(null),
  })
  .strict();
export type RaiseExtentFindingsInput = z.infer<typeof RaiseExtentFindingsSchema>;
