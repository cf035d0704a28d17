// Request bodies and views of the workflow records: audits, checklist runs,
// findings and corrective actions. The server validates with these; the client
// types its forms and pages with the same definitions.
import { z } from 'zod';
import { FINDING_CLASSES, ROOT_CAUSE_METHODS } from '../../machines';
import { ListQueryBaseSchema, isWellFormedText, ILL_FORMED_TEXT_MESSAGE } from './common';

const text = (label: string, max = 4000) =>
  z.string({ error: `${label} is required` }).trim().min(1, `${label} is required`).max(max, `${label} is at most ${max} characters`)
    .refine(isWellFormedText, ILL_FORMED_TEXT_MESSAGE);
/** A calendar date that exists (2026-02-30 does not), written YYYY-MM-DD. */
const IsoDateSchema = z.iso.date({ error: 'use a real calendar date like 2026-12-31' });
const version = z.number({ error: 'version is required (the version you loaded)' }).int().min(0);
const password = z.string({ error: 'your password is required to sign' }).min(1, 'your password is required to sign').max(1024);

// ---- audits ----------------------------------------------------------------
export const AuditScopeItemSchema = z
  .object({
    /** A technique of the register. */
    techniqueId: z.number().int().positive().optional(),
    /** The revision letter the planner was shown: refused unless it is the register's revision in force. */
    revision: z.string().trim().min(1).max(8).optional(),
    /** Or the technique as written (JSON the checklist engine reads), when it is not in the register. */
    technique: z.record(z.string(), z.unknown()).optional(),
  })
  .strict()
  .refine((item) => Boolean(item.techniqueId) !== Boolean(item.technique), 'give either techniqueId or technique');

export const AuditCreateSchema = z
  .object({
    title: text('title', 200),
    criteria: text('criteria', 4000),
    areaId: z.number().int().positive(),
    leadAuditorId: z.number().int().positive(),
    plannedStart: IsoDateSchema,
    plannedEnd: IsoDateSchema,
    techniques: z.array(AuditScopeItemSchema).min(1, 'add at least one technique to the scope').max(50),
  })
  .strict()
  .refine((audit) => audit.plannedEnd >= audit.plannedStart, { path: ['plannedEnd'], message: 'the end is before the start' });
export type AuditCreateInput = z.infer<typeof AuditCreateSchema>;

export const AuditEventSchema = z.discriminatedUnion('type', [
  z.object({ type: z.literal('START_FIELDWORK'), version }).strict(),
  z.object({ type: z.literal('FINISH_FIELDWORK'), version }).strict(),
  z.object({ type: z.literal('ISSUE'), version, password }).strict(),
  z.object({ type: z.literal('CLOSE'), version }).strict(),
  z.object({ type: z.literal('CANCEL'), version, reason: text('reason', 2000) }).strict(),
]);
export type AuditEventInput = z.infer<typeof AuditEventSchema>;

export const AuditListQuerySchema = ListQueryBaseSchema.extend({
  state: z.string().regex(/^[a-z_,]*$/, 'state is a state name or a comma-separated list of them').max(200).optional(),
  areaId: z.coerce.number().int().positive().optional(),
  owner: z.coerce.number().int().positive().optional(),
}).strict();

export const ChecklistRunCreateSchema = z
  .object({
    /** A technique in the audit's scope, by code. */
    techniqueCode: z.string().trim().min(1).max(64).optional(),
    /** Or a technique of the register, by id (it must be in scope). */
    techniqueId: z.number().int().positive().optional(),
    notes: z.record(z.string().regex(/^\d+$/, 'notes are keyed by result index'), z.string().max(4000)).optional(),
  })
  .strict()
  .refine((body) => Boolean(body.techniqueCode) !== Boolean(body.techniqueId), 'give either techniqueCode or techniqueId');

export const ChecklistRunNotesSchema = z
  .object({
    version,
    notes: z.record(z.string().regex(/^\d+$/, 'notes are keyed by result index'), z.string().max(4000)),
  })
  .strict();

export const ChecklistRunParamsSchema = z
  .object({ id: z.coerce.number().int().positive(), runId: z.coerce.number().int().positive() })
  .strict();

// ---- findings --------------------------------------------------------------
export const FindingCreateSchema = z
  .object({
    /** Prefill from a failed checklist result: the rule, message and values come from the run. */
    checklistRunId: z.number().int().positive().optional(),
    resultIndex: z.number().int().min(0).optional(),
    title: text('title', 200).optional(),
    rule: text('rule or clause', 200).optional(),
    requirement: text('requirement', 4000).optional(),
    objectiveEvidence: text('objective evidence', 8000).optional(),
    techniqueCode: z.string().trim().min(1).max(64).optional(),
  })
  .strict()
  .refine((body) => (body.checklistRunId === undefined) === (body.resultIndex === undefined), {
    path: ['resultIndex'],
    message: 'checklistRunId and resultIndex go together',
  })
  .refine((body) => body.checklistRunId !== undefined || (body.title && body.rule && body.requirement && body.objectiveEvidence), {
    path: ['requirement'],
    message: 'without a checklist result, give title, rule, requirement and objective evidence',
  });
