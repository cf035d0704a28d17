import { describe, expect, it } from 'vitest';
import { evaluate, plateTechnique, resultsOf } from './techniques';

// The plate technique claims a surface crack 0.5 mm deep and 5 mm long. A demonstration's a90/95
// must not exceed the claimed size in its dimension (MIL-HDBK-1823A (2009) defines a90/95; the
// comparison with the claimed size is common practice, no single source). Dates are invented.
const now = new Date('2026-12-01T10:00:00Z');
const fact = (patch: Record<string, unknown> = {}) => ({ id: 7, title: 'Bore cracks, pencil probe', sizeDimension: 'depth', a9095Mm: 0.42, acceptedAt: '2026-10-01T09:00:00.000Z', ...patch });

describe('demonstrated-capability rule', () => {
  it('when no demonstration facts are given, then the rule adds nothing', () => {
    expect(resultsOf(evaluate(plateTechnique(), { now }), 'demonstrated-capability')).toEqual([]);
  });

  it('when a90/95 in depth is within the claimed depth, then it passes with the numbers', () => {
    const [result] = resultsOf(evaluate(plateTechnique(), { now, demonstrations: [fact()] }), 'demonstrated-capability');
    expect(result).toMatchObject({ status: 'pass', flaw: 'crack', values: { claimedMm: 0.5, dimension: 'depth', a9095Mm: 0.42, demonstrationId: 7 } });
  });

  it('when a90/95 exceeds the claimed size, then it fails and the technique does not conform', () => {
    const output = evaluate(plateTechnique(), { now, demonstrations: [fact({ a9095Mm: 0.61 })] });
    const [result] = resultsOf(output, 'demonstrated-capability');
    expect(result.status).toBe('fail');
    expect(result.message).toMatch(/a90\/95 = 0\.61 mm in depth .* larger than the 0\.5 mm/);
    expect(output.verdict).toBe('does-not-conform');
  });

  it('when two demonstrations of one dimension exist, then the latest accepted one decides', () => {
    const older = fact({ id: 1, a9095Mm: 0.8, acceptedAt: '2026-01-01T09:00:00.000Z' });
    const [result] = resultsOf(evaluate(plateTechnique(), { now, demonstrations: [older, fact()] }), 'demonstrated-capability');
    expect(result).toMatchObject({ status: 'pass', values: { demonstrationId: 7 } });
  });

  it('when a length demonstration exists, then the flaw length is compared', () => {
    const [result] = resultsOf(evaluate(plateTechnique(), { now, demonstrations: [fact({ sizeDimension: 'length', a9095Mm: 5.4 })] }), 'demonstrated-capability');
    expect(result).toMatchObject({ status: 'fail', values: { claimedMm: 5, dimension: 'length' } });
  });

  it('when a90/95 was not bounded, then it fails', () => {
    const [result] = resultsOf(evaluate(plateTechnique(), { now, demonstrations: [fact({ a9095Mm: null })] }), 'demonstrated-capability');
    expect(result.status).toBe('fail');
  });

  it('when none exists, then the policy decides: nothing when not required, fail or warn when required', () => {
    expect(resultsOf(evaluate(plateTechnique(), { now, demonstrations: [] }), 'demonstrated-capability')).toEqual([]);
    const failing = resultsOf(evaluate(plateTechnique(), { now, demonstrations: [], policy: { demonstrationRequired: 1 } }), 'demonstrated-capability');
    expect(failing).toMatchObject([{ status: 'fail', flaw: 'crack' }]);
    const warning = resultsOf(evaluate(plateTechnique(), { now, demonstrations: [], policy: { demonstrationRequired: 1, missingDemonstrationFails: 0 } }), 'demonstrated-capability');
    expect(warning).toMatchObject([{ status: 'warn' }]);
  });

  it('when the latest demonstration is older than the validity, then it counts as expired', () => {
    const old = fact({ acceptedAt: '2020-01-01T09:00:00.000Z' });
    expect(resultsOf(evaluate(plateTechnique(), { now, demonstrations: [old] }), 'demonstrated-capability')).toMatchObject([{ status: 'warn', values: { expired: true } }]);
    expect(resultsOf(evaluate(plateTechnique(), { now, demonstrations: [old], policy: { demonstrationRequired: 1 } }), 'demonstrated-capability')).toMatchObject([{ status: 'fail', values: { expired: true } }]);
  });

  it('when the facts are malformed, then evaluation refuses them naming the field', () => {
    expect(() => evaluate(plateTechnique(), { now, demonstrations: [fact({ sizeDimension: 'width' })] })).toThrow(/sizeDimension|Invalid/);
  });
});
