import { describe, expect, it } from 'vitest';
import type { AnyStateMachine, EventFromLogic, InputFrom } from 'xstate';
import { auditMachine } from '../../machines/audit.machine';
import { correctiveActionMachine, type CorrectiveActionContext } from '../../machines/corrective-action.machine';
import { findingMachine } from '../../machines/finding.machine';
import {
  allowedEventsFor,
  allowedEventTypes,
  applyEvent,
  canSend,
  createInitialSnapshot,
  eventTypesFromState,
  persistSnapshot,
  recordMachines,
  restoreRecordSnapshot,
  restoreSnapshot,
  SnapshotRestoreError,
  stateOf,
  type RecordKind,
} from '../../machines';
import { shortestPaths } from './helpers/model-paths';
import { snapshotIn } from './helpers/transition-table';

const actionInput = { dueDate: '2026-06-30' };

const actionContext: CorrectiveActionContext = {
  dueDate: '2026-06-30',
  pendingExtension: null,
  method: null,
  rootCause: null,
  plan: [],
  submissionSummary: null,
  returnReason: null,
  reopenReason: null,
};

const findingContext = createInitialSnapshot(findingMachine).snapshot.context;

const facts = { audit: { openFindingCount: 0 }, finding: {}, action: { evidenceCount: 1 } } as const;

/** Snapshots in every state of a machine, reached by real events from its first state. */
function snapshotsInEveryState<M extends AnyStateMachine>(kind: RecordKind, machine: M, input?: InputFrom<M>) {
  const start = createInitialSnapshot(machine, ...([input] as [InputFrom<M>]));
  const events = samplePathEvents(kind) as unknown as ReadonlyArray<EventFromLogic<M>>;
  return shortestPaths(machine, events, input).map((path) => {
    let snapshot = start.snapshot;
    for (const event of path.events) snapshot = applyEvent(machine, snapshot, event).snapshot;
    return { state: path.state, snapshot };
  });
}

function samplePathEvents(kind: RecordKind) {
  switch (kind) {
    case 'audit':
      return [
        { type: 'START_FIELDWORK' },
        { type: 'FINISH_FIELDWORK' },
        { type: 'ISSUE' },
        { type: 'CLOSE', facts: { openFindingCount: 0 } },
        { type: 'CANCEL', reason: 'Area closed' },
      ];
    case 'finding':
      return [
        { type: 'SUBMIT' },
        { type: 'WITHDRAW', reason: 'Duplicate' },
        { type: 'CLASSIFY', class: 'major', note: 'Cracks may have been missed' },
        { type: 'CLASSIFY', class: 'observation', note: 'Wording' },
        { type: 'RECORD_CONTAINMENT', description: 'Parts quarantined', facts: { undecidedInspectionCount: 0 } },
        { type: 'ACTION_VERIFIED' },
        { type: 'CONFIRM_EFFECTIVE', note: 'Holds' },
        { type: 'NOT_EFFECTIVE', reason: 'Recurred' },
        { type: 'CLOSE' },
      ];
    case 'action':
      return [
        { type: 'START' },
        { type: 'REQUEST_EXTENSION', dueDate: '2026-07-31', reason: 'Probe on back-order' },
        {
          type: 'SUBMIT_PLAN',
          method: 'cause_and_effect',
          rootCause: 'Untrained on revision B',
          plan: [{ description: 'Train', dueDate: '2026-05-01' }],
        },
        { type: 'APPROVE_PLAN' },
        { type: 'SUBMIT', summary: 'Trained', facts: { evidenceCount: 1 } },
        { type: 'VERIFY' },
      ];
  }
}

const everyMachine = [
  { kind: 'audit' as const, machine: auditMachine, input: undefined },
  { kind: 'finding' as const, machine: findingMachine, input: undefined },
  { kind: 'action' as const, machine: correctiveActionMachine, input: actionInput },
];

describe('createInitialSnapshot', () => {
  it('when an action is created, then it starts assigned with the input due date and tells the owner', () => {
    const { snapshot, state, effects } = createInitialSnapshot(correctiveActionMachine, actionInput);
    expect(state).toBe('assigned');
    expect(snapshot.context).toEqual(actionContext);
    expect(effects).toEqual(['notifyOwnerAssigned']);
  });

  it('when an audit or a finding is created, then it needs no input and has no effect', () => {
    expect(createInitialSnapshot(auditMachine)).toMatchObject({ state: 'planned', effects: [] });
    expect(createInitialSnapshot(findingMachine)).toMatchObject({ state: 'raised', effects: [] });
  });
});

