import { assertEvent, assign, setup } from 'xstate';
import { z } from 'zod';
import { isCount, isNonBlank } from './payload-checks';

/*
 * Audit lifecycle: planned → fieldwork → reporting → issued → closed;
 * planned or fieldwork → cancelled.
 *
 * Effects (named actions with empty bodies; `applyEvent` returns their names
 * and the server carries them out after the transaction commits, e.g. by
 * writing outbox rows in the same transaction):
 * - `notifyAuditReportIssued` (ISSUE): mail the lead auditor, the audit team
 *   and the audited area's people that the report is issued (link to the PDF).
 * - `notifyAuditCancelled` (CANCEL): mail the lead auditor and the audit team
 *   that the audit is cancelled, with `context.cancelReason`.
 *
 * Signed event: ISSUE. The server checks the password and records the
 * signature before sending the event; the machine never looks at `password`
 * (strip it before sending so it reaches no trail entry).
 *
 * Server facts: CLOSE carries `facts.openFindingCount`, the number of this
 * audit's findings that are neither closed nor withdrawn. The server counts
 * them inside the transaction, sets `facts` itself and never takes it from the
 * request body.
 */

export const AUDIT_MACHINE_VERSION = 1;

export const AUDIT_STATES = ['planned', 'fieldwork', 'reporting', 'issued', 'closed', 'cancelled'] as const;
export type AuditState = (typeof AUDIT_STATES)[number];

export const AUDIT_EVENT_TYPES = ['START_FIELDWORK', 'FINISH_FIELDWORK', 'ISSUE', 'CLOSE', 'CANCEL'] as const;
export type AuditEventType = (typeof AUDIT_EVENT_TYPES)[number];

export const AUDIT_EFFECTS = ['notifyAuditReportIssued', 'notifyAuditCancelled'] as const;
export type AuditEffect = (typeof AUDIT_EFFECTS)[number];

/** Events that need an electronic signature, with the signature's meaning. */
export const AUDIT_SIGNED_EVENTS = { ISSUE: 'audit report issued' } as const satisfies Partial<
  Record<AuditEventType, string>
>;

/** Events only the server sends (never accepted from a request body). */
export const AUDIT_SERVER_EVENTS: readonly AuditEventType[] = [];

export const AuditContextSchema = z
  .object({
    /** Why the audit was cancelled; null unless cancelled. */
    cancelReason: z.string().nullable(),
  })
  .strict();
export type AuditContext = z.infer<typeof AuditContextSchema>;

/** Facts the server computes and sets on CLOSE. */
export interface AuditCloseFacts {
  /** Findings of this audit that are neither closed nor withdrawn. */
  openFindingCount: number;
}

export type AuditEvent =
  | { type: 'START_FIELDWORK' }
  | { type: 'FINISH_FIELDWORK' }
  | { type: 'ISSUE'; password?: string }
  | { type: 'CLOSE'; facts: AuditCloseFacts }
  | { type: 'CANCEL'; reason: string };

/** A new audit starts planned with an empty context: it needs no input. */
export type AuditInput = undefined;

export const auditMachine = setup({
  types: {
    context: {} as AuditContext,
    events: {} as AuditEvent,
    input: undefined as AuditInput,
  },
  guards: {
    hasCancelReason: ({ event }) => event.type === 'CANCEL' && isNonBlank(event.reason),
    allFindingsSettled: ({ event }) =>
      event.type === 'CLOSE' && isCount(event.facts?.openFindingCount) && event.facts.openFindingCount === 0,
  },
  actions: {
    storeCancelReason: assign({
      cancelReason: ({ event }) => {
        assertEvent(event, 'CANCEL');
        return event.reason.trim();
      },
    }),
    notifyAuditReportIssued: () => {},
    notifyAuditCancelled: () => {},
  },
}).createMachine({
  id: 'audit',
  version: String(AUDIT_MACHINE_VERSION),
  initial: 'planned',
  context: { cancelReason: null },
  states: {
    planned: {
      on: {
        START_FIELDWORK: { target: 'fieldwork' },
        CANCEL: { guard: 'hasCancelReason', target: 'cancelled', actions: ['storeCancelReason', 'notifyAuditCancelled'] },
      },
    },
    fieldwork: {
      on: {
        FINISH_FIELDWORK: { target: 'reporting' },
        CANCEL: { guard: 'hasCancelReason', target: 'cancelled', actions: ['storeCancelReason', 'notifyAuditCancelled'] },
      },
    },
    reporting: {
      on: { ISSUE: { target: 'issued', actions: 'notifyAuditReportIssued' } },
    },
    issued: {
      on: { CLOSE: { guard: 'allFindingsSettled', target: 'closed' } },
    },
    closed: { type: 'final' },
    cancelled: { type: 'final' },
  },
});

