// Typed helpers around XState's pure functions, shared by the server (which
// restores, checks, transitions and persists records) and the client (which
// asks what may be sent). Nothing here runs an actor, so nothing executes:
// side effects come back as names for the server to carry out.
import {
  getNextTransitions,
  initialTransition,
  transition,
  type AnyMachineSnapshot,
  type AnyStateMachine,
  type ContextFrom,
  type EventFromLogic,
  type InputFrom,
  type SnapshotFrom,
} from 'xstate';
import type { ZodType } from 'zod';

/** Top-level state names of a flat machine (what goes in the `state` column). */
export type StateOf<M extends AnyStateMachine> = Extract<SnapshotFrom<M>['value'], string>;

/** The JSON-safe form of a snapshot, from `persistSnapshot`. */
export interface PersistedSnapshotOf<M extends AnyStateMachine> {
  status: string;
  value: StateOf<M>;
  context: ContextFrom<M>;
  [key: string]: unknown;
}

/** The least the server may store and hand back: a state value and a context. */
export interface StoredSnapshot {
  value: unknown;
  context: unknown;
  status?: unknown;
}

export interface RestoreOptions {
  /** Checks the stored context still has the shape this machine expects. */
  contextSchema?: ZodType;
  /** The machine version stored beside the snapshot; must equal the machine's own version. */
  storedVersion?: number;
}

/** A stored snapshot that does not fit the current machine (the record needs a data migration). */
export class SnapshotRestoreError extends Error {
  override readonly name = 'SnapshotRestoreError';

  constructor(
    readonly machineId: string,
    detail: string,
  ) {
    super(`Cannot restore the stored ${machineId} snapshot: ${detail}`);
  }
}

export interface AppliedEvent<M extends AnyStateMachine> {
  /** The next snapshot (the same one when the event was not accepted). */
  snapshot: SnapshotFrom<M>;
  /** The top-level state after the event. */
  state: StateOf<M>;
  /**
   * True when the event was accepted (a transition was taken, whether or not
   * the state changed: extension events stay in the same state). False means
   * "not allowed now": the server answers 422 and saves nothing.
   */
  changed: boolean;
  /** Names of the side-effect actions the transition executed, in order. */
  effects: string[];
}

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

// SnapshotFrom<M> is opaque while M is generic; this is the same object.
function asMachineSnapshot(snapshot: unknown): AnyMachineSnapshot {
  return snapshot as AnyMachineSnapshot;
}

function assertSnapshotOf(machine: AnyStateMachine, snapshot: AnyMachineSnapshot): void {
  if (snapshot.machine !== machine) {
    throw new TypeError(`The snapshot belongs to machine "${snapshot.machine?.id}", not "${machine.id}"`);
  }
}

/** The top-level state name of a snapshot of a flat machine. */
export function stateOf<M extends AnyStateMachine>(snapshot: SnapshotFrom<M>): StateOf<M> {
  const { value } = asMachineSnapshot(snapshot);
  if (typeof value !== 'string') {
    throw new TypeError(`Expected a flat state value, got ${JSON.stringify(value)}`);
  }
  return value as StateOf<M>;
}

/** Names of executed actions that are the machine's own (not XState built-ins). */
function effectNames(actions: ReadonlyArray<{ type: string }>): string[] {
  return actions.map((action) => action.type).filter((type) => !type.startsWith('xstate.'));
}

/**
 * Turns what the database holds (a persisted snapshot, `{ value, context }`,
 * or either as a JSON string) back into a real snapshot for `transition()`.
 * Throws `SnapshotRestoreError` when it no longer fits the machine: another
 * machine version, an unknown state, a context of the wrong shape, or a
 * snapshot whose status is `error`.
 */
