// Evaluates the technique being edited in the browser, with the same engine and
// the organisation's policy the server uses, on every change.
import { useDeferredValue, useMemo } from 'react';
import {
  evaluateParsedTechnique,
  parseTechnique,
  type ChecklistOutput,
  type Policy,
  type Technique,
  type TechniqueIssue,
} from '../../../../shared/domain/checklist';

export type LiveChecklist =
  | { kind: 'evaluated'; technique: Technique; output: ChecklistOutput }
  | { kind: 'invalid'; issues: TechniqueIssue[] };

export function evaluateDraft(values: unknown, policy: Policy | undefined): LiveChecklist {
  const parsed = parseTechnique(values);
  if (!parsed.success) return { kind: 'invalid', issues: parsed.issues };
  return { kind: 'evaluated', technique: parsed.data, output: evaluateParsedTechnique(parsed.data, { policy }) };
}

export function useLiveChecklist(values: unknown, policy: Policy | undefined): LiveChecklist {
  // A snapshot by content: the form hands back the same object as it changes.
  const key = JSON.stringify(values ?? null);
  const deferredKey = useDeferredValue(key);
  return useMemo(() => evaluateDraft(JSON.parse(deferredKey), policy), [deferredKey, policy]);
}
