import { describe, expect, it } from 'vitest';
import Complex from 'complex.js';
import ellipk from '@stdlib/math-base-special-ellipk';
import ellipe from '@stdlib/math-base-special-ellipe';
import { airCoilInductanceH, lineAngleDeg, solvePlanar } from '../../../shared/domain/fields/planar';
import { integrateAdaptive } from '../../../shared/domain/fields/quadrature';
import type { CoilGeometry, PlanarLayer } from '../../../shared/domain/fields/types';

const MU0 = 4 * Math.PI * 1e-7;
// 7075 at 32 %IACS: σ = 0.32 × 58.0 MS/m (ASTM E1004: 100 %IACS = 58.0 MS/m).
const SIGMA_7075 = 0.32 * 58;
const halfSpace = (conductivityMsPerM: number, relativePermeability = 1): PlanarLayer[] => [{ thicknessMm: Infinity, conductivityMsPerM, relativePermeability }];
const loop = (radiusMm: number, liftOffMm: number): CoilGeometry => ({ innerRadiusMm: radiusMm, outerRadiusMm: radiusMm, lengthMm: 0, liftOffMm });

/** Mutual inductance of two coaxial loops (Maxwell): M = μ0√(ab)[(2/k − k)K(k) − (2/k)E(k)], k² = 4ab/((a+b)² + d²). */
function maxwellMutualH(aMm: number, bMm: number, dMm: number): number {
  const a = aMm / 1000;
  const b = bMm / 1000;
  const d = dMm / 1000;
  const m = (4 * a * b) / ((a + b) ** 2 + d * d);
  const k = Math.sqrt(m);
  // @stdlib/math-base-special-ellipk 0.2.4 and -ellipe 0.3.1 take the parameter m = k².
  return MU0 * Math.sqrt(a * b) * ((2 / k - k) * ellipk(m) - (2 / k) * ellipe(m));
}

describe('planar coil model: the worked numbers of a loop over 7075 at 200 Hz', () => {
  // Single loop at 0.1 mm lift-off over 7075 (32 %IACS) at 200 Hz, δ = 8.26 mm; |J| under the
  // winding at 5 mm relative to the surface: 0.0042 (1 mm radius), 0.020 (2 mm), about 0.11 (6 mm);
  // plane wave e^(−5/8.26) = 0.546 [Dodd & Deeds, J. Appl. Phys. 39 (1968) 2829, loop over a half-space].
  it('gives 0.0042, 0.020 and about 0.11 for a half-space', () => {
    const at5 = (radiusMm: number) => solvePlanar(loop(radiusMm, 0.1), halfSpace(SIGMA_7075), 200).densityRatioUnderWinding(5);
    expect(at5(1)).toBeCloseTo(0.0042, 4);
    expect(at5(2)).toBeCloseTo(0.020, 3);
    // The worked figure for the 6 mm loop is 0.109 ("about 11 %"); the half-space gives 0.1034
    // (scipy 1.17.1 quad of the same Hankel integral, computed once: 0.10340).
    expect(at5(6)).toBeCloseTo(0.1034, 3);
    expect(Math.abs(at5(6) - 0.109)).toBeLessThan(0.01);
  });

  it('matches an independent quadrature for a 5 mm plate (far side), which gives slightly more', () => {
    // scipy 1.17.1 integrate.quad of the slab integral with air below, computed once:
    // 0.00434 (1 mm), 0.02056 (2 mm), 0.11163 (6 mm).
    const plate: PlanarLayer[] = [{ thicknessMm: 5, conductivityMsPerM: SIGMA_7075, relativePermeability: 1 }];
    const at5 = (radiusMm: number) => solvePlanar(loop(radiusMm, 0.1), plate, 200).densityRatioUnderWinding(5 * (1 - 1e-12));
    expect(at5(1)).toBeCloseTo(0.00434, 5);
    expect(at5(2)).toBeCloseTo(0.02056, 5);
    expect(at5(6)).toBeCloseTo(0.11163, 4);
  });
});

