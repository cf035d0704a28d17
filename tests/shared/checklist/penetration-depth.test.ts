import { describe, expect, it } from 'vitest';
import { standardDepthMm } from '../../../shared/domain/physics';
import { evaluate, plateTechnique, resultOf, resultsOf, tubeTechnique } from './techniques';
import type { TechniqueInput } from '../../../shared/domain/checklist/index';

// Penetration: the density of the coil's own field at the flaw against the policy minimum,
// e^(−3) ≈ 0.0498 (the plane-wave density at the trade's effective depth 3δ: common practice,
// no single source). δ = 1/√(π f μ0 μr σ) with 100 %IACS = 58.0 MS/m (ASTM E1004).

function farSidePlate(frequencyHz: number, depthMm = 2, diameterMm = 10): TechniqueInput {
  return plateTechnique({
    part: { form: 'plate', thicknessMm: 3 },
    coils: [{ type: 'surface', diameterMm, mode: 'absolute', frequenciesHz: [frequencyHz] }],
    scan: { indexMm: diameterMm / 2.5 },
    flaws: [{ id: 'far', orientation: 'transverse', location: 'far-side', depthMm, lengthMm: 10 }],
    // A far-side notch through the wall left below the flaw (3 − 2 = 1 mm).
    reference: { notches: [{ orientation: 'transverse', location: 'far-side', depthMm: 1, lengthMm: 10 }] },
  });
}

/** The worked example: a pencil probe over the far side of a 5 mm 7075 plate (32 %IACS) at 200 Hz. */
function pencilOnFarSide(diameterMm: number): TechniqueInput {
  return plateTechnique({
    part: { form: 'plate', thicknessMm: 5 },
    coils: [{ type: 'pencil', diameterMm, mode: 'absolute', frequenciesHz: [200] }],
    scan: { indexMm: diameterMm / 2 },
    flaws: [{ id: 'far', orientation: 'transverse', location: 'far-side', depthMm: 5, lengthMm: 20 }],
    reference: { notches: [{ orientation: 'transverse', depthMm: 1, lengthMm: 20 }] },
  });
}

