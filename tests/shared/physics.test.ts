import { describe, expect, it } from 'vitest';
import { magneticConstant } from 'mathjs';
import {
  conductivityMsPerMFromIacs,
  currentDensityRatio,
  effectiveDepthMm,
  fillFactorEncircling,
  fillFactorInternal,
  frequencyForDepthMm,
  iacsFromConductivityMsPerM,
  iacsFromResistivityMicroOhmCm,
  limitFrequencyHz,
  limitFrequencyThinWallTubeHz,
  MU0_H_PER_M,
  phaseLagDeg,
  phaseLagRad,
  resistivityMicroOhmCmFromIacs,
  standardDepthMm,
} from '../../shared/domain/physics';

// μ0 from a general-purpose library (mathjs physical constants, CODATA value), not from the project.
const MU0 = magneticConstant.toNumber('H / m');

/** δ in mm computed here from first principles with mathjs's μ0: δ = 1/√(π f μ0 μr σ). */
function referenceDepthMm(frequencyHz: number, sigmaMsPerM: number, mu = 1): number {
  return 1000 / Math.sqrt(Math.PI * frequencyHz * MU0 * mu * sigmaMsPerM * 1e6);
}

describe('conductivity and resistivity', () => {
  it('converts %IACS to MS/m with 100 %IACS = 58.0 MS/m', () => {
    // ASTM E1004 §1.4: 100 %IACS = 58.0 MS/m at 20 °C.
    expect(conductivityMsPerMFromIacs(100)).toBeCloseTo(58.0, 10);
    // 2024-T3 at 30 %IACS (docs/domain.md alloy table, from a published ET programmed-instruction text) → 17.4 MS/m.
    expect(conductivityMsPerMFromIacs(30)).toBeCloseTo(17.4, 10);
    expect(iacsFromConductivityMsPerM(58)).toBeCloseTo(100, 10);
  });

  it('gives the resistivity of the annealed copper standard, 1.7241 µΩ·cm, and back', () => {
    // IACS definition (ASTM E1004): ρ = 1/58 Ω·mm²/m = 1.7241 µΩ·cm at 100 %IACS; ρ[µΩ·cm] = 172.41/%IACS.
    expect(resistivityMicroOhmCmFromIacs(100)).toBeCloseTo(1.7241, 4);
    expect(resistivityMicroOhmCmFromIacs(30)).toBeCloseTo(5.747, 3);
    expect(iacsFromResistivityMicroOhmCm(1.7241)).toBeCloseTo(100, 2);
  });
});

describe('standard depth of penetration', () => {
  it.each([
    // [what, %IACS, f Hz, δ mm, source]
    ['copper at 60 Hz', 100, 60, 8.53], // docs/domain.md check value; published skin-depth tables give ≈ 8.5 mm
    ['copper at 1 kHz', 100, 1_000, 2.09], // docs/domain.md check value, from the formula
    ['2024-T3 at 100 kHz', 30, 100_000, 0.382], // docs/domain.md check value, from the formula
  ])('%s: δ = %s', (_what, iacs, frequencyHz, expectedMm) => {
    expect(standardDepthMm(frequencyHz, iacs)).toBeCloseTo(expectedMm, 2);
    // The same to about 1 part in 10⁹ from mathjs's μ0 (4π×10⁻⁷ and CODATA μ0 differ by 5.5×10⁻¹⁰).
    expect(standardDepthMm(frequencyHz, iacs) / referenceDepthMm(frequencyHz, conductivityMsPerMFromIacs(iacs))).toBeCloseTo(1, 8);
  });

  it('matches the published stainless steel worked example: σ = 1.4 MS/m at 100 kHz → δ ≈ 1.35 mm', () => {
    // Worked example in a published ET study text: 300-series stainless, σ = 1.4 MS/m, 100 kHz, δ ≈ 1.35 mm.
    const iacs = iacsFromConductivityMsPerM(1.4);
    expect(standardDepthMm(100_000, iacs)).toBeCloseTo(1.35, 2);
    expect(referenceDepthMm(100_000, 1.4)).toBeCloseTo(1.35, 2);
  });

  it('agrees with the engineering forms 660.9/√(f·μr·%IACS) and 50.3·√(ρ/(f·μr))', () => {
    // Engineering forms from standard ET formula sheets (docs/domain.md "Physics").
    for (const [iacs, f, mu] of [
      [100, 60, 1],
      [30, 100_000, 1],
      [2.5, 500_000, 1],
      [10, 1_000, 100],
    ]) {
      expect(standardDepthMm(f, iacs, mu)).toBeCloseTo(660.9 / Math.sqrt(f * mu * iacs), 2);
      // 50.3 is rounded (50.33 exactly): agree to 0.1 %.
      const ratio = standardDepthMm(f, iacs, mu) / (50.3 * Math.sqrt(172.41 / iacs / (f * mu)));
      expect(Math.abs(ratio - 1)).toBeLessThan(1e-3);
    }
  });

  it('gives the same δ for the same σ·f: Ti-6Al-4V (≈1 %IACS) at 100 kHz ≈ copper at 1 kHz', () => {
    // docs/domain.md: same σ·f gives the same δ; Ti-6Al-4V ≈ 1.0 %IACS is from memory.
    expect(standardDepthMm(100_000, 1.0)).toBeCloseTo(standardDepthMm(1_000, 100), 10);
  });

  it('scales as 1/√μr for ferromagnetic material', () => {
    // δ = 1/√(π f μ0 μr σ): follows from the formula.
    expect(standardDepthMm(1_000, 10, 100)).toBeCloseTo(standardDepthMm(1_000, 10) / 10, 10);
  });

  it('inverts: frequencyForDepthMm gives back the frequency', () => {
    for (const f of [60, 1_000, 40_000, 2e6]) {
      expect(frequencyForDepthMm(standardDepthMm(f, 30), 30) / f).toBeCloseTo(1, 10);
    }
  });

  it('gives NaN rather than throwing on impossible arguments', () => {
    expect(Number.isNaN(standardDepthMm(-1, 30))).toBe(true);
  });
});

