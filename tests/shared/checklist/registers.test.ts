import { describe, expect, it } from 'vitest';
import { safeEvaluateTechnique, type RegisterFactsInput } from '../../../shared/domain/checklist/index';
import { evaluate, plateTechnique, resultsOf } from './techniques';

// docs/domain.md rule 8: approval by an ET Level 3; performers ET Level 2 or 3 with a valid
// certificate (validity up to 5 years [mem: ISO 9712 / EN 4179]) and a near-vision exam
// within 12 months [pub: ISO 9712]; instruments, probes and reference standards within calibration.
// Names and dates below are invented test data.

const now = new Date('2026-06-15T10:00:00Z');

const level3 = { method: 'ET', level: 3 as const, scheme: 'ISO 9712', issuedOn: '2023-01-10', expiresOn: '2028-01-09' };
const level2 = { method: 'ET', level: 2 as const, scheme: 'EN 4179', issuedOn: '2024-03-01', expiresOn: '2029-02-28' };

function facts(patch: Partial<RegisterFactsInput> = {}): RegisterFactsInput {
  return {
    approver: { name: 'Approver A', certifications: [level3] },
    performers: [{ name: 'Performer P', certifications: [level2], nearVisionExamOn: '2025-09-01' }],
    equipment: [
      { kind: 'instrument', description: 'flaw detector', serialNumber: 'FD-1', calibrationDueOn: '2026-12-01' },
      { kind: 'probe', description: '5 mm shielded probe', calibrationDueOn: '2026-07-01' },
      { kind: 'reference-standard', description: 'aluminium notch block', calibrationDueOn: '2027-01-01' },
    ],
    ...patch,
  };
}

function run(patch: Partial<RegisterFactsInput> = {}) {
  return evaluate(plateTechnique(), { registers: facts(patch), now });
}

