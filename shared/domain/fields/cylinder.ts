// Long-coil field models: an encircling coil on a solid bar or a tube, and an internal
// (bobbin) coil in a tube. Fields are uniform along the axis (a coil much longer than
// the wall and δ); H has only its axial part H_z(r), the eddy current only its azimuthal
// part J_φ(r). Inside the metal H_z'' + H_z'/r − iωμ0μrσ H_z = 0, so
// H_z = C·H⁽¹⁾_0(kr) + D·H⁽²⁾_0(kr) with k = (1−i)/δ, and J_φ = −dH_z/dr = k(C·H⁽¹⁾_1 + D·H⁽²⁾_1).
// Boundary conditions (no surface currents on the metal; the coil is a current sheet
// K = NI/ℓ):
//   encircling: H_z(a) = K (the coil's field outside the part); in the air of a tube's
//     bore H_z is uniform, H_z(b⁻) = H_z(b⁺), and E_φ is continuous at b, where Faraday's
//     law over the bore gives E_φ(b) = −iωμ0·H_bore·b/2. A solid bar: H_z = K·J0(kr)/J0(ka).
//   internal: H_z(a) = 0 outside the tube (the field of a long current sheet vanishes
//     outside it); between coil and bore H_z = g·K, inside the coil (g + 1)·K; E_φ at b
//     from the flux of the whole bore, E_φ(b) = −iωμ0K(b²g + c²)/(2b).
// Normalised impedance Z/ωL0, L0 = μ0N²πc²/ℓ the empty coil's inductance (winding
// resistance left out): the flux linked by the coil over μ0Kπc², times i.
// See docs/domain-long-coils.md for the derivations and the checks in the tests.
import Complex from 'complex.js';
import { MU0_H_PER_M } from '../physics';
import { besselJScaled, hankelScaled } from './bessel';

export type LongCoilPlacement = 'encircling' | 'internal';

export interface LongCoilInput {
  placement: LongCoilPlacement;
  outerRadiusMm: number;
  /** Tube bore radius; omit for a solid bar (encircling coils only). */
  innerRadiusMm?: number;
  /** Mean radius of the winding. */
  coilRadiusMm: number;
  conductivityMsPerM: number;
  relativePermeability: number;
  frequencyHz: number;
}

export interface LongCoilSolution {
  /** Z/ωL0 of the long coil with the part inside (or the coil inside the tube), fill factor included. */
  impedanceNormalised: Complex;
  /**
   * Encircling: Förster's μ_eff, the part's flux over μ0μr·H·πa², so Z/ωL0 = i(1 − η + η·μr·μ_eff).
   * Internal: the bore's flux seen by the coil, Z/ωL0 = i(1 − η + η·μ_eff).
   */
  effectivePermeability: Complex;
  /** η: (a/c)² encircling, (c/b)² internal (at most 1). */
  fillFactor: number;
  /** |J| at that depth below the surface the coil faces, relative to |J| there; 0 outside the metal. */
  densityRatioAtDepth(depthMm: number): number;
  /**
   * Change of Z/ωL0 per unit fractional loss of conductivity (Δσ/σ = −1) in a thin shell
   * 1 mm thick at that depth (Born approximation: ∝ E², so its phase turns about twice the
   * current's lag). 0 outside the metal.
   */
  flawResponseAtDepth(depthMm: number): Complex;
  /** d(Z/ωL0)/dη at fixed part: the lift-off-like (fill-factor) direction of a long coil. */
  fillFactorDirection: Complex;
  /** J_φ/K at a radius, in 1/mm (K = NI/ℓ): the complex current density the coil induces. */
  currentDensityAtRadius(radiusMm: number): Complex;
  /** Standard depth δ used, mm. */
  standardDepthMm: number;
}

const I = new Complex(0, 1);

/** δ = 1/√(π f μ0 μr σ) in mm, σ in MS/m. */
export function standardDepthFromSigmaMm(frequencyHz: number, conductivityMsPerM: number, relativePermeability: number): number {
  return 1000 / Math.sqrt(Math.PI * frequencyHz * MU0_H_PER_M * relativePermeability * conductivityMsPerM * 1e6);
}

interface WallField {
  /** J_φ/K at radius r (1/mm). */
  current(radiusMm: number): Complex;
  /** Flux through the circle of the outer radius a (encircling) or of the coil (internal), over μ0Kπ·(a² or c²). */
  fluxRatio: Complex;
  /** Encircling: H_z at the bore (tube) or the axis (bar) over H_z at the outer surface. */
  farField?: Complex;
}

// ---------------------------------------------------------------- solid bar

function solidBar(a: number, k: Complex, delta: number, mu: number): WallField {
  const atSurface = besselJScaled(k.mul(a));
  const ka = k.mul(a);
  // μ_eff = 2J1(ka)/(ka·J0(ka)); the scale factors e^{−a/δ} cancel.
  const muEff = atSurface.order1.mul(2).div(ka.mul(atSurface.order0));
  return {
    fluxRatio: muEff.mul(mu),
    // 1/J0(ka), small-scaled: J0(ka) = J0s(ka)·e^{a/δ}.
    farField: Complex.ONE.div(atSurface.order0).mul(Math.exp(-a / delta)),
    current(r) {
      if (r <= 0 || r > a) return Complex.ZERO;
      const inside = besselJScaled(k.mul(r));
      // k·J1(kr)/J0(ka) with the scalings e^{r/δ}/e^{a/δ} put back.
      return k.mul(inside.order1).div(atSurface.order0).mul(Math.exp((r - a) / delta));
    },
  };
}

