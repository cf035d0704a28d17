import { assertEvent, assign, setup } from 'xstate';
import { z } from 'zod';
import { isCount, isIsoDate, isNonBlank } from './payload-checks';

/*
 * Corrective action lifecycle: assigned → investigating → plan_review →
 * in_progress → submitted → verified. The reviewer returns a plan to
 * investigating and a submission to in_progress, each with a reason; a failed
 * effectiveness check on the finding reopens a verified action (REOPEN).
 * In investigating and in_progress the owner may ask for a later due date; the
 * due date changes only when the quality manager approves the pending request.
 *
 * Effects (named actions with empty bodies; `applyEvent` returns their names
 * and the server carries them out, details from the event it sent and the new
 * context). After every transition the server also mirrors `context.dueDate`
 * into the action's due-date column, which the reminder jobs read.
 * - `notifyOwnerAssigned` (on creation, from `createInitialSnapshot`): mail the
 *   owner that the action is theirs, with the due date.
 * - `notifyReviewerPlanSubmitted` (SUBMIT_PLAN): mail the quality managers
 *   that a root cause and plan wait for review.
 * - `notifyOwnerPlanApproved` (APPROVE_PLAN) / `notifyOwnerPlanReturned`
 *   (RETURN_PLAN, with `context.returnReason`): mail the owner.
 * - `notifyReviewerEvidenceSubmitted` (SUBMIT): mail the quality managers and
 *   the finding's auditor that the action waits for verification.
 * - `notifyOwnerSubmissionReturned` (RETURN, with `context.returnReason`).
 * - `markFindingActionVerified` (VERIFY): send `ACTION_VERIFIED` to the
 *   action's finding, in the same transaction as this transition.
 * - `notifyOwnerReopened` (REOPEN, with `context.reopenReason`).
 * - `notifyReviewerExtensionRequested` (REQUEST_EXTENSION): mail the quality
 *   managers the requested date and reason (`context.pendingExtension`).
 * - `notifyOwnerExtensionApproved` (APPROVE_EXTENSION, new `context.dueDate`) /
 *   `notifyOwnerExtensionRejected` (REJECT_EXTENSION, the event's reason).
 *
 * Signed event: VERIFY. The server checks the password and records the
 * signature first; the machine never looks at `password`.
 * Server-only event: REOPEN (sent when the finding's check is NOT_EFFECTIVE).
 * Server facts: SUBMIT carries `facts.evidenceCount`, the number of current
 * (not superseded) evidence files attached to this action, counted by the
 * server inside the transaction and never taken from the request body.
 * Dates are ISO calendar dates `YYYY-MM-DD`.
 */

export const CORRECTIVE_ACTION_MACHINE_VERSION = 1;

export const CORRECTIVE_ACTION_STATES = ['assigned', 'investigating', 'plan_review', 'in_progress', 'submitted', 'verified'] as const;
export type CorrectiveActionState = (typeof CORRECTIVE_ACTION_STATES)[number];

export const CORRECTIVE_ACTION_EVENT_TYPES = [
  'START', 'SUBMIT_PLAN', 'APPROVE_PLAN', 'RETURN_PLAN', 'SUBMIT', 'VERIFY', 'RETURN', 'REOPEN', 'REQUEST_EXTENSION',
  'APPROVE_EXTENSION', 'REJECT_EXTENSION',
] as const;
export type CorrectiveActionEventType = (typeof CORRECTIVE_ACTION_EVENT_TYPES)[number];

/** Root-cause methods: five whys, cause-and-effect categories, or other. */
export const ROOT_CAUSE_METHODS = ['five_whys', 'cause_and_effect', 'other'] as const;
export type RootCauseMethod = (typeof ROOT_CAUSE_METHODS)[number];

export const CORRECTIVE_ACTION_EFFECTS = [
  'notifyOwnerAssigned', 'notifyReviewerPlanSubmitted', 'notifyOwnerPlanApproved', 'notifyOwnerPlanReturned',
  'notifyReviewerEvidenceSubmitted', 'notifyOwnerSubmissionReturned', 'markFindingActionVerified',
  'notifyOwnerReopened', 'notifyReviewerExtensionRequested', 'notifyOwnerExtensionApproved',
  'notifyOwnerExtensionRejected',
] as const;
export type CorrectiveActionEffect = (typeof CORRECTIVE_ACTION_EFFECTS)[number];

