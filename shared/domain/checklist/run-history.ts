// What a stored checklist or extent run says about the engine that made it, and what
// changed when it was run again: in words, for screens and reports (no rule ids).
import { CHECKLIST_ENGINE_VERSION, type RuleResult, type RuleStatus } from './types';
import { ruleLabel } from '../../labels/rules';

/** The name of each rule as people read it (one set of labels for screens, PDFs and e-mails). */
export function ruleName(rule: string): string {
  const label = ruleLabel(rule);
  if (label !== rule) return label;
  // A rule of a later engine, unknown here: its id in words.
  const words = rule.replace(/[-_]+/g, ' ');
  return words.charAt(0).toUpperCase() + words.slice(1);
}

const STATUS_WORDS: Readonly<Record<RuleStatus, string>> = { pass: 'pass', fail: 'fail', warn: 'warning', not_applicable: 'not applicable' };

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** "2 Dec 2026", in UTC. */
export function dayText(at: Date | string): string {
  const date = typeof at === 'string' ? new Date(at) : at;
  return `${date.getUTCDate()} ${MONTHS[date.getUTCMonth()]} ${date.getUTCFullYear()}`;
}

/** "Checked with engine 1.0 on 2 Dec 2026; the current engine is 2.0." */
export function engineVersionNote(engineVersion: string, at: Date | string, current: string = CHECKLIST_ENGINE_VERSION): string {
  if (engineVersion === current) return `Checked with engine ${engineVersion} on ${dayText(at)}, the current engine.`;
  return `Checked with engine ${engineVersion} on ${dayText(at)}; the current engine is ${current}. Run it again to see the verdicts of the current engine.`;
}

export interface RunOutcome {
  verdict: string;
  results: readonly Pick<RuleResult, 'rule' | 'status' | 'flaw' | 'coil'>[];
}

function resultKey(result: Pick<RuleResult, 'rule' | 'flaw' | 'coil'>): string {
  return `${result.rule}\u0000${result.flaw ?? ''}\u0000${result.coil ?? ''}`;
}

function subject(result: Pick<RuleResult, 'rule' | 'flaw' | 'coil'>): string {
  const parts = [ruleName(result.rule)];
  if (result.flaw !== undefined) parts.push(`flaw "${result.flaw}"`);
  if (result.coil !== undefined) parts.push(`coil ${result.coil + 1}`);
  return parts.join(', ');
}

/** Results keyed by rule, flaw and coil; a key met twice (say, two results without flaw or coil) is numbered in order. */
function keyed(results: RunOutcome['results']): Map<string, Pick<RuleResult, 'rule' | 'status' | 'flaw' | 'coil'>> {
  const map = new Map<string, Pick<RuleResult, 'rule' | 'status' | 'flaw' | 'coil'>>();
  const seen = new Map<string, number>();
  for (const result of results) {
    const base = resultKey(result);
    const count = seen.get(base) ?? 0;
    seen.set(base, count + 1);
    map.set(`${base}\u0000${count}`, result);
  }
  return map;
}

const verdictWords = (verdict: string) => (verdict === 'conforms' ? 'conforms' : 'does not conform');

/**
 * The results whose status changed between two runs of one technique, one line each in words:
 * "Coil mode (absolute or differential), flaw "seam", coil 1: pass → fail".
 * The verdict comes first when it changed. Empty when nothing changed.
 */
export function describeRunChanges(previous: RunOutcome, current: RunOutcome): string[] {
  const lines: string[] = [];
  if (previous.verdict !== current.verdict) lines.push(`Verdict: ${verdictWords(previous.verdict)} → ${verdictWords(current.verdict)}`);
  const before = keyed(previous.results);
  const after = keyed(current.results);
  for (const [key, result] of after) {
    const old = before.get(key);
    if (!old) {
      if (result.status === 'fail' || result.status === 'warn') lines.push(`${subject(result)}: new check, ${STATUS_WORDS[result.status]}`);
    } else if (old.status !== result.status) {
      lines.push(`${subject(result)}: ${STATUS_WORDS[old.status]} → ${STATUS_WORDS[result.status]}`);
    }
  }
  for (const [key, result] of before) {
    if (!after.has(key) && (result.status === 'fail' || result.status === 'warn')) lines.push(`${subject(result)}: no longer reported (was ${STATUS_WORDS[result.status]})`);
  }
  return lines;
}

export interface ExtentListEntry {
  revisionId: number;
  code: string;
  revision: string;
  failures: readonly unknown[];
}

/**
 * What changed between two extent runs of one finding, one line per technique revision whose
 * standing on the rule changed: "TAC-ET-019 rev A: now fails Center effect". Empty when nothing changed.
 */
export function describeExtentChanges(rule: string, previous: readonly ExtentListEntry[], current: readonly ExtentListEntry[]): string[] {
  const name = ruleName(rule);
  const before = new Map(previous.map((entry) => [entry.revisionId, entry]));
  const after = new Map(current.map((entry) => [entry.revisionId, entry]));
  const lines: string[] = [];
  for (const entry of current) {
    const old = before.get(entry.revisionId);
    const fails = entry.failures.length > 0;
    const label = `${entry.code} rev ${entry.revision}`;
    if (!old) {
      if (fails) lines.push(`${label}: newly approved, fails ${name}`);
    } else if (fails !== old.failures.length > 0) {
      lines.push(`${label}: ${fails ? 'now fails' : 'no longer fails'} ${name}`);
    }
  }
  for (const entry of previous) {
    if (!after.has(entry.revisionId) && entry.failures.length > 0) lines.push(`${entry.code} rev ${entry.revision}: no longer approved (failed ${name})`);
  }
  return lines;
}