// ---------------------------------------------------------------- tube wall

/** Scaled basis: p_n(r) = H⁽¹⁾_n(kr)e^{−ika}, q_n(r) = H⁽²⁾_n(kr)e^{ikb}; both of size ≤ |H| at the wall's own face. */
function basis(k: Complex, r: number, a: number, b: number) {
  const h = hankelScaled(k.mul(r));
  const toP = I.mul(k).mul(r - a).exp(); // e^{ik(r−a)}: magnitude e^{(r−a)/δ} ≤ 1
  const toQ = I.mul(k).mul(b - r).exp(); // e^{−ik(r−b)}: magnitude e^{−(r−b)/δ} ≤ 1
  return { p0: h.first.order0.mul(toP), p1: h.first.order1.mul(toP), q0: h.second.order0.mul(toQ), q1: h.second.order1.mul(toQ) };
}

function tubeWall(placement: LongCoilPlacement, a: number, b: number, c: number, k: Complex, mu: number): WallField {
  const atA = basis(k, a, a, b);
  const atB = basis(k, b, a, b);
  const beta = k.mul(b / (2 * mu)); // E_φ continuity at the bore: H'(b) = −k²b/(2μr)·(bore term)
  const pB = atB.p1.sub(beta.mul(atB.p0));
  const qB = atB.q1.sub(beta.mul(atB.q0));
  let C: Complex;
  let D: Complex;
  let fluxRatio: Complex;
  let farField: Complex | undefined;
  if (placement === 'encircling') {
    // C p0(a) + D q0(a) = 1;  C (p1 − βp0)(b) + D (q1 − βq0)(b) = 0.
    const det = atA.p0.mul(qB).sub(atA.q0.mul(pB));
    C = qB.div(det);
    D = pB.neg().div(det);
    const hB = C.mul(atB.p0).add(D.mul(atB.q0)); // bore field over K
    // ∫ r C0(kr) dr = r C1(kr)/k through the wall, plus the bore.
    const rim = (r: number, at: ReturnType<typeof basis>) => C.mul(at.p1).add(D.mul(at.q1)).mul(r);
    const wall = rim(a, atA).sub(rim(b, atB)).div(k).mul((2 * mu) / (a * a));
    fluxRatio = wall.add(hB.mul((b * b) / (a * a)));
    farField = hB;
  } else {
    // C p0(a) + D q0(a) = 0;  C (p1 − βp0)(b) + D (q1 − βq0)(b) = β·c²/b²;  g = C p0(b) + D q0(b).
    const eta = (c * c) / (b * b);
    const det = pB.mul(atA.q0).sub(qB.mul(atA.p0));
    C = beta.mul(eta).mul(atA.q0).div(det);
    D = beta.mul(eta).mul(atA.p0).neg().div(det);
    const g = C.mul(atB.p0).add(D.mul(atB.q0));
    fluxRatio = g.add(1); // the coil's own flux: (g + 1)K over its area
  }
  return {
    fluxRatio,
    farField,
    current(r) {
      if (r < b || r > a) return Complex.ZERO;
      const at = basis(k, r, a, b);
      return k.mul(C.mul(at.p1).add(D.mul(at.q1)));
    },
  };
}

/**
 * H at the bore of a tube (or the axis of a bar) over H at its outer surface, in an
 * encircling coil: how much of the coil's field the wall lets through, and its lag.
 */
export function transmittedFieldRatio(outerRadiusMm: number, innerRadiusMm: number | undefined, conductivityMsPerM: number, relativePermeability: number, frequencyHz: number): Complex {
  const delta = standardDepthFromSigmaMm(frequencyHz, conductivityMsPerM, relativePermeability);
  const k = new Complex(1, -1).div(delta);
  const b = innerRadiusMm ?? 0;
  const field = b <= 0 ? solidBar(outerRadiusMm, k, delta, relativePermeability) : tubeWall('encircling', outerRadiusMm, b, outerRadiusMm, k, relativePermeability);
  return field.farField as Complex;
}

// ---------------------------------------------------------------- solution

/** Out-of-range input (an internal coil without a bore, a wall thicker than the radius, f ≤ 0): NaN throughout, never an exception. */
function invalidSolution(delta: number): LongCoilSolution {
  const nan = new Complex(NaN, NaN);
  return {
    impedanceNormalised: nan,
    effectivePermeability: nan,
    fillFactor: NaN,
    standardDepthMm: delta,
    fillFactorDirection: nan,
    currentDensityAtRadius: () => nan,
    densityRatioAtDepth: () => NaN,
    flawResponseAtDepth: () => nan,
  };
}

