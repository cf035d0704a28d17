import { describe, expect, it } from 'vitest';
import { RULE_IDS, evaluateTechnique } from '../../shared/domain/checklist';
import { DEMO_TECHNIQUES } from '../../shared/domain/demo-techniques';
import { POLICY_SETTINGS } from '../../shared/domain/policy';
import { ROLES } from '../../shared/roles';
import {
  AUDIT_EVENT_TYPES,
  AUDIT_STATES,
  CORRECTIVE_ACTION_EVENT_TYPES,
  CORRECTIVE_ACTION_STATES,
  FINDING_CLASSES,
  FINDING_EVENT_TYPES,
  FINDING_STATES,
  ROOT_CAUSE_METHODS,
} from '../../machines';
import {
  ACTION_STATE_LABELS,
  AUDIT_STATE_LABELS,
  FINDING_CLASS_LABELS,
  FINDING_STATE_LABELS,
  ROLE_LABELS,
  ROOT_CAUSE_METHOD_LABELS,
  RULE_LABELS,
  TRAIL_EVENTS,
  TRAIL_EVENT_LABELS,
  VALUE_LABELS,
  basisInWords,
  basisStatements,
  fieldPathLabel,
  forbiddenMessage,
  formatResultValues,
  rowIssueText,
  trailEventLabel,
} from '../../shared/labels';

const words = (label: string | undefined) => typeof label === 'string' && label.trim().length > 0 && !/_/.test(label);

describe('labels are complete for every member of the unions', () => {
  it.each([
    ['rules', RULE_IDS, RULE_LABELS],
    ['audit states', AUDIT_STATES, AUDIT_STATE_LABELS],
    ['finding states', FINDING_STATES, FINDING_STATE_LABELS],
    ['corrective action states', CORRECTIVE_ACTION_STATES, ACTION_STATE_LABELS],
    ['finding classes', FINDING_CLASSES, FINDING_CLASS_LABELS],
    ['root-cause methods', ROOT_CAUSE_METHODS, ROOT_CAUSE_METHOD_LABELS],
    ['roles', ROLES, ROLE_LABELS],
    ['trail events', TRAIL_EVENTS, TRAIL_EVENT_LABELS],
  ] as const)('when the %s are listed, then each has a label in words', (_name, members, labels) => {
    for (const member of members) expect(words((labels as Record<string, string>)[member]), member).toBe(true);
  });

  it.each([
    ['audit', AUDIT_EVENT_TYPES],
    ['finding', FINDING_EVENT_TYPES],
    ['action', CORRECTIVE_ACTION_EVENT_TYPES],
  ] as const)('when a %s event is on the trail, then it reads in words, not as its code', (kind, events) => {
    for (const event of events) {
      const label = trailEventLabel(kind, event);
      expect(label).not.toBe(event);
      expect(words(label), event).toBe(true);
    }
  });

  it('when the trail holds an event no map knows, then it is still put in words', () => {
    expect(trailEventLabel('equipment', 'EQUIPMENT_RETIRED')).toBe('Equipment retired');
  });

  it('when the rule is coil size, then one label serves everywhere', () => {
    expect(RULE_LABELS['coil-size']).toBe('Coil size against crack length');
  });

  it('when a rule result of every demo technique is shown, then every value key has a label and a unit, never the key', () => {
    for (const technique of DEMO_TECHNIQUES) {
      const output = evaluateTechnique(technique);
      for (const result of output.results) {
        for (const key of Object.keys(result.values)) expect(VALUE_LABELS[key], key).toBeDefined();
        const text = formatResultValues(result.values);
        for (const key of Object.keys(result.values).filter((name) => /[A-Z]/.test(name))) expect(text).not.toContain(key);
      }
    }
    expect(formatResultValues({ sensitivityMin: 0.5, bestCoil: 0 })).toBe('Sensitivity needed, at least: 0.5; Best coil: coil 1');
    expect(formatResultValues({ frequencyHz: 2000, standardDepthMm: 2.6979 })).toBe('Frequency f: 2 kHz; Standard depth of penetration δ: 2.698 mm');
  });
});

describe('bases in words', () => {
  it('when a basis is tagged, then each tag becomes a plain statement and no tag is left', () => {
    // Tags as the engine's rules write them (shared/domain/checklist/rules).
    expect(basisInWords('[pub] definition of the IACS scale: 100 %IACS = 58.0 MS/m at 20 °C (ASTM E1004)')).toBe(
      'Published: definition of the IACS scale: 100 %IACS = 58.0 MS/m at 20 °C (ASTM E1004)',
    );
    expect(basisInWords('[trade] scan index ≤ policy scanIndexFractionMax × coil diameter (default 0.5), common practice, no single source')).toBe(
      'Common practice, no single source: scan index ≤ the policy setting “largest scan index, as a fraction of the coil diameter” × coil diameter (default 0.5)',
    );
    expect(basisInWords('[mem] about 1.0 %IACS, recalled, not verified against a table')).toBe('Recalled, not yet checked against the published text: about 1.0 %IACS');
    const mixed = basisStatements('[pub] δ = 1/√(π f μ0 μr σ); [trade] flaw reached when x ≤ k·δ (policy penetrationDepthFactor, default 3); [pub] δ ≈ 1.25 × flaw depth');
    expect(mixed.map((item) => item.kind)).toEqual(['published', 'trade', 'published']);
  });

  it('when a basis rests on a product default, then it says to confirm it against the applicable standard', () => {
    expect(basisInWords('Whorl product default, no published source')).toBe('Organisation default; confirm against your applicable standard');
  });

  it('when any policy setting or rule basis is put in words, then no tag, policy key or blunt "from memory" is left', () => {
    const bases = [...POLICY_SETTINGS.map((setting) => setting.basis), ...DEMO_TECHNIQUES.flatMap((t) => evaluateTechnique(t).results.map((r) => r.basis))];
    for (const basis of bases) {
      const text = basisInWords(basis);
      expect(text).not.toMatch(/\[(pub|trade|mem)\]/);
      expect(text).not.toMatch(/from memory|not verified against the text/i);
      for (const setting of POLICY_SETTINGS) expect(text).not.toMatch(new RegExp(`\\b${setting.key}\\b`));
    }
  });
});

describe('field names in words', () => {
  it('when a validation path is nested, then it reads as the field people see', () => {
    expect(fieldPathLabel(['calibrationDueOn'])).toBe('Calibration due');
    expect(fieldPathLabel(['coils', 0, 'frequenciesHz', 0])).toBe('Coil 1, frequency 1');
    expect(fieldPathLabel([])).toBe('');
  });

  it('when a CSV row has an issue, then it names the row and the column in words', () => {
    expect(rowIssueText({ row: 7, field: 'work order', message: 'enter the work order' })).toBe('Row 7, Work order: enter the work order');
    expect(rowIssueText({ row: 9, field: '(row)', message: 'the same inspection as row 4' })).toBe('Row 9: the same inspection as row 4');
  });

  it('when a role may not act, then the refusal names who may, in words', () => {
    expect(forbiddenMessage('create', 'User')).toBe('Only an administrator may add people');
  });
});
