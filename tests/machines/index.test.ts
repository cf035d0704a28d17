import { describe, expect, it } from 'vitest';
import { transition, type AnyMachineSnapshot, type AnyStateMachine } from 'xstate';
import { RECORD_KINDS, recordMachines, createInitialSnapshot, type RecordKind } from '../../machines';
import { auditProbeEvents, correctiveActionProbeEvents, findingProbeEvents } from '../../machines/probe-events';
import { effectNamesOf } from './helpers/transition-table';

const inputs: Record<RecordKind, unknown> = { audit: undefined, finding: undefined, action: { dueDate: '2026-06-30' } };
const facts = { audit: { openFindingCount: 0 }, finding: { undecidedInspectionCount: 0 }, action: { evidenceCount: 1 } } as const;

function actionImplementations(machine: AnyStateMachine): Array<[name: string, implementation: unknown]> {
  return Object.entries(machine.implementations.actions);
}

/** An action built with assign() carries XState's built-in type; an effect is a plain function. */
function isAssign(implementation: unknown): boolean {
  return typeof implementation === 'function' && (implementation as { type?: string }).type === 'xstate.assign';
}

/** Every effect executed from any state, with the probe events and with and without a pending extension. */
function effectsSeen(kind: RecordKind): Set<string> {
  const { machine } = recordMachines[kind];
  const start = createInitialSnapshot(machine as AnyStateMachine, inputs[kind] as never);
  const seen = new Set(start.effects);
  const baseContext = (start.snapshot as AnyMachineSnapshot).context as Record<string, unknown>;
  const contexts =
    kind === 'action'
      ? [baseContext, { ...baseContext, pendingExtension: { dueDate: '2026-07-31', reason: 'Late parts' } }]
      : [baseContext];
  for (const state of recordMachines[kind].states) {
    for (const context of contexts) {
      const snapshot = (machine as AnyStateMachine).resolveState({ value: state, context });
      for (const event of probeEventsOf(kind, context)) {
        const [, actions] = transition(machine as AnyStateMachine, snapshot, event);
        for (const name of effectNamesOf(actions)) seen.add(name);
      }
    }
  }
  return seen;
}

/** The probe events the registry's allowedEvents uses, for a given context. */
function probeEventsOf(kind: RecordKind, context: Record<string, unknown>) {
  switch (kind) {
    case 'audit':
      return auditProbeEvents(context as never, facts.audit);
    case 'finding':
      return findingProbeEvents(context as never, facts.finding);
    case 'action':
      return correctiveActionProbeEvents(context as never, facts.action);
  }
}

describe('record machine registry', () => {
  it('holds the three record kinds', () => {
    expect(RECORD_KINDS).toEqual(['audit', 'finding', 'action']);
  });

  describe.each(RECORD_KINDS)('%s', (kind) => {
    const entry = recordMachines[kind];
    const machine = entry.machine as AnyStateMachine;

    it('lists exactly the machine’s states and event types, and its version', () => {
      expect([...entry.states].sort()).toEqual(Object.keys(machine.states).sort());
      expect([...entry.events].sort()).toEqual([...new Set(machine.events)].sort());
      expect(machine.version).toBe(String(entry.version));
    });

    it('keeps its states flat (one state column)', () => {
      for (const state of entry.states) expect(Object.keys(machine.states[state].states)).toEqual([]);
    });

    it('lists as effects exactly its empty-bodied actions; everything else is an assign', () => {
      const effects = actionImplementations(machine).filter(([, implementation]) => !isAssign(implementation));
      expect(effects.map(([name]) => name).sort()).toEqual([...entry.effects].sort());
      for (const [name, implementation] of effects) {
        expect(String(implementation).replace(/\s/g, ''), name).toBe('()=>{}');
      }
    });

    it('has every listed effect carried out by some transition', () => {
      expect([...effectsSeen(kind)].sort()).toEqual([...entry.effects].sort());
    });

    it('names only its own event types as signed or server-only', () => {
      for (const type of Object.keys(entry.signedEvents)) expect(entry.events).toContain(type);
      for (const type of entry.serverEvents) expect(entry.events).toContain(type);
    });

    it('accepts its own initial context with its context schema', () => {
      const start = createInitialSnapshot(machine, inputs[kind] as never);
      expect(entry.contextSchema.safeParse((start.snapshot as AnyMachineSnapshot).context).success).toBe(true);
    });

    it('offers the first event from the initial state', () => {
      const start = createInitialSnapshot(machine, inputs[kind] as never);
      const allowed = entry.allowedEvents(start.snapshot as never, facts[kind] as never) as string[];
      expect(allowed).toEqual({ audit: ['START_FIELDWORK', 'CANCEL'], finding: ['SUBMIT', 'WITHDRAW'], action: ['START'] }[kind]);
    });
  });

  it('marks the signed events of the product: issuing a report, closing a finding, verifying an action', () => {
    expect(recordMachines.audit.signedEvents).toEqual({ ISSUE: 'audit report issued' });
    expect(recordMachines.finding.signedEvents).toEqual({ CLOSE: 'closure approved' });
    expect(recordMachines.action.signedEvents).toEqual({ VERIFY: 'corrective action verified' });
    expect(recordMachines.finding.serverEvents).toEqual(['ACTION_VERIFIED']);
    expect(recordMachines.action.serverEvents).toEqual(['REOPEN']);
  });
});