function solve(input: LongCoilInput): LongCoilSolution {
  const { placement, outerRadiusMm: a, coilRadiusMm: c, conductivityMsPerM, relativePermeability: mu, frequencyHz } = input;
  const b = input.innerRadiusMm ?? 0;
  const delta = standardDepthFromSigmaMm(frequencyHz, conductivityMsPerM, mu);
  const k = new Complex(1, -1).div(delta);
  const solid = b <= 0;
  const valid = a > 0 && b < a && c > 0 && conductivityMsPerM > 0 && mu > 0 && frequencyHz > 0 && !(placement === 'internal' && solid);
  if (!valid) return invalidSolution(delta);
  const field = solid ? solidBar(a, k, delta, mu) : tubeWall(placement, a, b, c, k, mu);
  const fillFactor = Math.min(1, placement === 'encircling' ? (a * a) / (c * c) : (c * c) / (b * b));

  let effectivePermeability: Complex;
  let impedanceNormalised: Complex;
  let fillFactorDirection: Complex;
  if (placement === 'encircling') {
    effectivePermeability = field.fluxRatio.div(mu);
    impedanceNormalised = I.mul(field.fluxRatio.sub(1).mul(fillFactor).add(1));
    fillFactorDirection = I.mul(field.fluxRatio.sub(1));
  } else {
    // fluxRatio = 1 + g with g ∝ η (the source term is β·η), so μ_eff = 1 + g/η.
    const exactEta = (c * c) / (b * b);
    effectivePermeability = field.fluxRatio.sub(1).div(exactEta).add(1);
    impedanceNormalised = I.mul(field.fluxRatio);
    fillFactorDirection = I.mul(effectivePermeability.sub(1));
  }

  const faced = placement === 'encircling' ? a : b;
  const radiusAt = (depthMm: number) => (placement === 'encircling' ? a - depthMm : b + depthMm);
  const surfaceDensity = field.current(faced).abs();
  return {
    impedanceNormalised,
    effectivePermeability,
    fillFactor,
    standardDepthMm: delta,
    fillFactorDirection,
    currentDensityAtRadius: (r) => field.current(r),
    densityRatioAtDepth(depthMm) {
      if (depthMm <= 0) return depthMm === 0 ? 1 : 0;
      return field.current(radiusAt(depthMm)).abs() / surfaceDensity;
    },
    flawResponseAtDepth(depthMm) {
      const r = radiusAt(depthMm);
      const current = field.current(r);
      // ΔZ/ωL0 per mm of shell = −i·μr·(2r/c²)·(J_φ/(kK))² (Born, reciprocity: ΔZ·I² = −∫Δσ E·E dV).
      const shape = current.div(k);
      return shape.mul(shape).mul(I.neg()).mul((mu * 2 * r) / (c * c));
    },
  };
}

const CACHE_LIMIT = 4000;
const cache = new Map<string, LongCoilSolution>();

/** The long-coil solution, cached by geometry, σ, μr and f (the editor re-evaluates on every keystroke). */
export function solveLongCoil(input: LongCoilInput): LongCoilSolution {
  const key = `${input.placement}|${input.outerRadiusMm}|${input.innerRadiusMm ?? ''}|${input.coilRadiusMm}|${input.conductivityMsPerM}|${input.relativePermeability}|${input.frequencyHz}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const solution = solve(input);
  if (cache.size >= CACHE_LIMIT) cache.clear();
  cache.set(key, solution);
  return solution;
}

// ---------------------------------------------------------------- for charts

export interface DensityPoint {
  depthMm: number;
  /** |J|/|J_surface| of this coil's field. */
  densityRatio: number;
  /** Phase of J relative to the surface, degrees (negative: lagging). */
  phaseDeg: number;
}

/** Density from the faced surface through the wall (tube) or to the axis (bar), `points` evenly spaced. */
export function densityProfile(input: LongCoilInput, points = 50): DensityPoint[] {
  const solution = solveLongCoil(input);
  const b = input.innerRadiusMm ?? 0;
  const span = input.outerRadiusMm - b;
  const faced = input.placement === 'encircling' ? input.outerRadiusMm : b;
  const surface = solution.currentDensityAtRadius(faced);
  const out: DensityPoint[] = [];
  for (let i = 0; i <= points; i++) {
    const depthMm = (span * i) / points;
    const r = input.placement === 'encircling' ? input.outerRadiusMm - depthMm : b + depthMm;
    const current = solution.currentDensityAtRadius(r);
    const ratio = current.abs() / surface.abs();
    out.push({ depthMm, densityRatio: ratio, phaseDeg: ratio === 0 ? 0 : (current.div(surface).arg() * 180) / Math.PI });
  }
  return out;
}

/** The normalised impedance Z/ωL0 over a list of frequencies: the locus an impedance-plane chart draws. */
export function impedanceLocus(input: Omit<LongCoilInput, 'frequencyHz'>, frequenciesHz: readonly number[]): { frequencyHz: number; impedanceNormalised: Complex }[] {
  return frequenciesHz.map((frequencyHz) => ({ frequencyHz, impedanceNormalised: solveLongCoil({ ...input, frequencyHz }).impedanceNormalised }));
}
