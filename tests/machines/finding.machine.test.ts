import { describe, expect, it } from 'vitest';
import { transition } from 'xstate';
import {
  FINDING_EVENT_TYPES,
  FINDING_STATES,
  findingMachine,
  type FindingContext,
  type FindingEvent,
} from '../../machines/finding.machine';
import { recordMachines } from '../../machines';
import { describeTransitionTable, effectNamesOf, snapshotIn, type EventCase } from './helpers/transition-table';
import { replay, shortestPathByState, simplePaths } from './helpers/model-paths';

type Case = EventCase<typeof findingMachine>;

const baseContext: FindingContext = {
  class: null,
  classificationNote: null,
  containmentDescription: null,
  effectivenessNote: null,
  notEffectiveReason: null,
  closureNote: null,
  withdrawReason: null,
};

const validCases: Case[] = [
  { name: 'SUBMIT', event: { type: 'SUBMIT' } },
  { name: 'WITHDRAW with a reason', event: { type: 'WITHDRAW', reason: 'Raised against the wrong revision' } },
  { name: 'CLASSIFY major', event: { type: 'CLASSIFY', class: 'major' } },
  { name: 'CLASSIFY minor', event: { type: 'CLASSIFY', class: 'minor', note: 'Single missing record' } },
  {
    name: 'CLASSIFY observation with a note',
    event: { type: 'CLASSIFY', class: 'observation', note: 'Wording could be clearer' },
  },
  {
    name: 'RECORD_CONTAINMENT with a description',
    event: { type: 'RECORD_CONTAINMENT', description: 'Wheels inspected since 3 March quarantined', facts: { undecidedInspectionCount: 0 } },
  },
  { name: 'ACTION_VERIFIED', event: { type: 'ACTION_VERIFIED' } },
  { name: 'CONFIRM_EFFECTIVE with a note', event: { type: 'CONFIRM_EFFECTIVE', note: 'No recurrence in 20 jobs' } },
  { name: 'NOT_EFFECTIVE with a reason', event: { type: 'NOT_EFFECTIVE', reason: 'Same gap on the next audit' } },
  { name: 'CLOSE', event: { type: 'CLOSE', password: 'checked by the server' } },
];

const invalidCases: Case[] = [
  { name: 'WITHDRAW with a blank reason', event: { type: 'WITHDRAW', reason: '   ' } },
  { name: 'WITHDRAW without a reason', event: { type: 'WITHDRAW' } as FindingEvent },
  { name: 'CLASSIFY without a class', event: { type: 'CLASSIFY' } as FindingEvent },
  { name: 'CLASSIFY with an unknown class', event: { type: 'CLASSIFY', class: 'critical' } as unknown as FindingEvent },
  { name: 'CLASSIFY observation without a note', event: { type: 'CLASSIFY', class: 'observation' } },
  { name: 'CLASSIFY observation with a blank note', event: { type: 'CLASSIFY', class: 'observation', note: ' ' } },
  { name: 'RECORD_CONTAINMENT with a blank description', event: { type: 'RECORD_CONTAINMENT', description: '\n', facts: { undecidedInspectionCount: 0 } } },
  { name: 'RECORD_CONTAINMENT without a description', event: { type: 'RECORD_CONTAINMENT', facts: { undecidedInspectionCount: 0 } } as FindingEvent },
  {
    name: 'RECORD_CONTAINMENT with undecided inspections',
    event: { type: 'RECORD_CONTAINMENT', description: 'Parts quarantined', facts: { undecidedInspectionCount: 3 } },
  },
  {
    name: 'RECORD_CONTAINMENT without the server facts',
    event: { type: 'RECORD_CONTAINMENT', description: 'Parts quarantined' } as FindingEvent,
  },
  { name: 'CONFIRM_EFFECTIVE with a blank note', event: { type: 'CONFIRM_EFFECTIVE', note: '' } },
  { name: 'NOT_EFFECTIVE with a blank reason', event: { type: 'NOT_EFFECTIVE', reason: ' ' } },
];

