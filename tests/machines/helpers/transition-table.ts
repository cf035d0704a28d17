// Table-driven check of a flat machine: every state × every event case, with
// the pure `transition()`. A case missing from `expected` for a state means
// "not allowed": the snapshot must come back unchanged and `can` must say no.
import { describe, expect, it } from 'vitest';
import { transition, type AnyStateMachine, type ContextFrom, type EventFromLogic, type SnapshotFrom } from 'xstate';

export interface EventCase<M extends AnyStateMachine> {
  /** Unique within the spec, e.g. "CLASSIFY major". */
  name: string;
  event: EventFromLogic<M>;
  /** Context fields this case needs on top of the base context (e.g. a pending extension). */
  context?: Partial<ContextFrom<M>>;
}

/** The next state, then the side-effect actions the transition must execute, in order. */
export type Outcome = readonly [to: string, ...effects: string[]];

export interface TransitionTableSpec<M extends AnyStateMachine> {
  machine: M;
  states: readonly string[];
  eventTypes: readonly string[];
  baseContext: ContextFrom<M>;
  /** At least one case per event type, each with a payload the machine accepts somewhere. */
  validCases: ReadonlyArray<EventCase<M>>;
  /** Bad payloads, missing facts, or a context that forbids the event: refused in every state. */
  invalidCases: ReadonlyArray<EventCase<M>>;
  /** state → case name → outcome, for the allowed pairs only. */
  expected: Readonly<Record<string, Readonly<Record<string, Outcome>>>>;
  /**
   * The registry's payload-free answer (probe events + facts that let every
   * valid case pass); checked to agree with the table in every state.
   */
  allowedEvents?: (snapshot: SnapshotFrom<M>) => readonly string[];
}

interface MachineSnapshotLike {
  value: unknown;
  context: unknown;
  status: string;
  can(event: unknown): boolean;
}

/** A real snapshot in `state` (what the server gets from `resolveState`). */
export function snapshotIn<M extends AnyStateMachine>(machine: M, state: string, context: ContextFrom<M>): SnapshotFrom<M> {
  return machine.resolveState({ value: state, context }) as SnapshotFrom<M>;
}

/** Action names the pure transition returned, built-ins left out: the side effects. */
export function effectNamesOf(actions: ReadonlyArray<{ type: string }>): string[] {
  return actions.map((action) => action.type).filter((type) => !type.startsWith('xstate.'));
}

function contextFor<M extends AnyStateMachine>(spec: TransitionTableSpec<M>, eventCase: EventCase<M>): ContextFrom<M> {
  return { ...(spec.baseContext as object), ...eventCase.context } as ContextFrom<M>;
}

function step<M extends AnyStateMachine>(spec: TransitionTableSpec<M>, state: string, eventCase: EventCase<M>) {
  const before = snapshotIn(spec.machine, state, contextFor(spec, eventCase));
  const [after, actions] = transition(spec.machine, before, eventCase.event);
  return {
    before: before as unknown as MachineSnapshotLike,
    after: after as unknown as MachineSnapshotLike,
    effects: effectNamesOf(actions),
  };
}

export function describeTransitionTable<M extends AnyStateMachine>(spec: TransitionTableSpec<M>): void {
  describe(`${spec.machine.id} transition table`, () => {
    it('covers every state and every event type of the machine', () => {
      expect([...spec.states].sort()).toEqual(Object.keys(spec.machine.states).sort());
      const caseTypes = new Set(spec.validCases.map((eventCase) => eventCase.event.type));
      expect([...caseTypes].sort()).toEqual([...spec.eventTypes].sort());
      expect([...new Set(spec.machine.events)].sort()).toEqual([...spec.eventTypes].sort());
    });

    it('names only known states and cases in its expectations', () => {
      const caseNames = new Set(spec.validCases.map((eventCase) => eventCase.name));
      expect(caseNames.size).toBe(spec.validCases.length);
      for (const [state, outcomes] of Object.entries(spec.expected)) {
        expect(spec.states).toContain(state);
        for (const [caseName, [to]] of Object.entries(outcomes)) {
          expect(caseNames, `${state}: ${caseName}`).toContain(caseName);
          expect(spec.states).toContain(to);
        }
      }
    });

    const validRows = spec.states.flatMap((state) =>
      spec.validCases.map((eventCase) => {
        const outcome = spec.expected[state]?.[eventCase.name];
        return { state, name: eventCase.name, eventCase, outcome, result: outcome ? `→ ${outcome[0]}` : 'not allowed' };
      }),
    );

    it.each(validRows)('in $state, $name: $result', ({ state, eventCase, outcome }) => {
      const { before, after, effects } = step(spec, state, eventCase);
      if (outcome) {
        const [to, ...expectedEffects] = outcome;
        expect(before.can(eventCase.event)).toBe(true);
        expect(after.value).toBe(to);
        expect(effects).toEqual(expectedEffects);
      } else {
        expect(before.can(eventCase.event)).toBe(false);
        expect(after.value).toBe(state);
        expect(after.context).toEqual(before.context);
        expect(effects).toEqual([]);
      }
    });

    const { allowedEvents } = spec;
    if (allowedEvents) {
      it.each(validRows)('in $state, the allowed events agree with the table for $name', ({ state, eventCase, outcome }) => {
        const snapshot = snapshotIn(spec.machine, state, contextFor(spec, eventCase));
        const offered = allowedEvents(snapshot).includes(eventCase.event.type);
        const someCaseOfTypeAllowed = spec.validCases.some(
          (other) =>
            other.event.type === eventCase.event.type &&
            spec.expected[state]?.[other.name] !== undefined &&
            JSON.stringify(other.context ?? {}) === JSON.stringify(eventCase.context ?? {}),
        );
        if (outcome) expect(offered).toBe(true);
        expect(offered).toBe(someCaseOfTypeAllowed);
      });
    }

    const invalidRows = spec.states.flatMap((state) =>
      spec.invalidCases.map((eventCase) => ({ state, name: eventCase.name, eventCase })),
    );

    it.each(invalidRows)('in $state, $name: refused', ({ state, eventCase }) => {
      const { before, after, effects } = step(spec, state, eventCase);
      expect(before.can(eventCase.event)).toBe(false);
      expect(after.value).toBe(state);
      expect(after.context).toEqual(before.context);
      expect(effects).toEqual([]);
    });
  });
}