describe('penetration-depth', () => {
  it('fails a 2 mm pencil probe on a flaw 5 mm down at 200 Hz in 7075, though 3δ = 24.8 mm, and says why and what would reach it', () => {
    // δ = 8.26 mm at 200 Hz in 32 %IACS; plane wave e^(−5/8.26) = 0.546. A 1 mm-radius loop's field
    // under its winding at 5 mm is about 0.4 % of the surface value [Dodd & Deeds, J. Appl. Phys. 39 (1968)].
    const result = resultOf(evaluate(pencilOnFarSide(2)), 'penetration-depth', 'far');
    expect(result.status).toBe('fail');
    expect(result.values.standardDepthMm).toBeCloseTo(8.26, 2);
    expect(result.values.planeWaveDensityRatio).toBeCloseTo(0.546, 3);
    expect(result.values.densityRatioAtFlaw as number).toBeLessThan(0.02);
    expect(result.values.densityRatioAtFlaw as number).toBeGreaterThan(0.002);
    expect(result.values.highestReachingFrequencyHz).toBeNull();
    expect(result.message).toMatch(/δ = 8\.26 mm and 3δ = 24\.8 mm/);
    expect(result.message).toMatch(/No frequency of this coil reaches it/);
    expect(result.message).toMatch(/A coil of about [\d.]+ mm diameter or more would reach it/);
  });

  it('passes a 12 mm coil on the same flaw, and reports the plane-wave figure beside its own', () => {
    // A 6 mm-radius loop gives about 11 % at 5 mm [Dodd & Deeds 1968]; the 12 mm winding with its defaults is of that order.
    const result = resultOf(evaluate(pencilOnFarSide(12)), 'penetration-depth', 'far');
    expect(result.status).toBe('pass');
    expect(result.values.densityRatioAtFlaw as number).toBeGreaterThan(0.0498);
    expect(result.values.densityRatioAtFlaw as number).toBeLessThan(0.546);
    expect(result.message).toMatch(/a plane wave, e\^\(−x\/δ\), would give 54\.6 %/);
    // The highest frequency that reaches must itself reach, and the recommended one lies at or below it.
    const highest = result.values.highestReachingFrequencyHz as number;
    expect(resultOf(evaluate({ ...pencilOnFarSide(12), coils: [{ ...pencilOnFarSide(12).coils[0], frequenciesHz: [highest] }] }), 'penetration-depth', 'far').status).toBe('pass');
    expect(result.values.recommendedFrequencyHz as number).toBeLessThanOrEqual(highest);
  });

  it('fails a far-side flaw at a frequency too high, names the highest frequency that reaches it, and that frequency passes', () => {
    // 7075-T6 at 32 %IACS, 100 kHz: δ = 0.369 mm; 2 mm is 5.4δ (plane wave e^(−5.4) = 0.45 %).
    const result = resultOf(evaluate(farSidePlate(100_000)), 'penetration-depth', 'far');
    expect(result.status).toBe('fail');
    const highest = result.values.highestReachingFrequencyHz as number;
    // Below the plane-wave bound f(3δ = 2 mm) ≈ 30.7 kHz: a 10 mm coil's field falls faster than a plane wave.
    expect(highest).toBeLessThan(30_700);
    expect(result.message).toMatch(new RegExp(`highest frequency at which this coil's field still reaches 2 mm is`));
    const fixed = evaluate(farSidePlate(highest));
    expect(resultOf(fixed, 'penetration-depth', 'far').status).toBe('pass');
  });

  it('keeps the δ ≈ 1.25 × depth rule of thumb as a cross-check', () => {
    const result = resultOf(evaluate(farSidePlate(100_000)), 'penetration-depth', 'far');
    const f90 = result.values.phaseSeparationFrequencyHz as number;
    expect(standardDepthMm(f90, 32) / (1.25 * 2)).toBeCloseTo(1, 2);
  });

  it('reports δ, 3δ, the plane wave and the field of a bobbin coil in a tube wall', () => {
    // Shared heat-exchanger example: at 40 kHz in 28 %IACS brass, δ = 660.9/√(40000 × 28) ≈ 0.624 mm, 3δ ≈ 1.87 mm;
    // e^(−1.0/0.624) ≈ 20.2 % and 1.0/0.624 rad ≈ 91.8° (J/J0 = e^(−x/δ), θ = x/δ).
    const output = evaluate(
      tubeTechnique({ coils: [{ type: 'bobbin', diameterMm: 15.5, mode: 'differential', frequenciesHz: [40_000, 160_000] }] }),
    );
    const result = resultOf(output, 'penetration-depth', 'axial-crack');
    expect(result.status).toBe('pass');
    expect(result.values.standardDepthMm).toBeCloseTo(0.62, 2);
    expect(result.values.reachDepthMm).toBeCloseTo(1.87, 2);
    expect(result.values.frequencyHz).toBe(40_000);
    expect(output.values.effectiveDepthMm[0][1]).toBeCloseTo(0.937, 3);
    expect(result.values.planeWaveDensityRatio).toBeCloseTo(0.202, 3);
    expect(result.values.currentPhaseLagDeg).toBeCloseTo(91.8, 1);
    expect(result.values.flawSignalPhaseLagDeg).toBeCloseTo(183.5, 0); // twice the current's lag
    expect(result.values.fieldModel).toBe('long-coil');
  });

  it('uses the deepest-reaching frequency of a multi-frequency coil', () => {
    const input = farSidePlate(100_000);
    input.coils[0].frequenciesHz = [100_000, 10_000];
    expect(resultOf(evaluate(input), 'penetration-depth', 'far')).toMatchObject({ status: 'pass', values: { frequencyHz: 10_000 } });
  });

  it('treats an air gap in a layered structure as lift-off, not attenuation', () => {
    // The flaw 2.6 mm down under 2.4 mm of metal and a 0.2 mm gap: the gap adds no attenuation, so the
    // layered density lies between those of 2.4 mm and 2.6 mm of solid metal.
    const base = farSidePlate(20_000, 2.6, 16);
    const solid = resultOf(evaluate(base), 'penetration-depth', 'far').values.densityRatioAtFlaw as number;
    const layered = { ...base, flaws: [{ ...base.flaws[0], location: 'subsurface' as const, metalAboveMm: 2.4 }] };
    const result = resultOf(evaluate(layered), 'penetration-depth', 'far');
    expect(result.values.depthMm).toBe(2.4);
    const shallow = resultOf(evaluate(farSidePlate(20_000, 2.4, 16)), 'penetration-depth', 'far').values.densityRatioAtFlaw as number;
    expect(result.values.densityRatioAtFlaw as number).toBeGreaterThan(solid);
    expect(result.values.densityRatioAtFlaw as number).toBeLessThan(shallow * 1.05);
  });

  it('takes the least density from the policy', () => {
    const passing = resultOf(evaluate(farSidePlate(10_000)), 'penetration-depth', 'far');
    expect(passing.status).toBe('pass');
    const above = (passing.values.densityRatioAtFlaw as number) * 1.1;
    expect(resultOf(evaluate(farSidePlate(10_000), { policy: { densityRatioMin: above } }), 'penetration-depth', 'far').status).toBe('fail');
  });

  it('gives a laminar flaw no penetration pass: its currents flow parallel to it', () => {
    const input = farSidePlate(10_000);
    const output = evaluate({ ...input, flaws: [{ id: 'lam', orientation: 'laminar', location: 'subsurface', depthMm: 1, lengthMm: 10 }] });
    expect(resultOf(output, 'penetration-depth', 'lam').status).toBe('not_applicable');
    expect(resultOf(output, 'penetration-depth', 'lam').message).toMatch(/parallel/);
  });

  it('does not apply when every flaw is open to the surface, and still reports δ and 3δ', () => {
    const output = evaluate(plateTechnique());
    expect(resultsOf(output, 'penetration-depth').map((result) => result.status)).toEqual(['not_applicable']);
    expect(resultOf(output, 'penetration-depth').message).toMatch(/δ = 0\.369 mm, 3δ = 1\.11 mm/);
  });
});
