import { describe, expect, it } from 'vitest';
import { transition } from 'xstate';
import {
  AUDIT_EVENT_TYPES,
  AUDIT_STATES,
  auditMachine,
  type AuditContext,
  type AuditEvent,
} from '../../machines/audit.machine';
import { recordMachines } from '../../machines';
import { describeTransitionTable, effectNamesOf, snapshotIn, type EventCase } from './helpers/transition-table';
import { replay, shortestPathByState, simplePaths } from './helpers/model-paths';

type Case = EventCase<typeof auditMachine>;

const baseContext: AuditContext = { cancelReason: null };

const validCases: Case[] = [
  { name: 'START_FIELDWORK', event: { type: 'START_FIELDWORK' } },
  { name: 'FINISH_FIELDWORK', event: { type: 'FINISH_FIELDWORK' } },
  { name: 'ISSUE', event: { type: 'ISSUE', password: 'checked by the server' } },
  { name: 'CLOSE with every finding settled', event: { type: 'CLOSE', facts: { openFindingCount: 0 } } },
  { name: 'CANCEL with a reason', event: { type: 'CANCEL', reason: 'Area shut for refit' } },
];

const invalidCases: Case[] = [
  { name: 'CANCEL with an empty reason', event: { type: 'CANCEL', reason: '' } },
  { name: 'CANCEL with a blank reason', event: { type: 'CANCEL', reason: '  \t ' } },
  { name: 'CANCEL without a reason', event: { type: 'CANCEL' } as AuditEvent },
  { name: 'CLOSE with two open findings', event: { type: 'CLOSE', facts: { openFindingCount: 2 } } },
  { name: 'CLOSE without facts', event: { type: 'CLOSE' } as AuditEvent },
  { name: 'CLOSE with a negative count', event: { type: 'CLOSE', facts: { openFindingCount: -1 } } },
  { name: 'CLOSE with a fractional count', event: { type: 'CLOSE', facts: { openFindingCount: 0.5 } } },
];

describeTransitionTable({
  machine: auditMachine,
  states: AUDIT_STATES,
  eventTypes: AUDIT_EVENT_TYPES,
  baseContext,
  validCases,
  invalidCases,
  allowedEvents: (snapshot) => recordMachines.audit.allowedEvents(snapshot, { openFindingCount: 0 }),
  expected: {
    planned: {
      START_FIELDWORK: ['fieldwork'],
      'CANCEL with a reason': ['cancelled', 'notifyAuditCancelled'],
    },
    fieldwork: {
      FINISH_FIELDWORK: ['reporting'],
      'CANCEL with a reason': ['cancelled', 'notifyAuditCancelled'],
    },
    reporting: { ISSUE: ['issued', 'notifyAuditReportIssued'] },
    issued: { 'CLOSE with every finding settled': ['closed'] },
  },
});

describe('audit guards', () => {
  it('when the audit is cancelled with a reason, then the trimmed reason is kept', () => {
    const [next] = transition(auditMachine, snapshotIn(auditMachine, 'fieldwork', baseContext), {
      type: 'CANCEL',
      reason: '  Technique withdrawn by the customer  ',
    });
    expect(next.value).toBe('cancelled');
    expect(next.context.cancelReason).toBe('Technique withdrawn by the customer');
    expect(next.status).toBe('done');
  });

  it('when findings are still open, then CLOSE is refused and the audit stays issued', () => {
    const issued = snapshotIn(auditMachine, 'issued', baseContext);
    const [next, actions] = transition(auditMachine, issued, { type: 'CLOSE', facts: { openFindingCount: 1 } });
    expect(next.value).toBe('issued');
    expect(effectNamesOf(actions)).toEqual([]);
    expect(issued.can({ type: 'CLOSE', facts: { openFindingCount: 0 } })).toBe(true);
  });

  it('when ISSUE carries a password, then the machine neither checks nor keeps it', () => {
    const reporting = snapshotIn(auditMachine, 'reporting', baseContext);
    const [withPassword] = transition(auditMachine, reporting, { type: 'ISSUE', password: 'wrong' });
    const [withoutPassword] = transition(auditMachine, reporting, { type: 'ISSUE' });
    expect(withPassword.value).toBe('issued');
    expect(withoutPassword.value).toBe('issued');
    expect(JSON.stringify(auditMachine.getPersistedSnapshot(withPassword))).not.toContain('wrong');
  });

  it('when the audit is closed or cancelled, then it accepts no further event', () => {
    for (const state of ['closed', 'cancelled']) {
      const snapshot = snapshotIn(auditMachine, state, baseContext);
      expect(snapshot.status).toBe('done');
      for (const { event } of validCases) expect(snapshot.can(event)).toBe(false);
    }
  });
});

describe('audit model paths', () => {
  const events = validCases.map((eventCase) => eventCase.event);

  it('reach every state by the shortest route', () => {
    const byState = shortestPathByState(auditMachine, events);
    expect([...byState.keys()].sort()).toEqual([...AUDIT_STATES].sort());
    expect(byState.get('closed')?.labels).toEqual(['START_FIELDWORK', 'FINISH_FIELDWORK', 'ISSUE', 'CLOSE']);
    expect(byState.get('cancelled')?.labels).toEqual(['CANCEL']);
  });

  it('every simple path replays through the runtime to the same state', () => {
    const paths = simplePaths(auditMachine, events);
    expect(paths.length).toBeGreaterThanOrEqual(AUDIT_STATES.length);
    for (const path of paths) {
      const result = replay(auditMachine, path.events);
      expect(result.refused, path.labels.join(' → ')).toEqual([]);
      expect(result.state).toBe(path.state);
    }
  });

  it('cancellation is reachable only before reporting, and closing only through issue', () => {
    for (const path of simplePaths(auditMachine, events)) {
      if (path.state === 'cancelled') expect(path.labels).not.toContain('FINISH_FIELDWORK');
      if (path.state === 'closed') expect(path.labels).toContain('ISSUE');
    }
  });
});
