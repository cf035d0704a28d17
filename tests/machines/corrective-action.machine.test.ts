import { describe, expect, it } from 'vitest';
import { transition } from 'xstate';
import {
  CORRECTIVE_ACTION_EVENT_TYPES,
  CORRECTIVE_ACTION_STATES,
  correctiveActionMachine,
  type CorrectiveActionContext,
  type CorrectiveActionEvent,
} from '../../machines/corrective-action.machine';
import { recordMachines } from '../../machines';
import { describeTransitionTable, effectNamesOf, snapshotIn, type EventCase } from './helpers/transition-table';
import { replay, shortestPathByState, simplePaths } from './helpers/model-paths';

type Case = EventCase<typeof correctiveActionMachine>;
type Event = CorrectiveActionEvent;

const baseContext: CorrectiveActionContext = {
  dueDate: '2026-06-30',
  pendingExtension: null,
  method: null,
  rootCause: null,
  plan: [],
  submissionSummary: null,
  returnReason: null,
  reopenReason: null,
};

const pending = { pendingExtension: { dueDate: '2026-07-31', reason: 'Probe on back-order' } };

const completePlan: Event = {
  type: 'SUBMIT_PLAN',
  method: 'five_whys',
  rootCause: 'The technique sheet never named the scan direction for radial cracks',
  plan: [
    { description: 'Revise the technique with a second, perpendicular scan', dueDate: '2026-05-15' },
    { description: 'Brief all technicians on the revision', dueDate: '2026-05-30' },
  ],
};

const validCases: Case[] = [
  { name: 'START', event: { type: 'START' } },
  { name: 'SUBMIT_PLAN with a complete plan', event: completePlan },
  { name: 'APPROVE_PLAN', event: { type: 'APPROVE_PLAN' } },
  { name: 'RETURN_PLAN with a reason', event: { type: 'RETURN_PLAN', reason: 'Root cause stops at the symptom' } },
  { name: 'SUBMIT with one evidence file', event: { type: 'SUBMIT', summary: 'Revision C issued', facts: { evidenceCount: 1 } } },
  { name: 'VERIFY', event: { type: 'VERIFY', password: 'checked by the server' } },
  { name: 'RETURN with a reason', event: { type: 'RETURN', reason: 'Training record unsigned' } },
  { name: 'REOPEN with a reason', event: { type: 'REOPEN', reason: 'Gap found again' } },
  {
    name: 'REQUEST_EXTENSION for a later date',
    event: { type: 'REQUEST_EXTENSION', dueDate: '2026-07-31', reason: 'Probe on back-order' },
  },
  { name: 'APPROVE_EXTENSION of a pending request', event: { type: 'APPROVE_EXTENSION' }, context: pending },
  {
    name: 'REJECT_EXTENSION of a pending request',
    event: { type: 'REJECT_EXTENSION', reason: 'Borrow a probe from the Structures Bay' },
    context: pending,
  },
];

const invalidCases: Case[] = [
  { name: 'SUBMIT_PLAN with an empty plan', event: { ...completePlan, plan: [] } as Event },
  { name: 'SUBMIT_PLAN without a plan', event: { ...completePlan, plan: undefined } as unknown as Event },
  { name: 'SUBMIT_PLAN with a blank root cause', event: { ...completePlan, rootCause: '  ' } as Event },
  { name: 'SUBMIT_PLAN with an unknown method', event: { ...completePlan, method: 'guesswork' } as unknown as Event },
  {
    name: 'SUBMIT_PLAN with a step without description',
    event: { ...completePlan, plan: [{ description: ' ', dueDate: '2026-05-15' }] } as Event,
  },
  {
    name: 'SUBMIT_PLAN with a step on a date that does not exist',
    event: { ...completePlan, plan: [{ description: 'Revise', dueDate: '2026-02-30' }] } as Event,
  },
  {
    // The action is due on 2026-06-30 (baseContext): a plan item cannot fall due after the action itself.
    name: 'SUBMIT_PLAN with a step due after the action',
    event: { ...completePlan, plan: [{ description: 'Revise', dueDate: '2026-07-01' }] } as Event,
  },
  { name: 'RETURN_PLAN with a blank reason', event: { type: 'RETURN_PLAN', reason: ' ' } },
  { name: 'RETURN_PLAN without a reason', event: { type: 'RETURN_PLAN' } as Event },
  { name: 'SUBMIT with no evidence', event: { type: 'SUBMIT', summary: 'Done', facts: { evidenceCount: 0 } } },
  { name: 'SUBMIT without facts', event: { type: 'SUBMIT', summary: 'Done' } as Event },
  { name: 'SUBMIT with a blank summary', event: { type: 'SUBMIT', summary: '', facts: { evidenceCount: 3 } } },
  { name: 'RETURN with a blank reason', event: { type: 'RETURN', reason: '' } },
  { name: 'RETURN without a reason', event: { type: 'RETURN' } as Event },
  { name: 'REOPEN with a blank reason', event: { type: 'REOPEN', reason: ' ' } },
  {
    name: 'REQUEST_EXTENSION for the current due date',
    event: { type: 'REQUEST_EXTENSION', dueDate: '2026-06-30', reason: 'More time' },
  },
  {
    name: 'REQUEST_EXTENSION for an earlier date',
    event: { type: 'REQUEST_EXTENSION', dueDate: '2026-06-01', reason: 'More time' },
  },
  {
    name: 'REQUEST_EXTENSION for a malformed date',
    event: { type: 'REQUEST_EXTENSION', dueDate: '31/07/2026', reason: 'More time' },
  },
  {
    name: 'REQUEST_EXTENSION with a blank reason',
    event: { type: 'REQUEST_EXTENSION', dueDate: '2026-07-31', reason: ' ' },
  },
  {
    name: 'REQUEST_EXTENSION while another is pending',
    event: { type: 'REQUEST_EXTENSION', dueDate: '2026-08-31', reason: 'Even more time' },
    context: pending,
  },
  { name: 'APPROVE_EXTENSION with nothing pending', event: { type: 'APPROVE_EXTENSION' } },
  { name: 'REJECT_EXTENSION with nothing pending', event: { type: 'REJECT_EXTENSION', reason: 'No' } },
  {
    name: 'REJECT_EXTENSION with a blank reason',
    event: { type: 'REJECT_EXTENSION', reason: '' },
    context: pending,
  },
];