describe('personnel and equipment', () => {
  it('do not run without register facts', () => {
    const output = evaluate(plateTechnique());
    expect(resultsOf(output, 'personnel')).toEqual([]);
    expect(resultsOf(output, 'equipment')).toEqual([]);
  });

  it('pass with a valid Level 3 approver, a qualified performer and calibrated equipment', () => {
    const output = run();
    expect(resultsOf(output, 'personnel').map((result) => result.status)).toEqual(['pass', 'pass']);
    expect(resultsOf(output, 'equipment').map((result) => result.status)).toEqual(['pass', 'pass', 'pass']);
    expect(output.verdict).toBe('conforms');
  });

  it('fail a technique with no recorded approval, or approved by a Level 2', () => {
    expect(resultsOf(run({ approver: null }), 'personnel')[0].status).toBe('fail');
    const level2Approver = resultsOf(run({ approver: { name: 'Approver B', certifications: [level2] } }), 'personnel')[0];
    expect(level2Approver.status).toBe('fail');
    expect(level2Approver.message).toMatch(/Level 2 only; Level 3 is required/);
  });

  it('judge the approver on the approval date when it is given', () => {
    const expired = { ...level3, issuedOn: '2019-01-01', expiresOn: '2023-12-31' };
    expect(resultsOf(run({ approver: { name: 'A', certifications: [expired] } }), 'personnel')[0].status).toBe('fail');
    const atApproval = run({ approver: { name: 'A', certifications: [expired] }, approvedOn: '2023-06-01' });
    expect(resultsOf(atApproval, 'personnel')[0].status).toBe('pass');
  });

  it('fail a performer whose certificate has expired, is only Level 1, or is not in ET', () => {
    const expired = run({ performers: [{ name: 'P', certifications: [{ ...level2, issuedOn: '2021-01-01', expiresOn: '2026-06-14' }], nearVisionExamOn: '2025-09-01' }] });
    expect(resultsOf(expired, 'personnel')[1]).toMatchObject({ status: 'fail' });
    expect(resultsOf(expired, 'personnel')[1].message).toMatch(/expired on 2026-06-14/);
    const lastDay = run({ performers: [{ name: 'P', certifications: [{ ...level2, issuedOn: '2021-06-16', expiresOn: '2026-06-15' }], nearVisionExamOn: '2025-09-01' }] });
    expect(resultsOf(lastDay, 'personnel')[1].status).toBe('pass');
    const level1 = run({ performers: [{ name: 'P', certifications: [{ ...level2, level: 1 }], nearVisionExamOn: '2025-09-01' }] });
    expect(resultsOf(level1, 'personnel')[1].status).toBe('fail');
    const ut = run({ performers: [{ name: 'P', certifications: [{ ...level2, method: 'UT' }], nearVisionExamOn: '2025-09-01' }] });
    expect(resultsOf(ut, 'personnel')[1].message).toMatch(/no ET certificate/);
  });

  it('fail a certificate issued for longer than the 5-year maximum', () => {
    const long = run({ performers: [{ name: 'P', certifications: [{ ...level2, issuedOn: '2022-01-01', expiresOn: '2028-01-01' }], nearVisionExamOn: '2025-09-01' }] });
    expect(resultsOf(long, 'personnel')[1].message).toMatch(/longer than the 5-year maximum/);
  });

  it('fail a near-vision exam more than 12 months old, or none on record', () => {
    const old = run({ performers: [{ name: 'P', certifications: [level2], nearVisionExamOn: '2025-06-14' }] });
    expect(resultsOf(old, 'personnel')[1].status).toBe('fail');
    expect(resultsOf(old, 'personnel')[1].message).toMatch(/more than 12 months ago/);
    const exactlyTwelve = run({ performers: [{ name: 'P', certifications: [level2], nearVisionExamOn: '2025-06-15' }] });
    expect(resultsOf(exactlyTwelve, 'personnel')[1].status).toBe('pass');
    const none = run({ performers: [{ name: 'P', certifications: [level2], nearVisionExamOn: null }] });
    expect(resultsOf(none, 'personnel')[1].message).toMatch(/no near-vision exam/);
  });

  it('warn when no performers are on record', () => {
    expect(resultsOf(run({ performers: [] }), 'personnel')[1].status).toBe('warn');
  });

  it('fail equipment past its calibration due date or without a calibration record', () => {
    const output = run({
      equipment: [
        { kind: 'instrument', description: 'flaw detector', calibrationDueOn: '2026-06-14' },
        { kind: 'probe', description: 'probe', calibrationDueOn: null },
        { kind: 'reference-standard', description: 'block', calibrationDueOn: '2026-06-15' },
      ],
    });
    expect(resultsOf(output, 'equipment').map((result) => result.status)).toEqual(['fail', 'fail', 'pass']);
    expect(resultsOf(output, 'equipment')[0].message).toMatch(/overdue/);
    expect(output.verdict).toBe('does-not-conform');
  });

  it('warn when a kind of equipment is missing', () => {
    const output = run({ equipment: [{ kind: 'instrument', description: 'flaw detector', calibrationDueOn: '2027-01-01' }] });
    expect(resultsOf(output, 'equipment').filter((result) => result.status === 'warn')).toHaveLength(2);
  });

  it('take the validity and vision periods from the policy', () => {
    const output = evaluate(plateTechnique(), {
      registers: facts({ performers: [{ name: 'P', certifications: [level2], nearVisionExamOn: '2025-09-01' }] }),
      now,
      policy: { nearVisionExamMonths: 6 },
    });
    expect(resultsOf(output, 'personnel')[1].status).toBe('fail');
  });

  it('reject malformed register facts as issues naming the field', () => {
    const result = safeEvaluateTechnique(plateTechnique(), { registers: { performers: [{ name: 'P', certifications: [{ method: 'ET', level: 4, expiresOn: 'soon' }] }] } });
    expect(result.success).toBe(false);
    if (!result.success) {
      const paths = result.issues.map((issue) => issue.path);
      expect(paths).toContain('options.registers.performers[0].certifications[0].level');
      expect(paths).toContain('options.registers.performers[0].certifications[0].expiresOn');
    }
  });
});
