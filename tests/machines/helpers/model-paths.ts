// Model-based paths from xstate/graph. The traversal gets events with real
// payloads and a serializeState that ignores context (otherwise every stored
// reason would make a "new" state and the search would never settle).
import { getShortestPaths, getSimplePaths, type StatePath } from 'xstate/graph';
import type { AnyMachineSnapshot, AnyStateMachine, EventFromLogic, EventObject, InputFrom } from 'xstate';
import { applyEvent, createInitialSnapshot, stateOf } from '../../../machines/runtime';

export interface ModelPath<E extends EventObject = EventObject> {
  /** The state the path ends in. */
  state: string;
  /** Event labels in order ("CLASSIFY major"), the initial step left out. */
  labels: string[];
  /** The events in order, to replay. */
  events: E[];
}

function label(event: EventObject): string {
  return 'class' in event && typeof event.class === 'string' ? `${event.type} ${event.class}` : event.type;
}

function toModelPath<E extends EventObject>(path: StatePath<AnyMachineSnapshot, E>): ModelPath<E> {
  const events = path.steps.map((step) => step.event).filter((event) => event.type !== 'xstate.init');
  return { state: String(path.state.value), labels: events.map(label), events };
}

function traversalOptions<M extends AnyStateMachine>(events: ReadonlyArray<EventFromLogic<M>>, input?: InputFrom<M>) {
  return {
    events,
    input,
    serializeState: (snapshot: AnyMachineSnapshot) => JSON.stringify(snapshot.value),
  };
}

export function shortestPaths<M extends AnyStateMachine>(
  machine: M,
  events: ReadonlyArray<EventFromLogic<M>>,
  input?: InputFrom<M>,
): Array<ModelPath<EventFromLogic<M>>> {
  return getShortestPaths(machine, traversalOptions(events, input)).map((path) =>
    toModelPath(path as unknown as StatePath<AnyMachineSnapshot, EventFromLogic<M>>),
  );
}

export function simplePaths<M extends AnyStateMachine>(
  machine: M,
  events: ReadonlyArray<EventFromLogic<M>>,
  input?: InputFrom<M>,
): Array<ModelPath<EventFromLogic<M>>> {
  return getSimplePaths(machine, traversalOptions(events, input)).map((path) =>
    toModelPath(path as unknown as StatePath<AnyMachineSnapshot, EventFromLogic<M>>),
  );
}

/** The shortest path to each state, by state name. */
export function shortestPathByState<M extends AnyStateMachine>(
  machine: M,
  events: ReadonlyArray<EventFromLogic<M>>,
  input?: InputFrom<M>,
): Map<string, ModelPath<EventFromLogic<M>>> {
  return new Map(shortestPaths(machine, events, input).map((path) => [path.state, path]));
}

/**
 * Replays events from the initial state through the runtime helpers (what the
 * server runs) and returns the final state and every effect on the way.
 */
export function replay<M extends AnyStateMachine>(
  machine: M,
  events: ReadonlyArray<EventFromLogic<M>>,
  input?: InputFrom<M>,
): { state: string; effects: string[]; refused: string[] } {
  const start = createInitialSnapshot(machine, ...([input] as [InputFrom<M>]));
  let snapshot = start.snapshot;
  const effects = [...start.effects];
  const refused: string[] = [];
  for (const event of events) {
    const result = applyEvent(machine, snapshot, event);
    if (!result.changed) refused.push(event.type);
    snapshot = result.snapshot;
    effects.push(...result.effects);
  }
  return { state: stateOf<M>(snapshot), effects, refused };
}