const extensionOutcomes = {
  'REQUEST_EXTENSION for a later date': ['notifyReviewerExtensionRequested'],
  'APPROVE_EXTENSION of a pending request': ['notifyOwnerExtensionApproved'],
  'REJECT_EXTENSION of a pending request': ['notifyOwnerExtensionRejected'],
} as const;

const staysIn = (state: string) =>
  Object.fromEntries(Object.entries(extensionOutcomes).map(([name, effects]) => [name, [state, ...effects] as const]));

describeTransitionTable({
  machine: correctiveActionMachine,
  states: CORRECTIVE_ACTION_STATES,
  eventTypes: CORRECTIVE_ACTION_EVENT_TYPES,
  baseContext,
  validCases,
  invalidCases,
  allowedEvents: (snapshot) => recordMachines.action.allowedEvents(snapshot, { evidenceCount: 1 }),
  expected: {
    assigned: { START: ['investigating'] },
    investigating: {
      'SUBMIT_PLAN with a complete plan': ['plan_review', 'notifyReviewerPlanSubmitted'],
      ...staysIn('investigating'),
    },
    plan_review: {
      APPROVE_PLAN: ['in_progress', 'notifyOwnerPlanApproved'],
      'RETURN_PLAN with a reason': ['investigating', 'notifyOwnerPlanReturned'],
    },
    in_progress: {
      'SUBMIT with one evidence file': ['submitted', 'notifyReviewerEvidenceSubmitted'],
      ...staysIn('in_progress'),
    },
    submitted: {
      VERIFY: ['verified', 'markFindingActionVerified'],
      'RETURN with a reason': ['in_progress', 'notifyOwnerSubmissionReturned'],
    },
    verified: { 'REOPEN with a reason': ['in_progress', 'notifyOwnerReopened'] },
  },
});

const inState = (state: string, context: Partial<CorrectiveActionContext> = {}) =>
  snapshotIn(correctiveActionMachine, state, { ...baseContext, ...context });