describeTransitionTable({
  machine: findingMachine,
  states: FINDING_STATES,
  eventTypes: FINDING_EVENT_TYPES,
  baseContext,
  validCases,
  invalidCases,
  allowedEvents: (snapshot) => recordMachines.finding.allowedEvents(snapshot, { undecidedInspectionCount: 0 }),
  expected: {
    raised: {
      SUBMIT: ['in_review', 'notifyFindingSubmitted'],
      'WITHDRAW with a reason': ['withdrawn', 'notifyFindingWithdrawn'],
    },
    in_review: {
      'WITHDRAW with a reason': ['withdrawn', 'notifyFindingWithdrawn'],
      'CLASSIFY major': ['containment'],
      'CLASSIFY minor': ['action_open', 'notifyActionNeeded'],
      'CLASSIFY observation with a note': ['closed', 'notifyFindingClosed'],
    },
    containment: { 'RECORD_CONTAINMENT with a description': ['action_open', 'notifyActionNeeded'] },
    action_open: { ACTION_VERIFIED: ['effectiveness_check', 'notifyEffectivenessCheckDue'] },
    effectiveness_check: {
      'CONFIRM_EFFECTIVE with a note': ['awaiting_signoff', 'notifyAwaitingSignoff'],
      'NOT_EFFECTIVE with a reason': ['action_open', 'requestReopenOfAction'],
    },
    awaiting_signoff: { CLOSE: ['closed', 'notifyFindingClosed'] },
  },
});

const inReview = () => snapshotIn(findingMachine, 'in_review', baseContext);

describe('finding guards', () => {
  it('when CLASSIFY has no class, then the finding stays in review unclassified', () => {
    const [next, actions] = transition(findingMachine, inReview(), { type: 'CLASSIFY' } as FindingEvent);
    expect(next.value).toBe('in_review');
    expect(next.context.class).toBeNull();
    expect(effectNamesOf(actions)).toEqual([]);
  });

  it('when an observation has no note, then it is refused; with a note it closes at once and keeps the note', () => {
    expect(inReview().can({ type: 'CLASSIFY', class: 'observation' })).toBe(false);
    const [next] = transition(findingMachine, inReview(), {
      type: 'CLASSIFY',
      class: 'observation',
      note: ' Suggest a clearer sketch of the probe path ',
    });
    expect(next.value).toBe('closed');
    expect(next.status).toBe('done');
    expect(next.context).toMatchObject({
      class: 'observation',
      closureNote: 'Suggest a clearer sketch of the probe path',
      classificationNote: 'Suggest a clearer sketch of the probe path',
    });
  });

  it('when a major finding has no containment description, then it cannot leave containment', () => {
    const containment = snapshotIn(findingMachine, 'containment', { ...baseContext, class: 'major' });
    const decided = { undecidedInspectionCount: 0 };
    for (const event of [
      { type: 'RECORD_CONTAINMENT', description: '', facts: decided },
      { type: 'RECORD_CONTAINMENT', description: '   ', facts: decided },
      { type: 'ACTION_VERIFIED' },
      { type: 'CONFIRM_EFFECTIVE', note: 'skip ahead' },
      { type: 'CLOSE' },
    ] as FindingEvent[]) {
      expect(transition(findingMachine, containment, event)[0].value, event.type).toBe('containment');
    }
    const [next] = transition(findingMachine, containment, {
      type: 'RECORD_CONTAINMENT',
      description: 'Technique suspended; parts since last calibration quarantined',
      facts: decided,
    });
    expect(next.value).toBe('action_open');
    expect(next.context.containmentDescription).toBe('Technique suspended; parts since last calibration quarantined');
  });

  it('when past inspections are still undecided, then containment cannot be recorded; the allowed events say so too', () => {
    const containment = snapshotIn(findingMachine, 'containment', { ...baseContext, class: 'major' });
    const event = { type: 'RECORD_CONTAINMENT', description: 'Parts quarantined' } as const;
    expect(transition(findingMachine, containment, { ...event, facts: { undecidedInspectionCount: 1 } })[0].value).toBe('containment');
    expect(transition(findingMachine, containment, { ...event, facts: { undecidedInspectionCount: -1 } })[0].value).toBe('containment');
    expect(transition(findingMachine, containment, { ...event, facts: { undecidedInspectionCount: 0 } })[0].value).toBe('action_open');
    expect(recordMachines.finding.allowedEvents(containment, { undecidedInspectionCount: 2 })).toEqual([]);
    expect(recordMachines.finding.allowedEvents(containment, { undecidedInspectionCount: 0 })).toEqual(['RECORD_CONTAINMENT']);
  });

  it('when a major or minor finding is classified, then class and optional note are stored', () => {
    const [major] = transition(findingMachine, inReview(), { type: 'CLASSIFY', class: 'major' });
    expect(major.context).toMatchObject({ class: 'major', classificationNote: null, closureNote: null });
    const [minor] = transition(findingMachine, inReview(), { type: 'CLASSIFY', class: 'minor', note: 'isolated' });
    expect(minor.context).toMatchObject({ class: 'minor', classificationNote: 'isolated', closureNote: null });
  });

  it('when the effectiveness check fails, then the reason is kept and the action is to be reopened', () => {
    const check = snapshotIn(findingMachine, 'effectiveness_check', { ...baseContext, class: 'minor' });
    const [next, actions] = transition(findingMachine, check, { type: 'NOT_EFFECTIVE', reason: 'Recurred in May' });
    expect(next.value).toBe('action_open');
    expect(next.context.notEffectiveReason).toBe('Recurred in May');
    expect(effectNamesOf(actions)).toEqual(['requestReopenOfAction']);
  });

  it('when a finding is withdrawn, then the trimmed reason is kept and nothing more is accepted', () => {
    const [next] = transition(findingMachine, snapshotIn(findingMachine, 'raised', baseContext), {
      type: 'WITHDRAW',
      reason: ' duplicate of F-12 ',
    });
    expect(next.context.withdrawReason).toBe('duplicate of F-12');
    expect(next.status).toBe('done');
    for (const { event } of validCases) expect(next.can(event)).toBe(false);
  });
});