export function restoreSnapshot<M extends AnyStateMachine>(
  machine: M,
  stored: StoredSnapshot | string | unknown,
  options: RestoreOptions = {},
): SnapshotFrom<M> {
  const fail: (detail: string) => never = (detail) => {
    throw new SnapshotRestoreError(machine.id, detail);
  };
  if (options.storedVersion !== undefined && String(options.storedVersion) !== machine.version) {
    fail(`it was stored by machine version ${options.storedVersion}; the current version is ${machine.version}`);
  }
  let parsed: unknown = stored;
  if (typeof stored === 'string') {
    try {
      parsed = JSON.parse(stored);
    } catch {
      fail('it is not valid JSON');
    }
  }
  if (!isObject(parsed)) return fail('it is not an object with a state value and a context');
  const { value, context, status } = parsed;
  if (typeof value !== 'string' || !Object.hasOwn(machine.states, value)) {
    fail(`the state ${JSON.stringify(value)} is not one of ${Object.keys(machine.states).join(', ')}`);
  }
  if (status === 'error') fail('its status is "error"');
  if (!isObject(context)) fail('its context is missing');
  if (options.contextSchema) {
    const result = options.contextSchema.safeParse(context);
    if (!result.success) {
      const problems = result.error.issues.map((issue) => `${issue.path.join('.') || 'context'}: ${issue.message}`);
      fail(`its context does not fit: ${problems.join('; ')}`);
    }
  }
  let snapshot: AnyMachineSnapshot;
  try {
    // Status (active or done) is recomputed from the state value, not trusted.
    snapshot = machine.resolveState({ value, context });
  } catch (error) {
    return fail(error instanceof Error ? error.message : String(error));
  }
  if (snapshot.status === 'error') fail('the machine reports status "error"');
  return snapshot as SnapshotFrom<M>;
}

/** The JSON-safe snapshot to store (with the machine version beside it). */
export function persistSnapshot<M extends AnyStateMachine>(machine: M, snapshot: SnapshotFrom<M>): PersistedSnapshotOf<M> {
  return machine.getPersistedSnapshot(snapshot) as unknown as PersistedSnapshotOf<M>;
}

/** The first snapshot of a new record and the effects of entering it. */
export function createInitialSnapshot<M extends AnyStateMachine>(
  machine: M,
  ...[input]: undefined extends InputFrom<M> ? [input?: InputFrom<M>] : [input: InputFrom<M>]
): { snapshot: SnapshotFrom<M>; state: StateOf<M>; effects: string[] } {
  const [snapshot, actions] = initialTransition(machine, input as InputFrom<M>);
  if (asMachineSnapshot(snapshot).status === 'error') throw new SnapshotRestoreError(machine.id, 'the initial snapshot has status "error"');
  return { snapshot, state: stateOf<M>(snapshot), effects: effectNames(actions) };
}

/** True when the machine would accept this exact event now. */
export function canSend<M extends AnyStateMachine>(machine: M, snapshot: SnapshotFrom<M>, event: EventFromLogic<M>): boolean {
  const current = asMachineSnapshot(snapshot);
  assertSnapshotOf(machine, current);
  return current.status === 'active' && current.can(event);
}

/**
 * Computes the next snapshot with the pure `transition()`; executes nothing.
 * An event the machine does not accept now returns the same snapshot with
 * `changed: false` and no effects.
 */
export function applyEvent<M extends AnyStateMachine>(
  machine: M,
  snapshot: SnapshotFrom<M>,
  event: EventFromLogic<M>,
): AppliedEvent<M> {
  if (!canSend(machine, snapshot, event)) {
    return { snapshot, state: stateOf<M>(snapshot), changed: false, effects: [] };
  }
  const [next, actions] = transition(machine, snapshot, event);
  const { status, error } = asMachineSnapshot(next);
  if (status === 'error') {
    throw new Error(`Machine "${machine.id}" failed on ${event.type}: ${String(error)}`);
  }
  return { snapshot: next, state: stateOf<M>(next), changed: true, effects: effectNames(actions) };
}

/**
 * Event types with a transition out of the current state, guards ignored:
 * what the state could accept with some payload and facts.
 */
export function eventTypesFromState(snapshot: AnyMachineSnapshot): string[] {
  if (snapshot.status !== 'active') return [];
  const types = getNextTransitions(snapshot).map((t) => t.eventType);
  return [...new Set(types)].filter((type) => type !== '*' && !type.startsWith('xstate.'));
}

/**
 * The types of the candidate events that `can` accepts now, in candidate
 * order, each once. Give one or more events per type with representative
 * payloads (see probe-events.ts); a type is allowed if any of its candidates is.
 */
export function allowedEventTypes<M extends AnyStateMachine>(
  machine: M,
  snapshot: SnapshotFrom<M>,
  candidateEvents: ReadonlyArray<EventFromLogic<M>>,
): Array<EventFromLogic<M>['type']> {
  const allowed = new Set<EventFromLogic<M>['type']>();
  for (const event of candidateEvents) {
    if (!allowed.has(event.type) && canSend(machine, snapshot, event)) allowed.add(event.type);
  }
  return [...allowed];
}
