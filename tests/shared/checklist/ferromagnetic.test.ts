import { describe, expect, it } from 'vitest';
import { DEFAULT_POLICY } from '../../../shared/domain/policy';
import { fieldRelativePermeability, permeabilityText } from '../../../shared/domain/checklist/permeability';
import { TechniqueSchema } from '../../../shared/schemas/technique';
import { barTechnique, evaluate, plateTechnique, resultOf } from './techniques';

// Ferromagnetic material [pub: ASTM E309]: at or above the policy threshold (default μr 1.05,
// common practice, no single source) it fails unless saturated or justified; a saturated material is
// seen through its incremental permeability (entered, or the policy default 2, from memory).

const steel = { name: 'carbon steel', conductivityIacs: 10, relativePermeability: 100 };

describe('ferromagnetic', () => {
  it('fails ferromagnetic material without saturation or justification, citing ASTM E309, and never advises μr = 1', () => {
    const output = evaluate(plateTechnique({ material: steel, reference: { conductivityIacs: 10 } }));
    const result = resultOf(output, 'ferromagnetic');
    expect(result.status).toBe('fail');
    expect(result.basis).toMatch(/ASTM E309/);
    expect(result.message).toMatch(/saturation/);
    expect(result.message).not.toMatch(/μr = 1\b/);
    // δ shrinks by √μr = √100 = 10 (δ ∝ 1/√μr, standard depth formula).
    expect(result.message).toMatch(/10 times smaller/);
    expect(output.verdict).toBe('does-not-conform');
  });

  it('passes Ti-6Al-4V entered with its data-sheet μr of 1.00005, and says so with every digit', () => {
    // μr 1.00005: titanium alloy data sheets (the figure quoted for Ti-6Al-4V); ≈ 1 %IACS, from memory.
    const output = evaluate(plateTechnique({ material: { name: 'Ti-6Al-4V', conductivityIacs: 1, relativePermeability: 1.00005 }, reference: { conductivityIacs: 1 } }));
    const result = resultOf(output, 'ferromagnetic');
    expect(result.status).toBe('pass');
    expect(result.message).toMatch(/μr = 1\.00005/);
    expect(result.message).toMatch(/below the ferromagnetic threshold/);
    expect(result.message).not.toMatch(/saturat/);
    expect(output.verdict).toBe('conforms');
  });

  it('passes annealed austenitic stainless steel', () => {
    // 304 stainless: 2.5 %IACS (published ET conductivity table); annealed μr ≈ 1.02 (from memory).
    const output = evaluate(plateTechnique({ material: { name: '304 stainless, annealed', conductivityIacs: 2.5, relativePermeability: 1.02 }, reference: { conductivityIacs: 2.5 } }));
    expect(resultOf(output, 'ferromagnetic').status).toBe('pass');
    expect(output.verdict).toBe('conforms');
  });

  it('passes with magnetic saturation and uses the incremental μr entered for δ', () => {
    const output = evaluate(plateTechnique({ material: { ...steel, saturated: true, incrementalPermeability: 1.5 }, reference: { conductivityIacs: 10 } }));
    const result = resultOf(output, 'ferromagnetic');
    expect(result.status).toBe('pass');
    expect(result.message).toMatch(/incremental permeability the technique gives, μr = 1\.5/);
    // δ[mm] = 660.9/√(f·μr·%IACS) (engineering form of the standard depth formula) with μr = 1.5, not 100.
    expect(output.values.standardDepthMm[0][0]).toBeCloseTo(660.9 / Math.sqrt(100_000 * 1.5 * 10), 3);
  });

  it('uses the policy incremental μr for a saturated material that gives none, in δ and in f_g', () => {
    const technique = barTechnique({ material: { ...steel, saturated: true }, reference: { conductivityIacs: 10 } });
    const output = evaluate(technique);
    const mu = DEFAULT_POLICY.saturatedIncrementalPermeability;
    expect(mu).toBe(2);
    expect(resultOf(output, 'ferromagnetic').message).toMatch(/policy's incremental permeability/);
    // δ = 660.9/√(500 × 2 × 10) mm; f_g[Hz] = 5066/(σ[MS/m]·μr·d[cm]²) with σ = 5.8 MS/m, d = 2 cm
    // (engineering forms of the standard formulas, constants from μ0).
    expect(output.values.standardDepthMm[0][0]).toBeCloseTo(660.9 / Math.sqrt(500 * mu * 10), 3);
    expect(output.values.limitFrequencyHz!).toBeCloseTo(5066 / (5.8 * mu * 4), 0);
    expect(fieldRelativePermeability(TechniqueSchema.parse(technique), DEFAULT_POLICY)).toBe(2);
  });

  it('never raises μr above the static value when saturation is declared', () => {
    const technique = TechniqueSchema.parse(plateTechnique({ material: { name: 'weakly magnetic steel', conductivityIacs: 3, relativePermeability: 1.6, saturated: true }, reference: { conductivityIacs: 3 } }));
    expect(fieldRelativePermeability(technique, DEFAULT_POLICY)).toBe(1.6);
  });

  it('warns with a recorded justification, quoting it for review', () => {
    const result = resultOf(
      evaluate(plateTechnique({ material: { ...steel, ferromagneticJustification: 'Surface cracks only; permeability checked on the reference block.' }, reference: { conductivityIacs: 10 } })),
      'ferromagnetic',
    );
    expect(result.status).toBe('warn');
    expect(result.message).toMatch(/permeability checked on the reference block/);
  });

  it('does not apply to non-magnetic material', () => {
    expect(resultOf(evaluate(plateTechnique()), 'ferromagnetic').status).toBe('not_applicable');
  });

  it('writes μr with the digits that matter', () => {
    expect(permeabilityText(1.00005)).toBe('1.00005');
    expect(permeabilityText(1)).toBe('1');
    expect(permeabilityText(250)).toBe('250');
  });
});