describe('finding model paths', () => {
  const events = validCases.map((eventCase) => eventCase.event);

  it('reach every state; an observation closes in two steps, skipping the corrective action', () => {
    const byState = shortestPathByState(findingMachine, events);
    expect([...byState.keys()].sort()).toEqual([...FINDING_STATES].sort());
    expect(byState.get('closed')?.labels).toEqual(['SUBMIT', 'CLASSIFY observation']);
    expect(byState.get('containment')?.labels).toEqual(['SUBMIT', 'CLASSIFY major']);
    expect(byState.get('awaiting_signoff')?.labels).toEqual([
      'SUBMIT',
      'CLASSIFY minor',
      'ACTION_VERIFIED',
      'CONFIRM_EFFECTIVE',
    ]);
  });

  it('every simple path replays through the runtime to the same state', () => {
    for (const path of simplePaths(findingMachine, events)) {
      const result = replay(findingMachine, path.events);
      expect(result.refused, path.labels.join(' → ')).toEqual([]);
      expect(result.state).toBe(path.state);
    }
  });

  it('on every path a major finding records containment, and a signed closure follows a verified action', () => {
    const paths = simplePaths(findingMachine, events);
    const closedPaths = paths.filter((path) => path.state === 'closed');
    expect(closedPaths.map((path) => path.labels.join(' → ')).sort()).toEqual([
      'SUBMIT → CLASSIFY major → RECORD_CONTAINMENT → ACTION_VERIFIED → CONFIRM_EFFECTIVE → CLOSE',
      'SUBMIT → CLASSIFY minor → ACTION_VERIFIED → CONFIRM_EFFECTIVE → CLOSE',
      'SUBMIT → CLASSIFY observation',
    ]);
    for (const path of paths) {
      const major = path.labels.indexOf('CLASSIFY major');
      if (major >= 0 && path.labels.length > major + 1) expect(path.labels[major + 1]).toBe('RECORD_CONTAINMENT');
    }
  });

  it('a failed effectiveness check sends the finding back to wait for the reopened action', () => {
    const result = replay(findingMachine, [
      { type: 'SUBMIT' },
      { type: 'CLASSIFY', class: 'minor' },
      { type: 'ACTION_VERIFIED' },
      { type: 'NOT_EFFECTIVE', reason: 'Recurred' },
      { type: 'ACTION_VERIFIED' },
      { type: 'CONFIRM_EFFECTIVE', note: 'Holds now' },
      { type: 'CLOSE' },
    ]);
    expect(result).toEqual({
      state: 'closed',
      refused: [],
      effects: [
        'notifyFindingSubmitted',
        'notifyActionNeeded',
        'notifyEffectivenessCheckDue',
        'requestReopenOfAction',
        'notifyEffectivenessCheckDue',
        'notifyAwaitingSignoff',
        'notifyFindingClosed',
      ],
    });
  });
});