describe('corrective action guards', () => {
  it('when an extension is requested, then the due date changes only once it is approved', () => {
    const [requested, requestActions] = transition(correctiveActionMachine, inState('in_progress'), {
      type: 'REQUEST_EXTENSION',
      dueDate: '2026-07-31',
      reason: ' Probe on back-order ',
    });
    expect(requested.value).toBe('in_progress');
    expect(requested.context.dueDate).toBe('2026-06-30');
    expect(requested.context.pendingExtension).toEqual({ dueDate: '2026-07-31', reason: 'Probe on back-order' });
    expect(effectNamesOf(requestActions)).toEqual(['notifyReviewerExtensionRequested']);

    const [approved] = transition(correctiveActionMachine, requested, { type: 'APPROVE_EXTENSION' });
    expect(approved.context.dueDate).toBe('2026-07-31');
    expect(approved.context.pendingExtension).toBeNull();
    expect(approved.can({ type: 'APPROVE_EXTENSION' })).toBe(false);
  });

  it('when an extension is rejected, then the due date stays and the request is cleared', () => {
    const [rejected] = transition(correctiveActionMachine, inState('investigating', pending), {
      type: 'REJECT_EXTENSION',
      reason: 'Use the spare probe',
    });
    expect(rejected.value).toBe('investigating');
    expect(rejected.context.dueDate).toBe('2026-06-30');
    expect(rejected.context.pendingExtension).toBeNull();
    expect(rejected.can({ type: 'REQUEST_EXTENSION', dueDate: '2026-07-15', reason: 'Second try' })).toBe(true);
  });

  it('when a plan is submitted, then method, trimmed root cause and steps are stored and a return reason cleared', () => {
    const [next] = transition(correctiveActionMachine, inState('investigating', { returnReason: 'Too vague' }), {
      ...completePlan,
      rootCause: `  ${(completePlan as { rootCause: string }).rootCause}  `,
    } as Event);
    expect(next.value).toBe('plan_review');
    expect(next.context).toMatchObject({
      method: 'five_whys',
      rootCause: 'The technique sheet never named the scan direction for radial cracks',
      returnReason: null,
    });
    expect(next.context.plan).toHaveLength(2);
  });

  it('when a plan or a submission is returned without a reason, then it is refused; with one, the reason is kept', () => {
    expect(inState('plan_review').can({ type: 'RETURN_PLAN', reason: '' })).toBe(false);
    expect(inState('submitted').can({ type: 'RETURN', reason: '   ' })).toBe(false);
    const [returned] = transition(correctiveActionMachine, inState('submitted'), { type: 'RETURN', reason: 'Unsigned' });
    expect(returned.value).toBe('in_progress');
    expect(returned.context.returnReason).toBe('Unsigned');
  });

  it('when evidenceCount is 0, then SUBMIT is refused; with evidence the summary is kept', () => {
    const inProgress = inState('in_progress');
    expect(inProgress.can({ type: 'SUBMIT', summary: 'Done', facts: { evidenceCount: 0 } })).toBe(false);
    const [submitted] = transition(correctiveActionMachine, inProgress, {
      type: 'SUBMIT',
      summary: ' Revision C issued and briefed ',
      facts: { evidenceCount: 2 },
    });
    expect(submitted.value).toBe('submitted');
    expect(submitted.context.submissionSummary).toBe('Revision C issued and briefed');
  });

  it('when the action is verified, then a still-pending extension is dropped; REOPEN keeps its reason', () => {
    const [verified] = transition(correctiveActionMachine, inState('submitted', pending), { type: 'VERIFY' });
    expect(verified.value).toBe('verified');
    expect(verified.status).toBe('active');
    expect(verified.context.pendingExtension).toBeNull();
    const [reopened] = transition(correctiveActionMachine, verified, { type: 'REOPEN', reason: 'Recurred in May' });
    expect(reopened.value).toBe('in_progress');
    expect(reopened.context.reopenReason).toBe('Recurred in May');
  });
});

describe('corrective action model paths', () => {
  const events = validCases.map((eventCase) => eventCase.event);
  const input = { dueDate: '2026-06-30' };

  it('reach every state by the shortest route', () => {
    const byState = shortestPathByState(correctiveActionMachine, events, input);
    expect([...byState.keys()].sort()).toEqual([...CORRECTIVE_ACTION_STATES].sort());
    expect(byState.get('verified')?.labels).toEqual(['START', 'SUBMIT_PLAN', 'APPROVE_PLAN', 'SUBMIT', 'VERIFY']);
  });

  it('every simple path replays through the runtime to the same state', () => {
    for (const path of simplePaths(correctiveActionMachine, events, input)) {
      const result = replay(correctiveActionMachine, path.events, input);
      expect(result.refused, path.labels.join(' → ')).toEqual([]);
      expect(result.state).toBe(path.state);
    }
  });

  it('no path reaches verified without an approved plan and a submission', () => {
    for (const path of simplePaths(correctiveActionMachine, events, input)) {
      if (path.state !== 'verified') continue;
      const approve = path.labels.lastIndexOf('APPROVE_PLAN');
      expect(approve).toBeGreaterThan(path.labels.lastIndexOf('SUBMIT_PLAN'));
      expect(path.labels.lastIndexOf('SUBMIT')).toBeGreaterThan(approve);
    }
  });

  it('a full run with an extension, a returned plan and a reopen gives the expected effects', () => {
    const result = replay(
      correctiveActionMachine,
      [
        { type: 'START' },
        { type: 'REQUEST_EXTENSION', dueDate: '2026-07-31', reason: 'Probe on back-order' },
        { type: 'APPROVE_EXTENSION' },
        completePlan,
        { type: 'RETURN_PLAN', reason: 'Go one why deeper' },
        completePlan,
        { type: 'APPROVE_PLAN' },
        { type: 'SUBMIT', summary: 'Done', facts: { evidenceCount: 1 } },
        { type: 'VERIFY' },
        { type: 'REOPEN', reason: 'Recurred' },
      ],
      input,
    );
    expect(result).toEqual({
      state: 'in_progress',
      refused: [],
      effects: [
        'notifyOwnerAssigned',
        'notifyReviewerExtensionRequested',
        'notifyOwnerExtensionApproved',
        'notifyReviewerPlanSubmitted',
        'notifyOwnerPlanReturned',
        'notifyReviewerPlanSubmitted',
        'notifyOwnerPlanApproved',
        'notifyReviewerEvidenceSubmitted',
        'markFindingActionVerified',
        'notifyOwnerReopened',
      ],
    });
  });
});
