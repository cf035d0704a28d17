// Eddy current physics used by the checklist engine and drawn by the UI.
// Plain SI formulas (DOMAIN.md "Physics"); units are in every name. Pure math:
// out-of-range arguments give NaN or Infinity, never an exception.

/** Magnetic constant μ0 = 4π×10⁻⁷ H/m (the classical definition the ET formula sheets use). */
export const MU0_H_PER_M = 4 * Math.PI * 1e-7;

/** 100 %IACS = 58.0 MS/m at 20 °C (ASTM E1004). */
export const IACS_100_MS_PER_M = 58.0;

/** ρ[µΩ·cm] = 172.41 / %IACS (the resistivity of the annealed copper standard is 1.7241 µΩ·cm). */
export const IACS_RESISTIVITY_CONSTANT = 172.41;

/** Effective depth of penetration ≈ 3δ (common practice). */
export const EFFECTIVE_DEPTH_FACTOR = 3;

/** δ ≈ 1.25 × flaw depth separates flaw and lift-off signals by about 90° on the impedance plane (ET formula references). */
export const PHASE_SEPARATION_DEPTH_FACTOR = 1.25;

const RAD_TO_DEG = 180 / Math.PI;

export function conductivityMsPerMFromIacs(conductivityIacs: number): number {
  return (IACS_100_MS_PER_M / 100) * conductivityIacs;
}

export function iacsFromConductivityMsPerM(conductivityMsPerM: number): number {
  return (conductivityMsPerM * 100) / IACS_100_MS_PER_M;
}

export function resistivityMicroOhmCmFromIacs(conductivityIacs: number): number {
  return IACS_RESISTIVITY_CONSTANT / conductivityIacs;
}

export function iacsFromResistivityMicroOhmCm(resistivityMicroOhmCm: number): number {
  return IACS_RESISTIVITY_CONSTANT / resistivityMicroOhmCm;
}

/** Standard depth of penetration δ = 1/√(π f μ0 μr σ), where current density has fallen to 1/e of its surface value. */
export function standardDepthMm(frequencyHz: number, conductivityIacs: number, relativePermeability = 1): number {
  const sigmaSPerM = conductivityMsPerMFromIacs(conductivityIacs) * 1e6;
  return 1000 / Math.sqrt(Math.PI * frequencyHz * MU0_H_PER_M * relativePermeability * sigmaSPerM);
}

/** The frequency at which δ equals `depthMm` (inverse of standardDepthMm). */
export function frequencyForDepthMm(depthMm: number, conductivityIacs: number, relativePermeability = 1): number {
  const sigmaSPerM = conductivityMsPerMFromIacs(conductivityIacs) * 1e6;
  const depthM = depthMm / 1000;
  return 1 / (Math.PI * MU0_H_PER_M * relativePermeability * sigmaSPerM * depthM * depthM);
}

/** J(x)/J0 = e^(−x/δ). */
export function currentDensityRatio(depthMm: number, standardDepthMmValue: number): number {
  return Math.exp(-depthMm / standardDepthMmValue);
}

/** Phase lag θ = x/δ radians. */
export function phaseLagRad(depthMm: number, standardDepthMmValue: number): number {
  return depthMm / standardDepthMmValue;
}

/** Phase lag in degrees: 57.3° per standard depth. */
export function phaseLagDeg(depthMm: number, standardDepthMmValue: number): number {
  return phaseLagRad(depthMm, standardDepthMmValue) * RAD_TO_DEG;
}

/** Effective depth of penetration, k·δ (k = 3 by default). */
export function effectiveDepthMm(standardDepthMmValue: number, factor = EFFECTIVE_DEPTH_FACTOR): number {
  return factor * standardDepthMmValue;
}

/**
 * Limit (characteristic) frequency of a solid cylinder in an encircling coil:
 * f_g = 2/(π μ0 μr σ d²), i.e. f_g[Hz] = 5066/(σ[MS/m]·μr·d[cm]²).
 */
export function limitFrequencyHz(diameterMm: number, conductivityIacs: number, relativePermeability = 1): number {
  const sigmaSPerM = conductivityMsPerMFromIacs(conductivityIacs) * 1e6;
  const diameterM = diameterMm / 1000;
  return 2 / (Math.PI * MU0_H_PER_M * relativePermeability * sigmaSPerM * diameterM * diameterM);
}

/**
 * Limit frequency of a thin-walled tube, f_g[Hz] = 5066/(σ[MS/m]·μr·d_i[cm]·w[cm]),
 * d_i the inside diameter and w the wall (Förster's thin-wall form, from memory).
 * The engine's tube f_g comes from the tube model (fields/tube-limit-frequency.ts); this
 * formula is its thin-wall cross-check and is reported beside it.
 */
export function limitFrequencyThinWallTubeHz(
  insideDiameterMm: number,
  wallMm: number,
  conductivityIacs: number,
  relativePermeability = 1,
): number {
  const sigmaSPerM = conductivityMsPerMFromIacs(conductivityIacs) * 1e6;
  return 2 / (Math.PI * MU0_H_PER_M * relativePermeability * sigmaSPerM * (insideDiameterMm / 1000) * (wallMm / 1000));
}

/** Fill factor of an encircling coil, η = (d_part / D_coil)². */
export function fillFactorEncircling(partDiameterMm: number, coilDiameterMm: number): number {
  const ratio = partDiameterMm / coilDiameterMm;
  return ratio * ratio;
}

/** Fill factor of an internal (bobbin) coil, η = (D_coil / ID)². */
export function fillFactorInternal(coilDiameterMm: number, insideDiameterMm: number): number {
  const ratio = coilDiameterMm / insideDiameterMm;
  return ratio * ratio;
}