export const CORRECTIVE_ACTION_SIGNED_EVENTS = { VERIFY: 'corrective action verified' } as const satisfies Partial<
  Record<CorrectiveActionEventType, string>
>;

export const CORRECTIVE_ACTION_SERVER_EVENTS: readonly CorrectiveActionEventType[] = ['REOPEN'];

const PlanStepSchema = z.object({ description: z.string(), dueDate: z.iso.date() }).strict();
export type PlanStep = z.infer<typeof PlanStepSchema>;

export const CorrectiveActionContextSchema = z
  .object({
    dueDate: z.iso.date(),
    /** An extension the owner asked for and the quality manager has not decided yet. */
    pendingExtension: z.object({ dueDate: z.iso.date(), reason: z.string() }).strict().nullable(),
    method: z.enum(ROOT_CAUSE_METHODS).nullable(),
    rootCause: z.string().nullable(),
    plan: z.array(PlanStepSchema),
    submissionSummary: z.string().nullable(),
    /** Why the reviewer last sent the plan or the submission back; cleared on resubmission. */
    returnReason: z.string().nullable(),
    /** Why the action was last reopened after a failed effectiveness check. */
    reopenReason: z.string().nullable(),
  })
  .strict();
export type CorrectiveActionContext = z.infer<typeof CorrectiveActionContextSchema>;

/** Facts the server computes and sets on SUBMIT. */
export interface CorrectiveActionSubmitFacts {
  /** Current (not superseded) evidence files attached to this action. */
  evidenceCount: number;
}

export type CorrectiveActionEvent =
  | { type: 'START' }
  | { type: 'SUBMIT_PLAN'; method: RootCauseMethod; rootCause: string; plan: PlanStep[] }
  | { type: 'APPROVE_PLAN' }
  | { type: 'RETURN_PLAN'; reason: string }
  | { type: 'SUBMIT'; summary: string; facts: CorrectiveActionSubmitFacts }
  | { type: 'VERIFY'; password?: string }
  | { type: 'RETURN'; reason: string }
  | { type: 'REOPEN'; reason: string }
  | { type: 'REQUEST_EXTENSION'; dueDate: string; reason: string }
  | { type: 'APPROVE_EXTENSION' }
  | { type: 'REJECT_EXTENSION'; reason: string };

export interface CorrectiveActionInput {
  /** The due date the quality manager set when assigning the action. */
  dueDate: string;
}

const extensionTransitions = {
  REQUEST_EXTENSION: {
    guard: 'extensionRequestIsValid',
    actions: ['storePendingExtension', 'notifyReviewerExtensionRequested'],
  },
  APPROVE_EXTENSION: { guard: 'extensionIsPending', actions: ['applyPendingExtension', 'notifyOwnerExtensionApproved'] },
  REJECT_EXTENSION: {
    guard: 'extensionRejectionIsValid',
    actions: ['clearPendingExtension', 'notifyOwnerExtensionRejected'],
  },
} as const;

