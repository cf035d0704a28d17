// Ready-to-draw series from the planar model, for the technique screens (depth plot,
// impedance plane, r–z density map). Pure; every call is cached underneath by
// (coil, layers, frequency).
import type Complex from 'complex.js';
import { lineAngleDeg, solvePlanar } from './planar';
import type { CoilGeometry, PlanarLayer } from './types';

export interface PlanarDensityPoint {
  depthMm: number;
  /** |J| under the winding relative to the surface of the first conducting layer. */
  densityRatio: number;
  /** Phase of J relative to the surface, degrees (negative: lagging). */
  phaseDeg: number;
}

/** Density under the winding from the surface to `maxDepthMm`, `points` + 1 evenly spaced depths. */
export function planarDensityProfile(coil: CoilGeometry, layers: readonly PlanarLayer[], frequencyHz: number, maxDepthMm: number, points = 40): PlanarDensityPoint[] {
  const solution = solvePlanar(coil, layers, frequencyHz);
  const out: PlanarDensityPoint[] = [];
  for (let i = 0; i <= points; i++) {
    const depthMm = (maxDepthMm * i) / points;
    const relative = solution.densityUnderWindingRelative(depthMm);
    out.push({ depthMm, densityRatio: relative.abs(), phaseDeg: (relative.arg() * 180) / Math.PI });
  }
  return out;
}

export interface PlanarLocusPoint {
  frequencyHz: number;
  /** ΔZ/ωL0: the impedance change against air, normalised (air at the origin). */
  impedanceNormalised: Complex;
  /** d(ΔZ/ωL0)/d(lift-off) per mm. */
  liftOffDirection: Complex;
}

/** The normalised impedance over frequency (the locus an impedance-plane chart draws), with the lift-off direction at each point. */
export function planarImpedanceLocus(coil: CoilGeometry, layers: readonly PlanarLayer[], frequenciesHz: readonly number[]): PlanarLocusPoint[] {
  return frequenciesHz.map((frequencyHz) => {
    const solution = solvePlanar(coil, layers, frequencyHz);
    return { frequencyHz, impedanceNormalised: solution.impedanceNormalised, liftOffDirection: solution.liftOffDirection };
  });
}

export interface FlawDirection {
  depthMm: number;
  /** Change of ΔZ/ωL0 for the loss of 1 mm³ of metal at that depth under the winding. */
  flawResponse: Complex;
  /** Angle between its line and the lift-off line, 0–90°. */
  phaseSeparationDeg: number;
}

/** Each flaw depth's direction on the impedance plane at one frequency, and its angle to lift-off. */
export function planarFlawDirections(coil: CoilGeometry, layers: readonly PlanarLayer[], frequencyHz: number, depthsMm: readonly number[]): FlawDirection[] {
  const solution = solvePlanar(coil, layers, frequencyHz);
  return depthsMm.map((depthMm) => {
    const flawResponse = solution.flawResponseAtDepth(depthMm);
    return { depthMm, flawResponse, phaseSeparationDeg: lineAngleDeg(solution.liftOffDirection, flawResponse) };
  });
}

/**
 * |J| in the r–z plane under the coil, relative to |J| at the surface under the winding:
 * rows by depth (0 … maxDepthMm), columns by radius (0 … maxRadiusMm, at most twice the outer radius for full accuracy).
 */
export function planarDensityMap(
  coil: CoilGeometry,
  layers: readonly PlanarLayer[],
  frequencyHz: number,
  { maxRadiusMm, maxDepthMm, columns = 30, rows = 30 }: { maxRadiusMm: number; maxDepthMm: number; columns?: number; rows?: number },
): { radiiMm: number[]; depthsMm: number[]; densityRatio: number[][] } {
  const solution = solvePlanar(coil, layers, frequencyHz, { radialReachMm: Math.max(maxRadiusMm, coil.outerRadiusMm) });
  const meanRadiusMm = (coil.innerRadiusMm + coil.outerRadiusMm) / 2;
  const firstMetal = Math.max(0, layers.findIndex((layer) => layer.conductivityMsPerM > 0));
  const surfaceMm = layers.slice(0, firstMetal).reduce((sum, layer) => sum + layer.thicknessMm, 0);
  const reference = solution.densityAt(meanRadiusMm, surfaceMm).abs();
  const radiiMm = Array.from({ length: columns + 1 }, (_, i) => (maxRadiusMm * i) / columns);
  const depthsMm = Array.from({ length: rows + 1 }, (_, i) => (maxDepthMm * i) / rows);
  const densityRatio = depthsMm.map((depthMm) => radiiMm.map((radiusMm) => solution.densityAt(radiusMm, depthMm).abs() / reference));
  return { radiiMm, depthsMm, densityRatio };
}