describe('planar coil model: limits', () => {
  const coil: CoilGeometry = { innerRadiusMm: 3, outerRadiusMm: 5, lengthMm: 5, liftOffMm: 0.5 };

  it('tends to no change against air at low frequency (ΔZ → 0 as ω → 0; ΔZ/ωL0 ∝ f: eddy currents ∝ dB/dt)', () => {
    const low = solvePlanar(coil, halfSpace(SIGMA_7075), 0.01).impedanceNormalised;
    const lower = solvePlanar(coil, halfSpace(SIGMA_7075), 0.001).impedanceNormalised;
    expect(low.abs()).toBeLessThan(1e-5);
    expect(lower.abs() / low.abs()).toBeCloseTo(0.1, 2);
  });

  it('under a coil much larger than δ the density falls as e^(−x/δ) with phase −x/δ (plane wave: δ = 1/√(πfμ0σ))', () => {
    // A winding from 50 to 150 mm radius over 7075 at 10 kHz: δ = 1.168 mm, the winding's edges 50 mm (43δ) from its mean radius.
    const big: CoilGeometry = { innerRadiusMm: 50, outerRadiusMm: 150, lengthMm: 5, liftOffMm: 0.1 };
    const delta = 1000 / Math.sqrt(Math.PI * 10_000 * MU0 * SIGMA_7075 * 1e6);
    const solution = solvePlanar(big, halfSpace(SIGMA_7075), 10_000);
    for (const x of [0.5, 1, 2]) {
      const relative = solution.densityUnderWindingRelative(x);
      expect(relative.abs() / Math.exp(-x / delta)).toBeCloseTo(1, 2);
      expect(relative.arg() / (-x / delta)).toBeCloseTo(1, 2);
    }
  });

  it('tends to the perfect-conductor image, ΔZ = −jωM(a, a, 2h), for a loop over a very good conductor (Maxwell\'s formula)', () => {
    // 5 mm loop at 1 mm over 58 MS/m at 100 MHz: δ = 6.6 µm ≪ h, so the image dominates to O(δ/h).
    const frequencyHz = 1e8;
    const solution = solvePlanar(loop(5, 1), halfSpace(58), frequencyHz);
    const omega = 2 * Math.PI * frequencyHz;
    const expected = -omega * maxwellMutualH(5, 5, 2);
    expect(solution.impedanceChangeOhm.im / expected).toBeCloseTo(1, 2);
    expect(Math.abs(solution.impedanceChangeOhm.re / expected)).toBeLessThan(0.01);
  });

  it('air-coil inductance of a thin ring: L = μ0 a [ln(8a/R) − 2] with R the geometric mean distance of its cross-section', () => {
    // Rosa & Grover, Bull. Bureau of Standards 8 (1912), thin circular ring; GMD of a square = 0.44705 × side (Maxwell). From memory.
    const ring: CoilGeometry = { innerRadiusMm: 4.95, outerRadiusMm: 5.05, lengthMm: 0.1, liftOffMm: 1 };
    const expected = MU0 * 0.005 * (Math.log((8 * 5) / (0.44705 * 0.1)) - 2);
    expect(airCoilInductanceH(ring) / expected).toBeCloseTo(1, 2);
  });

  it('one layer as thick as many δ equals the half-space, and a layer split in two equals the whole', () => {
    const frequencyHz = 20_000;
    const half = solvePlanar(coil, halfSpace(SIGMA_7075), frequencyHz);
    const thick = solvePlanar(coil, [{ thicknessMm: 40, conductivityMsPerM: SIGMA_7075, relativePermeability: 1 }], frequencyHz);
    expect(thick.impedanceNormalised.sub(half.impedanceNormalised).abs()).toBeLessThan(1e-9);
    const one = solvePlanar(coil, [{ thicknessMm: 2, conductivityMsPerM: SIGMA_7075, relativePermeability: 1 }], frequencyHz);
    const two = solvePlanar(
      coil,
      [
        { thicknessMm: 0.7, conductivityMsPerM: SIGMA_7075, relativePermeability: 1 },
        { thicknessMm: 1.3, conductivityMsPerM: SIGMA_7075, relativePermeability: 1 },
      ],
      frequencyHz,
    );
    expect(two.impedanceNormalised.sub(one.impedanceNormalised).abs() / one.impedanceNormalised.abs()).toBeLessThan(1e-9);
    expect(two.densityAt(4, 1.5).sub(one.densityAt(4, 1.5)).abs() / one.densityAt(4, 1.5).abs()).toBeLessThan(1e-9);
  });

  it('an air-gap layer adds lift-off, not attenuation', () => {
    const frequencyHz = 5_000;
    const gapped = solvePlanar(coil, [{ thicknessMm: 0.3, conductivityMsPerM: 0, relativePermeability: 1 }, ...halfSpace(SIGMA_7075)], frequencyHz);
    const lifted = solvePlanar({ ...coil, liftOffMm: coil.liftOffMm + 0.3 }, halfSpace(SIGMA_7075), frequencyHz);
    expect(gapped.impedanceNormalised.sub(lifted.impedanceNormalised).abs() / lifted.impedanceNormalised.abs()).toBeLessThan(1e-6);
    expect(gapped.densityAt(4, 1.3).sub(lifted.densityAt(4, 1)).abs() / lifted.densityAt(4, 1).abs()).toBeLessThan(1e-6);
    expect(gapped.densityRatioUnderWinding(1.3)).toBeCloseTo(lifted.densityRatioUnderWinding(1), 6);
  });

  it('the lift-off direction is the derivative of ΔZ/ωL0 with lift-off (central difference of the model itself as a check of the analytic form)', () => {
    const frequencyHz = 10_000;
    const h = 1e-3;
    const up = solvePlanar({ ...coil, liftOffMm: coil.liftOffMm + h }, halfSpace(SIGMA_7075), frequencyHz).impedanceNormalised;
    const down = solvePlanar({ ...coil, liftOffMm: coil.liftOffMm - h }, halfSpace(SIGMA_7075), frequencyHz).impedanceNormalised;
    const numeric = up.sub(down).div(2 * h);
    const analytic = solvePlanar(coil, halfSpace(SIGMA_7075), frequencyHz).liftOffDirection;
    expect(numeric.sub(analytic).abs() / analytic.abs()).toBeLessThan(1e-4);
  });

  it('balances power: Re(ΔZ)·I² equals the ohmic loss ∫|J|²/σ dV of the induced currents', () => {
    // Two independent computations of one quantity (Poynting: the resistance a conductor adds is its Joule loss).
    const frequencyHz = 2_000; // δ = 2.6 mm, comparable to the coil
    const small: CoilGeometry = { innerRadiusMm: 2, outerRadiusMm: 3, lengthMm: 2, liftOffMm: 0.5 };
    const solution = solvePlanar(small, halfSpace(SIGMA_7075), frequencyHz, { radialReachMm: 30 });
    const sigma = SIGMA_7075 * 1e6;
    const lossW = integrateAdaptive(
      (rMm) =>
        2 * Math.PI * rMm * integrateAdaptive((zMm) => solution.densityAt(rMm, zMm).abs() ** 2, 0, 20, { relTol: 1e-4, absTol: 0 }),
      0,
      30,
      { relTol: 1e-3, absTol: 0 },
    ) * 1e-9 / sigma; // mm³ → m³
    expect(lossW / solution.impedanceChangeOhm.re).toBeCloseTo(1, 2);
  });

  it('a flaw\'s response turns about twice as fast with depth as the current (E² under the winding)', () => {
    const big: CoilGeometry = { innerRadiusMm: 90, outerRadiusMm: 100, lengthMm: 5, liftOffMm: 0.1 };
    const solution = solvePlanar(big, halfSpace(SIGMA_7075), 10_000);
    const turn = solution.flawResponseAtDepth(1).div(solution.flawResponseAtDepth(0.5));
    const current = solution.densityUnderWindingRelative(1).div(solution.densityUnderWindingRelative(0.5));
    expect(turn.arg()).toBeCloseTo(2 * current.arg(), 6);
  });

  it('folds angles between impedance-plane directions to 0–90° (a line has no sign)', () => {
    expect(lineAngleDeg(new Complex(1, 0), new Complex(0, 1))).toBeCloseTo(90, 9);
    expect(lineAngleDeg(new Complex(1, 0), new Complex(-1, 0.0001))).toBeLessThan(0.01);
    expect(lineAngleDeg(new Complex(1, 1), new Complex(-1, 0))).toBeCloseTo(45, 9);
  });
});