export const correctiveActionMachine = setup({
  types: {
    context: {} as CorrectiveActionContext,
    events: {} as CorrectiveActionEvent,
    input: {} as CorrectiveActionInput,
  },
  guards: {
    // Every item falls due on or before the action itself: a plan cannot outrun its own deadline.
    planIsComplete: ({ context, event }) =>
      event.type === 'SUBMIT_PLAN' &&
      ROOT_CAUSE_METHODS.includes(event.method) &&
      isNonBlank(event.rootCause) &&
      Array.isArray(event.plan) &&
      event.plan.length > 0 &&
      event.plan.every((step) => isNonBlank(step?.description) && isIsoDate(step?.dueDate) && step.dueDate <= context.dueDate),
    hasReturnReason: ({ event }) => (event.type === 'RETURN_PLAN' || event.type === 'RETURN') && isNonBlank(event.reason),
    hasReopenReason: ({ event }) => event.type === 'REOPEN' && isNonBlank(event.reason),
    hasEvidence: ({ event }) =>
      event.type === 'SUBMIT' &&
      isNonBlank(event.summary) &&
      isCount(event.facts?.evidenceCount) &&
      event.facts.evidenceCount >= 1,
    // One pending request at a time, for a later date than the current one.
    extensionRequestIsValid: ({ context, event }) =>
      event.type === 'REQUEST_EXTENSION' &&
      context.pendingExtension === null &&
      isIsoDate(event.dueDate) &&
      event.dueDate > context.dueDate &&
      isNonBlank(event.reason),
    extensionIsPending: ({ context }) => context.pendingExtension !== null,
    extensionRejectionIsValid: ({ context, event }) =>
      event.type === 'REJECT_EXTENSION' && context.pendingExtension !== null && isNonBlank(event.reason),
  },
  actions: {
    storePlan: assign(({ event }) => {
      assertEvent(event, 'SUBMIT_PLAN');
      return {
        method: event.method,
        rootCause: event.rootCause.trim(),
        plan: event.plan.map((step) => ({ description: step.description.trim(), dueDate: step.dueDate })),
        returnReason: null,
      };
    }),
    storeSubmission: assign(({ event }) => {
      assertEvent(event, 'SUBMIT');
      return { submissionSummary: event.summary.trim(), returnReason: null };
    }),
    storeReturnReason: assign({
      returnReason: ({ event }) => {
        assertEvent(event, ['RETURN_PLAN', 'RETURN']);
        return event.reason.trim();
      },
    }),
    storeReopenReason: assign({
      reopenReason: ({ event }) => {
        assertEvent(event, 'REOPEN');
        return event.reason.trim();
      },
    }),
    storePendingExtension: assign({
      pendingExtension: ({ event }) => {
        assertEvent(event, 'REQUEST_EXTENSION');
        return { dueDate: event.dueDate, reason: event.reason.trim() };
      },
    }),
    applyPendingExtension: assign(({ context }) => ({
      dueDate: context.pendingExtension?.dueDate ?? context.dueDate,
      pendingExtension: null,
    })),
    clearPendingExtension: assign({ pendingExtension: null }),
    notifyOwnerAssigned: () => {},
    notifyReviewerPlanSubmitted: () => {},
    notifyOwnerPlanApproved: () => {},
    notifyOwnerPlanReturned: () => {},
    notifyReviewerEvidenceSubmitted: () => {},
    notifyOwnerSubmissionReturned: () => {},
    markFindingActionVerified: () => {},
    notifyOwnerReopened: () => {},
    notifyReviewerExtensionRequested: () => {},
    notifyOwnerExtensionApproved: () => {},
    notifyOwnerExtensionRejected: () => {},
  },
}).createMachine({
  id: 'corrective_action',
  version: String(CORRECTIVE_ACTION_MACHINE_VERSION),
  initial: 'assigned',
  context: ({ input }) => ({
    dueDate: input.dueDate,
    pendingExtension: null,
    method: null,
    rootCause: null,
    plan: [],
    submissionSummary: null,
    returnReason: null,
    reopenReason: null,
  }),
  states: {
    assigned: {
      entry: 'notifyOwnerAssigned',
      on: { START: { target: 'investigating' } },
    },
    investigating: {
      on: {
        SUBMIT_PLAN: { guard: 'planIsComplete', target: 'plan_review', actions: ['storePlan', 'notifyReviewerPlanSubmitted'] },
        ...extensionTransitions,
      },
    },
    plan_review: {
      on: {
        APPROVE_PLAN: { target: 'in_progress', actions: 'notifyOwnerPlanApproved' },
        RETURN_PLAN: { guard: 'hasReturnReason', target: 'investigating', actions: ['storeReturnReason', 'notifyOwnerPlanReturned'] },
      },
    },
    in_progress: {
      on: {
        SUBMIT: { guard: 'hasEvidence', target: 'submitted', actions: ['storeSubmission', 'notifyReviewerEvidenceSubmitted'] },
        ...extensionTransitions,
      },
    },
    submitted: {
      on: {
        // A request still pending is moot once the work is verified.
        VERIFY: { target: 'verified', actions: ['clearPendingExtension', 'markFindingActionVerified'] },
        RETURN: { guard: 'hasReturnReason', target: 'in_progress', actions: ['storeReturnReason', 'notifyOwnerSubmissionReturned'] },
      },
    },
    verified: {
      on: {
        REOPEN: { guard: 'hasReopenReason', target: 'in_progress', actions: ['storeReopenReason', 'notifyOwnerReopened'] },
      },
    },
  },
});

