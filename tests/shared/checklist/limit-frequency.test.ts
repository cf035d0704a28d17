import { describe, expect, it } from 'vitest';
import { ratioText } from '../../../shared/domain/checklist/rules/limit-frequency';
import { barTechnique, evaluate, plateTechnique, resultOf, tubeTechnique } from './techniques';

// Rule 5 (docs/domain.md): f_g = 5066/(σ·μr·d²) ([pub]); working window f/f_g ≈ 5–15 ([mem], policy).

describe('limit-frequency', () => {
  it('passes a 2024 bar of 2 cm at 500 Hz: f_g = 72.8 Hz, f/f_g = 6.9', () => {
    // docs/domain.md check value: 2024 bar d = 2 cm → f_g = 72.8 Hz.
    const output = evaluate(barTechnique());
    expect(output.values.limitFrequencyHz).toBeCloseTo(72.8, 1);
    expect(output.values.frequencyRatio[0][0]).toBeCloseTo(6.87, 2);
    expect(resultOf(output, 'limit-frequency').status).toBe('pass');
  });

  it('warns outside the window and gives the window in hertz', () => {
    const result = resultOf(
      evaluate(barTechnique({ coils: [{ type: 'encircling', diameterMm: 22, mode: 'differential', frequenciesHz: [5_000] }] })),
      'limit-frequency',
    );
    expect(result.status).toBe('warn');
    expect(result.message).toMatch(/364 Hz to 1\.09 kHz/);
  });

  it('passes when any of several frequencies is in the window', () => {
    const output = evaluate(barTechnique({ coils: [{ type: 'encircling', diameterMm: 22, mode: 'differential', frequenciesHz: [5_000, 700] }] }));
    expect(resultOf(output, 'limit-frequency').status).toBe('pass');
  });

  it('uses the tube model for a tube and keeps the thin-walled figure beside it', () => {
    // Förster's thin-wall form (from memory): 5066/(16.24 × 1.657 × 0.124) ≈ 1518 Hz. The wall is 15 % of the
    // bore radius, so the tube model (45° lag of the field reaching the bore) lies below it, by about the
    // wall-to-radius ratio (the thin-wall formula takes the bore diameter for the wall's mean diameter).
    const output = evaluate(tubeTechnique());
    const result = resultOf(output, 'limit-frequency');
    expect(result.values.limitFrequencyThinWallHz as number).toBeCloseTo(1518, -1);
    const model = output.values.limitFrequencyHz as number;
    expect(model).toBeLessThan(1518);
    expect(model).toBeGreaterThan(1518 * 0.85);
    expect(result.status).toBe('pass');
    expect(result.message).toMatch(/tube model/);
    expect(result.message).toMatch(/thin-walled tube formula gives 1\.52 kHz/);
  });

  it('prints f/f_g with enough digits that it never reads as inside the window when it is outside', () => {
    const fg = evaluate(barTechnique()).values.limitFrequencyHz as number;
    const output = evaluate(barTechnique({ coils: [{ type: 'encircling', diameterMm: 22, mode: 'differential', frequenciesHz: [15.03 * fg] }] }));
    const result = resultOf(output, 'limit-frequency');
    expect(result.status).toBe('warn');
    expect(result.message).toMatch(/f\/f_g = 15\.03\)/);
    expect(ratioText(14.996, 5, 15)).toBe('14.996');
    expect(ratioText(4.9996, 5, 15)).toBe('4.9996');
    expect(ratioText(6.87, 5, 15)).toBe('6.87');
    expect(ratioText(15, 5, 15)).toBe('15');
  });

  it('does not apply to a plate, nor to a bobbin in a bore', () => {
    expect(resultOf(evaluate(plateTechnique()), 'limit-frequency').status).toBe('not_applicable');
    const bore = evaluate(tubeTechnique({ part: { form: 'bore', diameterMm: 16.57 } }));
    expect(resultOf(bore, 'limit-frequency')).toMatchObject({ status: 'not_applicable', coil: 0 });
  });
});