describe('applyEvent', () => {
  it('when the event is accepted, then it returns the next state and the effects to carry out', () => {
    const reporting = snapshotIn(auditMachine, 'reporting', { cancelReason: null });
    const result = applyEvent(auditMachine, reporting, { type: 'ISSUE' });
    expect(result).toMatchObject({ state: 'issued', changed: true, effects: ['notifyAuditReportIssued'] });
    expect(stateOf(result.snapshot)).toBe('issued');
  });

  it('when the event is not allowed now, then it returns the same snapshot, unchanged, without effects', () => {
    const planned = snapshotIn(auditMachine, 'planned', { cancelReason: null });
    const result = applyEvent(auditMachine, planned, { type: 'CANCEL', reason: ' ' });
    expect(result).toEqual({ snapshot: planned, state: 'planned', changed: false, effects: [] });
  });

  it('when an event stays in the same state, then it still counts as changed', () => {
    const investigating = snapshotIn(correctiveActionMachine, 'investigating', actionContext);
    const result = applyEvent(correctiveActionMachine, investigating, {
      type: 'REQUEST_EXTENSION',
      dueDate: '2026-07-31',
      reason: 'Probe on back-order',
    });
    expect(result).toMatchObject({ state: 'investigating', changed: true, effects: ['notifyReviewerExtensionRequested'] });
    expect(result.snapshot.context.pendingExtension).toEqual({ dueDate: '2026-07-31', reason: 'Probe on back-order' });
  });

  it('when the record is in a final state, then nothing is accepted', () => {
    const closed = snapshotIn(findingMachine, 'closed', findingContext);
    expect(closed.status).toBe('done');
    expect(applyEvent(findingMachine, closed, { type: 'CLOSE' }).changed).toBe(false);
  });

  it('when a snapshot of another machine is passed, then it throws instead of guessing', () => {
    const finding = createInitialSnapshot(findingMachine).snapshot;
    expect(() => canSend(auditMachine, finding as never, { type: 'START_FIELDWORK' })).toThrow(/finding/);
  });
});

describe('persist and restore', () => {
  for (const { kind, machine, input } of everyMachine) {
    const snapshots = snapshotsInEveryState(kind, machine, input as never);

    it(`${kind}: the sample paths reach every state`, () => {
      expect(snapshots.map((entry) => entry.state).sort()).toEqual([...recordMachines[kind].states].sort());
    });

    it.each(snapshots)(`${kind}: in $state, persisted → JSON → restored gives the same state and context`, ({ snapshot }) => {
      const json = JSON.stringify(persistSnapshot(machine, snapshot as never));
      for (const restored of [
        restoreSnapshot(machine, JSON.parse(json)),
        restoreSnapshot(machine, json),
        restoreRecordSnapshot(kind, JSON.parse(json), recordMachines[kind].version),
      ]) {
        const original = snapshot as unknown as { value: unknown; context: unknown; status: string };
        const back = restored as unknown as { value: unknown; context: unknown; status: string };
        expect(back.value).toBe(original.value);
        expect(back.context).toEqual(original.context);
        expect(back.status).toBe(original.status);
        // The restored snapshot behaves like the original for every event.
        for (const event of samplePathEvents(kind)) {
          const fromOriginal = applyEvent(machine, snapshot as never, event as never);
          const fromRestored = applyEvent(machine, restored as never, event as never);
          expect([fromRestored.state, fromRestored.changed, fromRestored.effects]).toEqual([
            fromOriginal.state,
            fromOriginal.changed,
            fromOriginal.effects,
          ]);
        }
      }
    });
  }

  it('accepts the minimal { value, context } form and recomputes a final status', () => {
    const context = createInitialSnapshot(auditMachine).snapshot.context;
    const restored = restoreRecordSnapshot('audit', { value: 'closed', context, status: 'active' }, 1);
    expect(restored.value).toBe('closed');
    expect(restored.status).toBe('done');
  });

  const context = actionContext;
  it.each([
    ['an unknown state value', { value: 'awaiting_parts', context }, /"awaiting_parts" is not one of assigned/],
    ['a nested state value', { value: { in_progress: 'x' }, context }, /is not one of/],
    ['status "error"', { value: 'in_progress', context, status: 'error' }, /status is "error"/],
    ['no context', { value: 'in_progress' }, /context is missing/],
    ['a context of the wrong shape', { value: 'in_progress', context: { ...context, dueDate: 'soon' } }, /context does not fit: dueDate: /],
    ['a context with a field this version lacks', { value: 'in_progress', context: { ...context, owner: 3 } }, /context does not fit: context: .*"owner"/],
    ['a string that is not JSON', '{"value":', /not valid JSON/],
    ['null', 'null', /not an object/],
  ])('when the stored snapshot has %s, then restoring throws SnapshotRestoreError', (_label, stored, message) => {
    const attempt = () => restoreRecordSnapshot('action', stored as never, 1);
    expect(attempt).toThrow(SnapshotRestoreError);
    expect(attempt).toThrow(message);
  });

  it('when the snapshot was stored by another machine version, then restoring throws', () => {
    const stored = persistSnapshot(auditMachine, createInitialSnapshot(auditMachine).snapshot);
    expect(() => restoreRecordSnapshot('audit', stored, 2)).toThrow(/machine version 2; the current version is 1/);
  });
});

