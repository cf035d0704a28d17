// The registry of record lifecycles: one entry per record kind, with the
// machine and everything the server and client need to know about it.
import type { SnapshotFrom } from 'xstate';
import {
  AUDIT_EFFECTS,
  AUDIT_EVENT_TYPES,
  AUDIT_MACHINE_VERSION,
  AUDIT_SERVER_EVENTS,
  AUDIT_SIGNED_EVENTS,
  AUDIT_STATES,
  AuditContextSchema,
  auditMachine,
  type AuditCloseFacts,
} from './audit.machine';
import {
  CORRECTIVE_ACTION_EFFECTS,
  CORRECTIVE_ACTION_EVENT_TYPES,
  CORRECTIVE_ACTION_MACHINE_VERSION,
  CORRECTIVE_ACTION_SERVER_EVENTS,
  CORRECTIVE_ACTION_SIGNED_EVENTS,
  CORRECTIVE_ACTION_STATES,
  CorrectiveActionContextSchema,
  correctiveActionMachine,
  type CorrectiveActionSubmitFacts,
} from './corrective-action.machine';
import {
  FINDING_EFFECTS,
  FINDING_EVENT_TYPES,
  FINDING_MACHINE_VERSION,
  FINDING_SERVER_EVENTS,
  FINDING_SIGNED_EVENTS,
  FINDING_STATES,
  FindingContextSchema,
  findingMachine,
  type FindingContainmentFacts,
} from './finding.machine';
import { auditProbeEvents, correctiveActionProbeEvents, findingProbeEvents } from './probe-events';
import { allowedEventTypes, restoreSnapshot, type StoredSnapshot } from './runtime';

export * from './audit.machine';
export * from './finding.machine';
export * from './corrective-action.machine';
export * from './probe-events';
export * from './runtime';

/** Facts the server computes per record kind for `allowedEvents`. */
export interface RecordFacts {
  audit: AuditCloseFacts;
  finding: FindingContainmentFacts;
  action: CorrectiveActionSubmitFacts;
}

type AuditSnapshot = SnapshotFrom<typeof auditMachine>;
type FindingSnapshot = SnapshotFrom<typeof findingMachine>;
type CorrectiveActionSnapshot = SnapshotFrom<typeof correctiveActionMachine>;

export const recordMachines = {
  audit: {
    machine: auditMachine,
    version: AUDIT_MACHINE_VERSION,
    states: AUDIT_STATES,
    events: AUDIT_EVENT_TYPES,
    effects: AUDIT_EFFECTS,
    signedEvents: AUDIT_SIGNED_EVENTS,
    serverEvents: AUDIT_SERVER_EVENTS,
    contextSchema: AuditContextSchema,
    /** Event types the machine allows now, payload aside (see probe-events.ts). */
    allowedEvents: (snapshot: AuditSnapshot, facts: RecordFacts['audit']) =>
      allowedEventTypes(auditMachine, snapshot, auditProbeEvents(snapshot.context, facts)),
  },
  finding: {
    machine: findingMachine,
    version: FINDING_MACHINE_VERSION,
    states: FINDING_STATES,
    events: FINDING_EVENT_TYPES,
    effects: FINDING_EFFECTS,
    signedEvents: FINDING_SIGNED_EVENTS,
    serverEvents: FINDING_SERVER_EVENTS,
    contextSchema: FindingContextSchema,
    allowedEvents: (snapshot: FindingSnapshot, facts: RecordFacts['finding']) =>
      allowedEventTypes(findingMachine, snapshot, findingProbeEvents(snapshot.context, facts)),
  },
  action: {
    machine: correctiveActionMachine,
    version: CORRECTIVE_ACTION_MACHINE_VERSION,
    states: CORRECTIVE_ACTION_STATES,
    events: CORRECTIVE_ACTION_EVENT_TYPES,
    effects: CORRECTIVE_ACTION_EFFECTS,
    signedEvents: CORRECTIVE_ACTION_SIGNED_EVENTS,
    serverEvents: CORRECTIVE_ACTION_SERVER_EVENTS,
    contextSchema: CorrectiveActionContextSchema,
    allowedEvents: (snapshot: CorrectiveActionSnapshot, facts: RecordFacts['action']) =>
      allowedEventTypes(correctiveActionMachine, snapshot, correctiveActionProbeEvents(snapshot.context, facts)),
  },
} as const;

export type RecordKind = keyof typeof recordMachines;
export type RecordMachine<K extends RecordKind> = (typeof recordMachines)[K]['machine'];
export type RecordSnapshot<K extends RecordKind> = SnapshotFrom<RecordMachine<K>>;
export type RecordEventType<K extends RecordKind> = (typeof recordMachines)[K]['events'][number];

export const RECORD_KINDS = Object.keys(recordMachines) as RecordKind[];

/**
 * Restores a stored record snapshot with every check: the stored machine
 * version, the state, and the context's shape. Throws SnapshotRestoreError.
 */
export function restoreRecordSnapshot<K extends RecordKind>(
  kind: K,
  stored: StoredSnapshot | string | unknown,
  storedVersion: number,
): RecordSnapshot<K> {
  const entry = recordMachines[kind];
  return restoreSnapshot(entry.machine, stored, { storedVersion, contextSchema: entry.contextSchema }) as RecordSnapshot<K>;
}

/**
 * The event types the machine allows now for a record, payload aside, given
 * the server's facts. Combine with the role rules (CASL) to get the record's
 * `allowedEvents`, and leave out `serverEvents`, which no user sends.
 */
export function allowedEventsFor<K extends RecordKind>(
  kind: K,
  snapshot: RecordSnapshot<K>,
  facts: RecordFacts[K],
): Array<RecordEventType<K>> {
  const allowedEvents = recordMachines[kind].allowedEvents as (
    snapshot: RecordSnapshot<K>,
    facts: RecordFacts[K],
  ) => Array<RecordEventType<K>>;
  return allowedEvents(snapshot, facts);
}
