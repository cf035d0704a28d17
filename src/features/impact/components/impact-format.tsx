// Small formatting helpers of the impact views.
import { stateLabel } from '../../../../shared/labels';

/** A record state in words ("in review"), for lists where a full badge would be noise. */
export function StateText({ state }: { state: string }) {
  return <span className="rounded-full bg-lagoon-soft px-2 py-0.5 text-xs font-bold">{stateLabel(state)}</span>;
}

export const formatUtc = (iso: string) => `${iso.slice(0, 16).replace('T', ' ')} UTC`;