describe('which events are open now', () => {
  it('eventTypesFromState lists the transitions out of the state, guards ignored', () => {
    expect(eventTypesFromState(snapshotIn(findingMachine, 'in_review', findingContext))).toEqual([
      'WITHDRAW',
      'CLASSIFY',
    ]);
    expect(eventTypesFromState(snapshotIn(auditMachine, 'closed', { cancelReason: null }))).toEqual([]);
  });

  it('allowedEventTypes keeps the candidate types that can() accepts, each once', () => {
    const inReview = snapshotIn(findingMachine, 'in_review', findingContext);
    expect(
      allowedEventTypes(findingMachine, inReview, [
        { type: 'CLASSIFY', class: 'observation' },
        { type: 'CLASSIFY', class: 'minor' },
        { type: 'CLASSIFY', class: 'major' },
        { type: 'WITHDRAW', reason: '' },
        { type: 'SUBMIT' },
      ]),
    ).toEqual(['CLASSIFY']);
  });

  it('allowedEventsFor uses the server facts: an audit with open findings cannot close', () => {
    const issued = snapshotIn(auditMachine, 'issued', { cancelReason: null });
    expect(allowedEventsFor('audit', issued, { openFindingCount: 0 })).toEqual(['CLOSE']);
    expect(allowedEventsFor('audit', issued, { openFindingCount: 1 })).toEqual([]);
    const planned = snapshotIn(auditMachine, 'planned', { cancelReason: null });
    expect(allowedEventsFor('audit', planned, { openFindingCount: 0 })).toEqual(['START_FIELDWORK', 'CANCEL']);
  });

  it('allowedEventsFor on an action follows evidence and the pending extension', () => {
    const inProgress = snapshotIn(correctiveActionMachine, 'in_progress', actionContext);
    expect(allowedEventsFor('action', inProgress, { evidenceCount: 0 })).toEqual(['REQUEST_EXTENSION']);
    expect(allowedEventsFor('action', inProgress, { evidenceCount: 1 })).toEqual(['SUBMIT', 'REQUEST_EXTENSION']);
    const withRequest = snapshotIn(correctiveActionMachine, 'in_progress', {
      ...actionContext,
      pendingExtension: { dueDate: '2026-07-31', reason: 'Probe on back-order' },
    });
    expect(allowedEventsFor('action', withRequest, { evidenceCount: 0 })).toEqual([
      'APPROVE_EXTENSION',
      'REJECT_EXTENSION',
    ]);
  });

  it('allowedEventsFor on a finding in review offers withdraw and classify', () => {
    const inReview = snapshotIn(findingMachine, 'in_review', findingContext);
    expect(allowedEventsFor('finding', inReview, { undecidedInspectionCount: 0 })).toEqual(['WITHDRAW', 'CLASSIFY']);
  });

  for (const { kind, machine, input } of everyMachine) {
    it(`${kind}: in every state the allowed events are among the state's transitions`, () => {
      for (const { snapshot } of snapshotsInEveryState(kind, machine, input as never)) {
        const fromState = eventTypesFromState(snapshot as never);
        const allowed = allowedEventsFor(kind, snapshot as never, facts[kind] as never) as string[];
        for (const type of allowed) expect(fromState).toContain(type);
      }
    });
  }
});
