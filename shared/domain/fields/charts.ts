// What the technique screens draw from the coil field models: this coil's current
// density against depth (with the plane wave beside it), the impedance plane of the
// coil on this part (locus over frequency, lift-off and flaw directions at each test
// frequency) and the density in the r–z plane under a probe. Pure: the browser calls
// these, deferred, as the technique changes.
import type Complex from 'complex.js';
import { standardDepthMm } from '../physics';
import { coilGeometry } from './geometry';
import { solvePlanar } from './planar';
import { solveLongCoil } from './cylinder';
import { createCoilFields, isLongCoil, longCoilInput, planarLayers, type FieldModel, type FieldSetting } from '../checklist/coil-field';
import type { Technique } from '../../schemas/technique';

export interface DepthCurvePoint {
  depthMm: number;
  /** |J| of this coil's field over |J| at the surface it faces (under the winding; at the radius in a bar or tube); null past the metal's end. */
  coilRatio: number | null;
  /** e^(−x/δ). */
  planeWaveRatio: number;
}

export interface DepthCurve {
  coilIndex: number;
  frequencyIndex: number;
  frequencyHz: number;
  deltaMm: number;
  model: FieldModel;
  points: DepthCurvePoint[];
}

/** Metal the coil faces, mm: plate or wall thickness, bar radius; Infinity when the part does not say. */
function metalSpanMm(technique: Technique, coilIndex: number): number {
  const { part } = technique;
  const coil = technique.coils[coilIndex];
  if (part.form === 'bar' && isLongCoil(coil)) return (part.diameterMm ?? Infinity) / 2;
  if (part.form === 'tube') return part.wallMm ?? Infinity;
  if (part.form === 'plate') return part.thicknessMm ?? Infinity;
  return part.thicknessMm ?? Infinity;
}

/** Density against depth for every coil and test frequency at `points + 1` even steps from 0 to `maxDepthMm` (none past the metal's end). */
export function depthCurves(setting: FieldSetting, maxDepthMm: number, points = 60): DepthCurve[] {
  const { technique, relativePermeability } = setting;
  const { material, part } = technique;
  const curves: DepthCurve[] = [];
  technique.coils.forEach((coil, c) => {
    const endMm = Math.min(maxDepthMm, metalSpanMm(technique, c));
    coil.frequenciesHz.forEach((frequencyHz, i) => {
      const deltaMm = standardDepthMm(frequencyHz, material.conductivityIacs, relativePermeability);
      const depths = Array.from({ length: points + 1 }, (_, n) => (maxDepthMm * n) / points);
      let model: FieldModel = 'planar';
      let ratioAt: (depthMm: number) => number;
      const longInput = isLongCoil(coil) ? longCoilInput(coil, part, setting, frequencyHz) : null;
      if (longInput) {
        model = 'long-coil';
        const solution = solveLongCoil(longInput);
        ratioAt = (depthMm) => solution.densityRatioAtDepth(depthMm);
      } else {
        const layers = planarLayers(part, material.conductivityIacs, relativePermeability);
        const total = layers.reduce((sum, layer) => sum + layer.thicknessMm, 0);
        const solution = solvePlanar(coilGeometry(coil, part), layers, frequencyHz);
        ratioAt = (depthMm) => solution.densityRatioUnderWinding(Math.min(depthMm, total * (1 - 1e-9)));
      }
      curves.push({
        coilIndex: c,
        frequencyIndex: i,
        frequencyHz,
        deltaMm,
        model,
        points: depths.map((depthMm) => ({ depthMm, coilRatio: depthMm <= endMm ? ratioAt(depthMm) : null, planeWaveRatio: Math.exp(-depthMm / deltaMm) })),
      });
    });
  });
  return curves;
}

export interface PlanePoint {
  /** Normalised resistance R/ωL0 (the air point is at 0). */
  resistance: number;
  /** Normalised reactance X/ωL0 (1 in air). */
  reactance: number;
}

export interface FlawDirection {
  flawId: string;
  /** Unit vector of the flaw's response on the plane. */
  direction: PlanePoint;
  /** Angle between the lift-off line and the flaw's response, 0–90°. */
  separationDeg: number;
}

export interface ImpedancePlane {
  coilIndex: number;
  model: FieldModel;
  /** Z/ωL0 of the coil on this part as the frequency sweeps, low to high. */
  locus: (PlanePoint & { frequencyHz: number })[];
  /** At each test frequency: the operating point, the lift-off direction and each flaw below the surface. */
  testPoints: (PlanePoint & { frequencyHz: number; liftOff: PlanePoint; flaws: FlawDirection[] })[];
}

const unit = (value: Complex): PlanePoint => {
  const size = value.abs();
  return size > 0 ? { resistance: value.re / size, reactance: value.im / size } : { resistance: 0, reactance: 0 };
};

function logSweep(lowHz: number, highHz: number, count: number): number[] {
  return Array.from({ length: count }, (_, n) => lowHz * (highHz / lowHz) ** (n / (count - 1)));
}

