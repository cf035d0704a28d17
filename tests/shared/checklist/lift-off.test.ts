import { describe, expect, it } from 'vitest';
import { evaluate, plateTechnique, resultOf, resultsOf } from './techniques';

// A non-conductive coating is lift-off; calibration over a shim of the coating's thickness is
// common practice (no single source). Flaw signals fall with lift-off [pub: Dodd–Deeds field].

const coated = (coatingMm: number, shimMm?: number) =>
  plateTechnique({ part: { form: 'plate', thicknessMm: 10, coatingMm }, reference: shimMm === undefined ? {} : { shimMm } });

describe('lift-off', () => {
  it('does not apply without a coating', () => {
    expect(resultOf(evaluate(plateTechnique()), 'lift-off').status).toBe('not_applicable');
  });

  it('fails a coated part calibrated without a shim, and names the shim needed', () => {
    const output = evaluate(coated(0.25));
    const shim = resultsOf(output, 'lift-off').find((result) => result.coil === undefined)!;
    expect(shim.status).toBe('fail');
    expect(shim.message).toMatch(/shim of 0\.25 mm/);
    expect(output.verdict).toBe('does-not-conform');
  });

  it('fails a shim outside the tolerance and passes one within it (10 % by default)', () => {
    expect(resultsOf(evaluate(coated(0.25, 0.1)), 'lift-off').find((r) => r.coil === undefined)!.status).toBe('fail');
    expect(resultsOf(evaluate(coated(0.25, 0.26)), 'lift-off').find((r) => r.coil === undefined)!.status).toBe('pass');
  });

  it('reports the loss of flaw signal to the coating, more for a thicker coating, and warns past the policy limit', () => {
    const thin = resultsOf(evaluate(coated(0.05, 0.05)), 'lift-off').find((r) => r.coil === 0)!;
    const thick = resultsOf(evaluate(coated(1, 1)), 'lift-off').find((r) => r.coil === 0)!;
    expect(thin.values.sensitivityLossPercent as number).toBeGreaterThan(0);
    expect(thick.values.sensitivityLossPercent as number).toBeGreaterThan(thin.values.sensitivityLossPercent as number);
    // 1 mm under a 5 mm coil at 100 kHz: most of the near-surface signal is gone.
    expect(thick.status).toBe('warn');
    expect(thin.status).toBe('pass');
  });
});