export type FindingCreateInput = z.infer<typeof FindingCreateSchema>;

export const FindingEventSchema = z.discriminatedUnion('type', [
  z.object({ type: z.literal('SUBMIT'), version }).strict(),
  z.object({ type: z.literal('WITHDRAW'), version, reason: text('reason', 2000) }).strict(),
  z.object({ type: z.literal('CLASSIFY'), version, class: z.enum(FINDING_CLASSES), note: z.string().trim().max(4000).optional() }).strict(),
  z.object({ type: z.literal('RECORD_CONTAINMENT'), version, description: text('containment', 4000) }).strict(),
  z.object({ type: z.literal('CONFIRM_EFFECTIVE'), version, note: text('note', 4000) }).strict(),
  z.object({ type: z.literal('NOT_EFFECTIVE'), version, reason: text('reason', 4000) }).strict(),
  z.object({ type: z.literal('CLOSE'), version, password }).strict(),
]);
export type FindingEventInput = z.infer<typeof FindingEventSchema>;

const booleanQuery = z.enum(['true', 'false']).optional();

export const FindingListQuerySchema = ListQueryBaseSchema.extend({
  state: z.string().regex(/^[a-z_,]*$/, 'state is a state name or a comma-separated list of them').max(200).optional(),
  /** A class, or "unclassified" for findings not yet classified (no class). */
  class: z.enum([...FINDING_CLASSES, 'unclassified']).optional(),
  areaId: z.coerce.number().int().positive().optional(),
  owner: z.coerce.number().int().positive().optional(),
  auditId: z.coerce.number().int().positive().optional(),
  overdue: booleanQuery,
  /** Raised on or after / on or before these days (UTC), as the dashboard counts them. */
  raisedFrom: IsoDateSchema.optional(),
  raisedTo: IsoDateSchema.optional(),
}).strict();

// ---- corrective actions ----------------------------------------------------
export const ActionCreateSchema = z
  .object({ findingId: z.number().int().positive(), ownerId: z.number().int().positive(), dueDate: IsoDateSchema })
  .strict();
export type ActionCreateInput = z.infer<typeof ActionCreateSchema>;

const PlanItemSchema = z.object({ description: text('plan item', 2000), dueDate: IsoDateSchema }).strict();

export const ActionEventSchema = z.discriminatedUnion('type', [
  z.object({ type: z.literal('START'), version }).strict(),
  z
    .object({
      type: z.literal('SUBMIT_PLAN'),
      version,
      method: z.enum(ROOT_CAUSE_METHODS),
      rootCause: text('root cause analysis', 8000),
      plan: z.array(PlanItemSchema).min(1, 'add at least one plan item').max(50),
    })
    .strict(),
  z.object({ type: z.literal('APPROVE_PLAN'), version }).strict(),
  z.object({ type: z.literal('RETURN_PLAN'), version, reason: text('reason', 2000) }).strict(),
  z.object({ type: z.literal('SUBMIT'), version, summary: text('summary', 8000) }).strict(),
  z.object({ type: z.literal('VERIFY'), version, password }).strict(),
  z.object({ type: z.literal('RETURN'), version, reason: text('reason', 2000) }).strict(),
  z.object({ type: z.literal('REQUEST_EXTENSION'), version, dueDate: IsoDateSchema, reason: text('reason', 2000) }).strict(),
  z.object({ type: z.literal('APPROVE_EXTENSION'), version }).strict(),
  z.object({ type: z.literal('REJECT_EXTENSION'), version, reason: text('reason', 2000) }).strict(),
]);
export type ActionEventInput = z.infer<typeof ActionEventSchema>;

export const ActionListQuerySchema = ListQueryBaseSchema.extend({
  state: z.string().regex(/^[a-z_,]*$/, 'state is a state name or a comma-separated list of them').max(200).optional(),
  areaId: z.coerce.number().int().positive().optional(),
  owner: z.coerce.number().int().positive().optional(),
  overdue: booleanQuery,
  /** Due on or after / on or before these days, as the dashboard counts them. */
  dueFrom: IsoDateSchema.optional(),
  dueTo: IsoDateSchema.optional(),
  /** The dashboard's four kinds: verified by the due date, verified after it, overdue, open and not yet due. */
  timeliness: z.enum(['on_time', 'late', 'overdue', 'not_yet_due']).optional(),
}).strict();

