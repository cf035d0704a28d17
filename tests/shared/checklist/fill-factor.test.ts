import { describe, expect, it } from 'vitest';
import { parseTechnique } from '../../../shared/domain/checklist/index';
import { barTechnique, evaluate, plateTechnique, resultOf, tubeTechnique } from './techniques';

// Rule 5 (docs/domain.md): η = (d/D)² encircling, (D/ID)² internal ([pub]); minimums 0.7 / 0.8 ([trade], policy); η > 1 an input error.

describe('fill-factor', () => {
  it('passes the shared bobbin example at η ≈ 0.875', () => {
    // Shared example heat-exchanger-bobbin: (15.5 / 16.57)² ≈ 0.875 passes.
    const output = evaluate(tubeTechnique());
    expect(resultOf(output, 'fill-factor').status).toBe('pass');
    expect(output.values.fillFactor[0]).toBeCloseTo(0.875, 3);
  });

  it('fails a loose bobbin coil and says the smallest coil that would do', () => {
    // (14/16.57)² = 0.714 < 0.8; the smallest coil is √0.8 × 16.57 = 14.82 mm.
    const result = resultOf(evaluate(tubeTechnique({ coils: [{ type: 'bobbin', diameterMm: 14, mode: 'differential', frequenciesHz: [10_000] }] })), 'fill-factor');
    expect(result.status).toBe('fail');
    expect(result.values.fillFactor).toBeCloseTo(0.714, 3);
    expect(result.message).toMatch(/at least 14\.9 mm/);
  });

  it('passes an encircling coil at η = (20/22)² = 0.83 and fails one at (20/26)² = 0.59', () => {
    expect(resultOf(evaluate(barTechnique()), 'fill-factor').status).toBe('pass');
    const loose = resultOf(evaluate(barTechnique({ coils: [{ type: 'encircling', diameterMm: 26, mode: 'differential', frequenciesHz: [500] }] })), 'fill-factor');
    expect(loose.status).toBe('fail');
    expect(loose.values.fillFactor).toBeCloseTo(0.592, 3);
    // Largest coil: 20/√0.7 = 23.9 mm.
    expect(loose.message).toMatch(/at most 23\.9 mm/);
  });

  it('rejects η > 1 as an input error: a bobbin larger than the bore, or an encircling coil smaller than the bar', () => {
    const bobbin = parseTechnique(tubeTechnique({ coils: [{ type: 'bobbin', diameterMm: 17, mode: 'differential', frequenciesHz: [10_000] }] }));
    expect(bobbin.success).toBe(false);
    if (!bobbin.success) {
      expect(bobbin.issues[0].path).toBe('coils[0].diameterMm');
      expect(bobbin.issues[0].message).toMatch(/fill factor 1\.05 > 1/);
    }
    const encircling = parseTechnique(barTechnique({ coils: [{ type: 'encircling', diameterMm: 19, mode: 'differential', frequenciesHz: [500] }] }));
    expect(encircling.success).toBe(false);
    if (!encircling.success) expect(encircling.issues[0].message).toMatch(/impossible geometry/);
  });

  it('does not apply to surface coils', () => {
    expect(resultOf(evaluate(plateTechnique()), 'fill-factor').status).toBe('not_applicable');
  });
});
