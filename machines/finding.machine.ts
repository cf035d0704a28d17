import { assertEvent, assign, setup } from 'xstate';
import { z } from 'zod';
import { isCount, isNonBlank } from './payload-checks';

/*
 * Finding (nonconformance) lifecycle: raised → in_review → withdrawn, or
 * classified: major → containment → action_open; minor → action_open;
 * observation → closed at once. action_open → effectiveness_check →
 * awaiting_signoff → closed; a failed effectiveness check goes back to
 * action_open and reopens the corrective action.
 *
 * Effects (named actions with empty bodies; `applyEvent` returns their names
 * and the server carries them out, details from the event it sent and the new
 * context):
 * - `notifyFindingSubmitted` (SUBMIT): mail the quality managers that a
 *   finding waits for classification.
 * - `notifyFindingWithdrawn` (WITHDRAW): mail the author and the audit's lead
 *   auditor, with `context.withdrawReason`.
 * - `notifyActionNeeded` (CLASSIFY minor, RECORD_CONTAINMENT): mail the
 *   quality managers that the finding needs a corrective action assigned
 *   (`POST /api/actions`).
 * - `notifyEffectivenessCheckDue` (ACTION_VERIFIED): mail the finding's author
 *   (an auditor) that the corrective action is verified and its effectiveness
 *   needs checking.
 * - `requestReopenOfAction` (NOT_EFFECTIVE): send `REOPEN { reason }` (reason =
 *   `context.notEffectiveReason`) to the finding's verified corrective action,
 *   in the same transaction as this transition.
 * - `notifyAwaitingSignoff` (CONFIRM_EFFECTIVE): mail the accountable managers
 *   that the finding awaits their signature.
 * - `notifyFindingClosed` (CLOSE, CLASSIFY observation): mail the author and
 *   the audit's lead auditor (the audit may now be closable).
 *
 * Server facts: RECORD_CONTAINMENT carries `facts.undecidedInspectionCount`,
 * the past inspections this (major) finding puts in doubt that have no
 * containment decision yet. The server counts them inside the transaction and
 * sets `facts` itself; containment cannot be recorded while any is undecided.
 *
 * Signed event: CLOSE. The server checks the password and records the
 * signature first; the machine never looks at `password`.
 * Server-only event: ACTION_VERIFIED (sent when the action reaches verified).
 */

export const FINDING_MACHINE_VERSION = 1;

export const FINDING_STATES = [
  'raised', 'in_review', 'withdrawn', 'containment', 'action_open', 'effectiveness_check', 'awaiting_signoff', 'closed',
] as const;
export type FindingState = (typeof FINDING_STATES)[number];

export const FINDING_EVENT_TYPES = [
  'SUBMIT', 'WITHDRAW', 'CLASSIFY', 'RECORD_CONTAINMENT', 'ACTION_VERIFIED', 'CONFIRM_EFFECTIVE', 'NOT_EFFECTIVE', 'CLOSE',
] as const;
export type FindingEventType = (typeof FINDING_EVENT_TYPES)[number];

export const FINDING_CLASSES = ['major', 'minor', 'observation'] as const;
export type FindingClass = (typeof FINDING_CLASSES)[number];

export const FINDING_EFFECTS = [
  'notifyFindingSubmitted',
  'notifyFindingWithdrawn',
  'notifyActionNeeded',
  'notifyEffectivenessCheckDue',
  'requestReopenOfAction',
  'notifyAwaitingSignoff',
  'notifyFindingClosed',
] as const;
export type FindingEffect = (typeof FINDING_EFFECTS)[number];

export const FINDING_SIGNED_EVENTS = { CLOSE: 'closure approved' } as const satisfies Partial<
  Record<FindingEventType, string>
>;

export const FINDING_SERVER_EVENTS: readonly FindingEventType[] = ['ACTION_VERIFIED'];

export const FindingContextSchema = z
  .object({
    class: z.enum(FINDING_CLASSES).nullable(),
    /** The quality manager's note given with the classification, if any. */
    classificationNote: z.string().nullable(),
    /** What was done at once on a major finding (parts quarantined, technique suspended). */
    containmentDescription: z.string().nullable(),
    /** Why the effectiveness check passed. */
    effectivenessNote: z.string().nullable(),
    /** Why the last effectiveness check failed. */
    notEffectiveReason: z.string().nullable(),
    /** The note that closed an observation. */
    closureNote: z.string().nullable(),
    withdrawReason: z.string().nullable(),
  })
  .strict();
export type FindingContext = z.infer<typeof FindingContextSchema>;

export type FindingEvent =
  | { type: 'SUBMIT' }
  | { type: 'WITHDRAW'; reason: string }
  | { type: 'CLASSIFY'; class: FindingClass; note?: string }
  | { type: 'RECORD_CONTAINMENT'; description: string; facts: FindingContainmentFacts }
  | { type: 'ACTION_VERIFIED' }
  | { type: 'CONFIRM_EFFECTIVE'; note: string }
  | { type: 'NOT_EFFECTIVE'; reason: string }
  | { type: 'CLOSE'; password?: string };

export interface FindingContainmentFacts {
  undecidedInspectionCount: number;
}

