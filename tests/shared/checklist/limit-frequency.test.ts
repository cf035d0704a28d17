import { describe, expect, it } from 'vitest';
import { barTechnique, evaluate, plateTechnique, resultOf, tubeTechnique } from './techniques';

// Rule 5 (DOMAIN.md): f_g = 5066/(σ·μr·d²) ([pub]); working window f/f_g ≈ 5–15 ([mem], policy).

describe('limit-frequency', () => {
  it('passes a 2024 bar of 2 cm at 500 Hz: f_g = 72.8 Hz, f/f_g = 6.9', () => {
    // DOMAIN.md check value: 2024 bar d = 2 cm → f_g = 72.8 Hz.
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

  it('uses the thin-walled tube form for a tube', () => {
    // Förster's thin-wall form (from memory): 5066/(16.24 × 1.657 × 0.124) ≈ 1518 Hz; 10 kHz gives f/f_g ≈ 6.6.
    const output = evaluate(tubeTechnique());
    expect(output.values.limitFrequencyHz).toBeCloseTo(1518, -1);
    expect(resultOf(output, 'limit-frequency').status).toBe('pass');
  });

  it('does not apply to a plate, nor to a bobbin in a bore', () => {
    expect(resultOf(evaluate(plateTechnique()), 'limit-frequency').status).toBe('not_applicable');
    const bore = evaluate(tubeTechnique({ part: { form: 'bore', diameterMm: 16.57 } }));
    expect(resultOf(bore, 'limit-frequency')).toMatchObject({ status: 'not_applicable', coil: 0 });
  });
});
