import { describe, expect, it } from 'vitest';
import { dayText, describeExtentChanges, describeRunChanges, engineVersionNote, ruleName } from '../../../shared/domain/checklist/run-history';
import { RULE_IDS } from '../../../shared/domain/checklist/types';

// What a stored run says about its engine, and what changed when it ran again: wording checks
// (product wording, no outside source applies) and the pairing of results by rule, flaw and coil.

describe('run history', () => {
  it('names every rule in words', () => {
    for (const rule of RULE_IDS) expect(ruleName(rule), rule).not.toBe(rule);
    expect(ruleName('some-later-rule')).toBe('Some later rule');
  });

  it('says which engine made a run, on which day, and which engine is current', () => {
    expect(dayText('2026-12-02T10:00:00.000Z')).toBe('2 Dec 2026');
    expect(engineVersionNote('1.0', '2026-12-02T10:00:00.000Z', '2.0')).toBe(
      'Checked with engine 1.0 on 2 Dec 2026; the current engine is 2.0. Run it again to see the verdicts of the current engine.',
    );
    expect(engineVersionNote('2.0', '2026-12-02T10:00:00.000Z', '2.0')).toBe('Checked with engine 2.0 on 2 Dec 2026, the current engine.');
  });

  it('lists the verdict and each result whose status changed, new failures, and failures no longer reported', () => {
    const previous = {
      verdict: 'conforms',
      results: [
        { rule: 'penetration-depth' as const, status: 'pass' as const, flaw: 'doubler-crack', coil: 0 },
        { rule: 'reference-standard' as const, status: 'pass' as const },
        { rule: 'ferromagnetic' as const, status: 'fail' as const },
        { rule: 'edge-effect' as const, status: 'not_applicable' as const },
      ],
    };
    const current = {
      verdict: 'does-not-conform',
      results: [
        { rule: 'penetration-depth' as const, status: 'fail' as const, flaw: 'doubler-crack', coil: 0 },
        { rule: 'reference-standard' as const, status: 'pass' as const },
        { rule: 'edge-effect' as const, status: 'not_applicable' as const },
        { rule: 'coil-mode' as const, status: 'warn' as const, flaw: 'seam', coil: 0 },
        { rule: 'coil-mode' as const, status: 'pass' as const, flaw: 'crack', coil: 0 },
      ],
    };
    expect(describeRunChanges(previous, current)).toEqual([
      'Verdict: conforms → does not conform',
      'Penetration depth, flaw "doubler-crack", coil 1: pass → fail',
      'Coil mode (absolute or differential), flaw "seam", coil 1: new check, warning',
      'Ferromagnetic material: no longer reported (was fail)',
    ]);
    expect(describeRunChanges(current, current)).toEqual([]);
  });

  it('lists the techniques whose standing on the rule changed between two extent runs', () => {
    const entry = (revisionId: number, code: string, fails: boolean) => ({ revisionId, code, revision: 'A', failures: fails ? [{}] : [] });
    const previous = [entry(1, 'TAC-ET-017', true), entry(2, 'TAC-ET-036', false), entry(3, 'TAC-ET-019', true)];
    const current = [entry(1, 'TAC-ET-017', true), entry(2, 'TAC-ET-036', true), entry(4, 'TAC-ET-040', true)];
    expect(describeExtentChanges('penetration-depth', previous, current)).toEqual([
      'TAC-ET-036 rev A: now fails Penetration depth',
      'TAC-ET-040 rev A: newly approved, fails Penetration depth',
      'TAC-ET-019 rev A: no longer approved (failed Penetration depth)',
    ]);
  });
});