/** A new finding starts raised with an empty context: it needs no input. */
export type FindingInput = undefined;

const withdraw = {
  guard: 'hasWithdrawReason',
  target: 'withdrawn',
  actions: ['storeWithdrawReason', 'notifyFindingWithdrawn'],
} as const;

export const findingMachine = setup({
  types: {
    context: {} as FindingContext,
    events: {} as FindingEvent,
    input: undefined as FindingInput,
  },
  guards: {
    hasWithdrawReason: ({ event }) => event.type === 'WITHDRAW' && isNonBlank(event.reason),
    classifiedMajor: ({ event }) => event.type === 'CLASSIFY' && event.class === 'major',
    classifiedMinor: ({ event }) => event.type === 'CLASSIFY' && event.class === 'minor',
    observationWithNote: ({ event }) =>
      event.type === 'CLASSIFY' && event.class === 'observation' && isNonBlank(event.note),
    containmentDescribedAndDecided: ({ event }) =>
      event.type === 'RECORD_CONTAINMENT' &&
      isNonBlank(event.description) &&
      isCount(event.facts?.undecidedInspectionCount) &&
      event.facts.undecidedInspectionCount === 0,
    hasEffectivenessNote: ({ event }) => event.type === 'CONFIRM_EFFECTIVE' && isNonBlank(event.note),
    hasNotEffectiveReason: ({ event }) => event.type === 'NOT_EFFECTIVE' && isNonBlank(event.reason),
  },
  actions: {
    storeWithdrawReason: assign({
      withdrawReason: ({ event }) => {
        assertEvent(event, 'WITHDRAW');
        return event.reason.trim();
      },
    }),
    storeClassification: assign(({ event }) => {
      assertEvent(event, 'CLASSIFY');
      return { class: event.class, classificationNote: isNonBlank(event.note) ? event.note.trim() : null };
    }),
    storeObservationClosure: assign({
      closureNote: ({ event }) => {
        assertEvent(event, 'CLASSIFY');
        return isNonBlank(event.note) ? event.note.trim() : null;
      },
    }),
    storeContainment: assign({
      containmentDescription: ({ event }) => {
        assertEvent(event, 'RECORD_CONTAINMENT');
        return event.description.trim();
      },
    }),
    storeEffectivenessNote: assign({
      effectivenessNote: ({ event }) => {
        assertEvent(event, 'CONFIRM_EFFECTIVE');
        return event.note.trim();
      },
    }),
    storeNotEffectiveReason: assign({
      notEffectiveReason: ({ event }) => {
        assertEvent(event, 'NOT_EFFECTIVE');
        return event.reason.trim();
      },
    }),
    notifyFindingSubmitted: () => {},
    notifyFindingWithdrawn: () => {},
    notifyActionNeeded: () => {},
    notifyEffectivenessCheckDue: () => {},
    requestReopenOfAction: () => {},
    notifyAwaitingSignoff: () => {},
    notifyFindingClosed: () => {},
  },
}).createMachine({
  id: 'finding',
  version: String(FINDING_MACHINE_VERSION),
  initial: 'raised',
  context: {
    class: null,
    classificationNote: null,
    containmentDescription: null,
    effectivenessNote: null,
    notEffectiveReason: null,
    closureNote: null,
    withdrawReason: null,
  },
  states: {
    raised: {
      on: {
        SUBMIT: { target: 'in_review', actions: 'notifyFindingSubmitted' },
        WITHDRAW: withdraw,
      },
    },
    in_review: {
      on: {
        WITHDRAW: withdraw,
        // No class, or an observation without a note, matches no branch: refused.
        CLASSIFY: [
          { guard: 'classifiedMajor', target: 'containment', actions: 'storeClassification' },
          { guard: 'classifiedMinor', target: 'action_open', actions: ['storeClassification', 'notifyActionNeeded'] },
          {
            guard: 'observationWithNote',
            target: 'closed',
            actions: ['storeClassification', 'storeObservationClosure', 'notifyFindingClosed'],
          },
        ],
      },
    },
    containment: {
      on: {
        RECORD_CONTAINMENT: {
          guard: 'containmentDescribedAndDecided',
          target: 'action_open',
          actions: ['storeContainment', 'notifyActionNeeded'],
        },
      },
    },
    action_open: {
      on: { ACTION_VERIFIED: { target: 'effectiveness_check', actions: 'notifyEffectivenessCheckDue' } },
    },
    effectiveness_check: {
      on: {
        CONFIRM_EFFECTIVE: {
          guard: 'hasEffectivenessNote',
          target: 'awaiting_signoff',
          actions: ['storeEffectivenessNote', 'notifyAwaitingSignoff'],
        },
        NOT_EFFECTIVE: {
          guard: 'hasNotEffectiveReason',
          target: 'action_open',
          actions: ['storeNotEffectiveReason', 'requestReopenOfAction'],
        },
      },
    },
    awaiting_signoff: {
      on: { CLOSE: { target: 'closed', actions: 'notifyFindingClosed' } },
    },
    withdrawn: { type: 'final' },
    closed: { type: 'final' },
  },
});

