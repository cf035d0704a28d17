import { describe, expect, it } from 'vitest';
import { evaluate, plateTechnique, resultsOf } from './techniques';

// Rule 7 (DOMAIN.md, [trade]): conductivity within ±15 % (policy); a notch per orientation; notch depth ≤ smallest flaw depth.

function conductivityResult(output: ReturnType<typeof evaluate>) {
  return resultsOf(output, 'reference-standard').filter((result) => result.flaw === undefined);
}
function notchResult(output: ReturnType<typeof evaluate>, flaw: string) {
  return resultsOf(output, 'reference-standard').filter((result) => result.flaw === flaw);
}

describe('reference-standard', () => {
  it('passes a standard within 15 % of the part and fails one 20 % off', () => {
    expect(conductivityResult(evaluate(plateTechnique({ reference: { conductivityIacs: 28 } })))[0].status).toBe('pass'); // −12.5 %
    const off = conductivityResult(evaluate(plateTechnique({ reference: { conductivityIacs: 38.4 } })))[0]; // +20 %
    expect(off.status).toBe('fail');
    expect(off.message).toMatch(/between 27\.2 and 36\.8 %IACS/);
  });

  it('takes the tolerance from the policy', () => {
    const output = evaluate(plateTechnique({ reference: { conductivityIacs: 28 } }), { policy: { referenceConductivityTolerancePercent: 10 } });
    expect(conductivityResult(output)[0].status).toBe('fail');
  });

  it('fails a flaw orientation with no matching notch', () => {
    const output = evaluate(plateTechnique({ reference: { notches: [{ orientation: 'longitudinal', depthMm: 0.5, lengthMm: 5 }] } }));
    const [result] = notchResult(output, 'crack');
    expect(result.status).toBe('fail');
    expect(result.message).toMatch(/no notch matching/);
  });

  it('fails a notch deeper than the flaw it stands for', () => {
    const output = evaluate(plateTechnique({ reference: { notches: [{ orientation: 'transverse', depthMm: 0.8, lengthMm: 5 }] } }));
    const [result] = notchResult(output, 'crack');
    expect(result.status).toBe('fail');
    expect(result.message).toMatch(/deeper than the flaw/);
  });

  it('matches by plane: a circumferential notch stands for a transverse crack, an angled notch for a crack within 10°', () => {
    const output = evaluate(
      plateTechnique({
        flaws: [
          { id: 'crack', orientation: 'transverse', location: 'surface', depthMm: 0.5, lengthMm: 5 },
          { id: 'oblique', orientation: 'longitudinal', angleDeg: 30, location: 'surface', depthMm: 0.5, lengthMm: 5 },
        ],
        reference: {
          notches: [
            { orientation: 'circumferential', depthMm: 0.5, lengthMm: 5 },
            { orientation: 'longitudinal', angleDeg: 35, depthMm: 0.4, lengthMm: 5 },
          ],
        },
      }),
    );
    expect(notchResult(output, 'crack')[0].status).toBe('pass');
    expect(notchResult(output, 'oblique')[0].status).toBe('pass');
  });
});