/** The impedance plane of one coil on this part; the sweep spans 1/30 of the lowest to 30× the highest test frequency. */
export function impedancePlane(setting: FieldSetting, coilIndex: number, sweepPoints = 28): ImpedancePlane {
  const { technique, relativePermeability } = setting;
  const { material, part } = technique;
  const coil = technique.coils[coilIndex];
  const longInput = (frequencyHz: number) => (isLongCoil(coil) ? longCoilInput(coil, part, setting, frequencyHz) : null);
  const geometry = coilGeometry(coil, part);
  const layers = planarLayers(part, material.conductivityIacs, relativePermeability);
  const model: FieldModel = longInput(coil.frequenciesHz[0]) ? 'long-coil' : 'planar';
  const solveAt = (frequencyHz: number) => {
    const input = longInput(frequencyHz);
    if (input) {
      const solution = solveLongCoil(input);
      return { z: solution.impedanceNormalised, liftOff: solution.fillFactorDirection };
    }
    const solution = solvePlanar(geometry, layers, frequencyHz);
    // ΔZ/ωL0 is measured from the air point; Z/ωL0 = j + ΔZ/ωL0 puts the coil in air at (0, 1).
    return { z: solution.impedanceNormalised.add(0, 1), liftOff: solution.liftOffDirection };
  };
  const low = Math.min(...coil.frequenciesHz) / 30;
  const high = Math.max(...coil.frequenciesHz) * 30;
  const locus = logSweep(low, high, sweepPoints).map((frequencyHz) => {
    const { z } = solveAt(frequencyHz);
    return { frequencyHz, resistance: z.re, reactance: z.im };
  });
  // The same field answers the phase-separation rule reads, so the chart and the verdict agree.
  const fields = createCoilFields(technique, relativePermeability);
  const below = technique.flaws.flatMap((flaw, index) => (flaw.location !== 'surface' && flaw.orientation !== 'laminar' ? [index] : []));
  const testPoints = coil.frequenciesHz.map((frequencyHz, frequencyIndex) => {
    const { z, liftOff } = solveAt(frequencyHz);
    return {
      frequencyHz,
      resistance: z.re,
      reactance: z.im,
      liftOff: unit(liftOff),
      flaws: below.map((flawIndex) => {
        const field = fields.at(coilIndex, frequencyIndex, flawIndex);
        return { flawId: technique.flaws[flawIndex].id, direction: unit(field.flawResponse), separationDeg: field.phaseSeparationDeg };
      }),
    };
  });
  return { coilIndex, model, locus, testPoints };
}

export interface DensityMap {
  /** Radii of the cell centres, mm (from the coil's axis). */
  radiiMm: number[];
  /** Depths of the cell centres below the surface, mm. */
  depthsMm: number[];
  /** |J| per cell over the largest |J| in the map, rows by depth. */
  relative: number[][];
  /** The winding's inner and outer radius, mm, for the outline. */
  winding: { innerRadiusMm: number; outerRadiusMm: number };
  frequencyHz: number;
}

/**
 * |J| in the r–z plane under a probe (surface, pencil, rotating coils), to 2.5× the winding's
 * outer radius and to `depthMm` (default 3δ, within the metal). Null for a long coil: its field
 * is the same all along the axis, and the depth curve already shows it.
 */
export function densityMap(setting: FieldSetting, coilIndex: number, frequencyIndex: number, options: { columns?: number; rows?: number; depthMm?: number } = {}): DensityMap | null {
  const { technique, relativePermeability } = setting;
  const { material, part } = technique;
  const coil = technique.coils[coilIndex];
  if (isLongCoil(coil)) return null;
  const frequencyHz = coil.frequenciesHz[frequencyIndex];
  const geometry = coilGeometry(coil, part);
  const layers = planarLayers(part, material.conductivityIacs, relativePermeability);
  const total = layers.reduce((sum, layer) => sum + layer.thicknessMm, 0);
  const deltaMm = standardDepthMm(frequencyHz, material.conductivityIacs, relativePermeability);
  const depthEnd = Math.min(options.depthMm ?? 3 * deltaMm, total);
  const radiusEnd = 2.5 * geometry.outerRadiusMm;
  const columns = options.columns ?? 36;
  const rows = options.rows ?? 24;
  const solution = solvePlanar(geometry, layers, frequencyHz, { radialReachMm: radiusEnd });
  const radiiMm = Array.from({ length: columns }, (_, n) => ((n + 0.5) * radiusEnd) / columns);
  const depthsMm = Array.from({ length: rows }, (_, n) => ((n + 0.5) * depthEnd) / rows);
  const magnitudes = depthsMm.map((depthMm) => radiiMm.map((radiusMm) => solution.densityAt(radiusMm, depthMm).abs()));
  const largest = Math.max(...magnitudes.flat(), Number.MIN_VALUE);
  return {
    radiiMm,
    depthsMm,
    relative: magnitudes.map((row) => row.map((value) => value / largest)),
    winding: { innerRadiusMm: geometry.innerRadiusMm, outerRadiusMm: geometry.outerRadiusMm },
    frequencyHz,
  };
}