// ---- views -----------------------------------------------------------------
export interface PersonRef {
  id: number;
  displayName: string;
}

export interface SignatureView {
  id: number;
  event: string;
  signerId: number;
  printedName: string;
  role: string;
  meaning: string;
  signedAt: string;
  contentHash: string;
}

interface RecordBase {
  id: number;
  state: string;
  version: number;
  allowedEvents: string[];
  createdAt: string;
  updatedAt: string;
}

export interface AuditScopeItemView {
  techniqueId: number | null;
  code: string;
  title: string;
  revision: string;
}

export interface ChecklistRunView {
  id: number;
  auditId: number;
  techniqueId: number | null;
  techniqueCode: string;
  techniqueRevision: string;
  verdict: string;
  output: unknown;
  notes: Record<string, string>;
  runBy: PersonRef | null;
  runAt: string;
  version: number;
  /** The engine version the run was made with (CHECKLIST_ENGINE_VERSION at the time). */
  engineVersion: string;
  /** "Checked with engine 1.0 on 2 Dec 2026; the current engine is 2.0." */
  engineNote: string;
  /** What changed since the previous run of the same technique in this audit; null for the first run. */
  changes: ChecklistRunChanges | null;
}

export interface ChecklistRunChanges {
  previousRunId: number;
  previousRunAt: string;
  previousEngineVersion: string;
  /** One line per result whose status changed, in words; empty when nothing changed. */
  lines: string[];
}

export interface FindingSummaryView {
  id: number;
  number: string;
  title: string;
  state: string;
  class: string | null;
  dueDate: string | null;
}

export interface AuditView extends RecordBase {
  title: string;
  criteria: string;
  areaId: number;
  areaName: string | null;
  leadAuditor: PersonRef | null;
  plannedStart: string;
  plannedEnd: string;
  scope: AuditScopeItemView[];
  cancelReason: string | null;
  issuedAt: string | null;
  closedAt: string | null;
  openFindingCount: number;
}

export interface AuditDetailView extends AuditView {
  checklistRuns: ChecklistRunView[];
  findings: FindingSummaryView[];
  signatures: SignatureView[];
  /** Whether this user may run the checklist and raise findings now. */
  canRunChecklist: boolean;
  canRaiseFinding: boolean;
}

export interface ActionSummaryView {
  id: number;
  number: string;
  state: string;
  owner: PersonRef | null;
  dueDate: string;
}

export interface FindingView extends RecordBase {
  number: string;
  title: string;
  auditId: number | null;
  auditTitle: string | null;
  techniqueId: number | null;
  techniqueCode: string | null;
  checklistRunId: number | null;
  resultIndex: number | null;
  rule: string;
  requirement: string;
  objectiveEvidence: string;
  resultValues: Record<string, unknown> | null;
  class: string | null;
  /** A finding raised from another's extent of condition: that finding, and the class proposed for this one. */
  extentOfId: number | null;
  proposedClass: string | null;
  classificationNote: string | null;
  containment: string | null;
  containmentDueDate: string | null;
  dueDate: string | null;
  effectivenessNote: string | null;
  notEffectiveReason: string | null;
  closureNote: string | null;
  withdrawReason: string | null;
  closedAt: string | null;
  author: PersonRef | null;
  areaId: number;
  areaName: string | null;
  action: ActionSummaryView | null;
  overdue: boolean;
  /** The quality manager may assign a corrective action now (finding in action_open without one). */
  canAssignAction: boolean;
}

export interface FindingDetailView extends FindingView {
  signatures: SignatureView[];
  /** Past inspections in the impact worksheet without a containment decision (counted only in containment, else 0). */
  undecidedInspectionCount: number;
}

export interface ActionView extends RecordBase {
  number: string;
  findingId: number;
  finding: FindingSummaryView | null;
  owner: PersonRef | null;
  dueDate: string;
  pendingExtension: { dueDate: string; reason: string } | null;
  method: string | null;
  rootCause: string | null;
  plan: { description: string; dueDate: string }[];
  submissionSummary: string | null;
  returnReason: string | null;
  reopenReason: string | null;
  verifiedAt: string | null;
  evidenceCount: number;
  overdue: boolean;
}

export interface ActionDetailView extends ActionView {
  signatures: SignatureView[];
}

export interface HomeItem {
  recordType: 'audit' | 'finding' | 'action';
  id: number;
  label: string;
  title: string;
  state: string;
  /** What this person is expected to do now. */
  todo: string;
  dueDate: string | null;
  overdue: boolean;
}

export interface HomeView {
  items: HomeItem[];
}