describe('density and phase with depth', () => {
  it.each([
    // e^(−x/δ): 36.8 % at 1δ, 13.5 % at 2δ, 5.0 % at 3δ (docs/domain.md; standard ET formula sheets).
    [1, 0.368],
    [2, 0.135],
    [3, 0.05],
  ])('at %sδ the current density is %s of the surface value', (multiple, ratio) => {
    expect(currentDensityRatio(multiple * 0.7, 0.7)).toBeCloseTo(ratio, 3);
  });

  it('lags 1 rad = 57.3° per standard depth', () => {
    // θ = x/δ radians, 57.3° per δ (docs/domain.md; standard ET formula sheets).
    expect(phaseLagRad(0.5, 0.5)).toBeCloseTo(1, 12);
    expect(phaseLagDeg(0.5, 0.5)).toBeCloseTo(57.3, 1);
    expect(phaseLagDeg(3, 1)).toBeCloseTo(171.9, 1);
  });

  it('puts the effective depth at 3δ', () => {
    // Effective depth of penetration ≈ 3δ: common practice, no single source.
    expect(effectiveDepthMm(0.624)).toBeCloseTo(1.872, 10);
    expect(effectiveDepthMm(0.624, 2)).toBeCloseTo(1.248, 10);
  });
});

describe('limit frequency', () => {
  it('of a copper rod of 1 cm is 87.3 Hz and of a 2024 bar of 2 cm is 72.8 Hz', () => {
    // docs/domain.md check values for f_g = 5066/(σ[MS/m]·μr·d[cm]²) (attributed to Förster's work).
    expect(limitFrequencyHz(10, 100)).toBeCloseTo(87.3, 1);
    expect(limitFrequencyHz(20, 30)).toBeCloseTo(72.8, 1);
  });

  it('has the engineering constant 5066 = 2/(π μ0) in MS/m and cm, with mathjs μ0', () => {
    // 2/(π μ0 · 10⁶ · 10⁻⁴): the constant follows from μ0 (mathjs).
    const constant = 2 / (Math.PI * MU0 * 1e6 * 1e-4);
    expect(constant).toBeCloseTo(5066, 0);
    expect(limitFrequencyHz(10, 100)).toBeCloseTo(constant / 58, 4);
  });

  it('of a thin-walled tube is 5066/(σ·μr·d_i·w)', () => {
    // Förster's thin-wall form, from memory: d_i inside diameter and w wall, in cm.
    const fg = limitFrequencyThinWallTubeHz(16.57, 1.24, 28);
    expect(fg).toBeCloseTo(5066 / (16.24 * 1.657 * 0.124), 0);
  });

  it('uses 4π×10⁻⁷ H/m for μ0, within 10⁻⁹ of mathjs', () => {
    expect(MU0_H_PER_M / MU0).toBeCloseTo(1, 8);
  });
});

describe('fill factor', () => {
  it('of the shared bobbin example is (15.5/16.57)² ≈ 0.875', () => {
    // Shared example heat-exchanger-bobbin: η = (D_coil/ID)², ID = 19.05 − 2 × 1.24 = 16.57 mm.
    expect(fillFactorInternal(15.5, 19.05 - 2 * 1.24)).toBeCloseTo(0.875, 3);
  });

  it('of an encircling coil is (d_part/D_coil)²', () => {
    // η = (d/D)² [pub, docs/domain.md]: a 9 mm bar in a 10 mm coil fills 0.81.
    expect(fillFactorEncircling(9, 10)).toBeCloseTo(0.81, 12);
  });
});
