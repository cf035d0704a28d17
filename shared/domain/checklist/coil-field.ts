// One question, answered for every coil type: what does THIS coil's field do at a flaw's
// depth, at one test frequency? Surface, pencil, rotating and multidirectional coils over a
// plate, a bore wall or a tube wall use the planar (Dodd–Deeds) model; encircling and bobbin
// coils the long-coil model of a bar or tube. The plane wave e^(−x/δ) rides along for
// comparison. Solutions are cached by (coil, layers, frequency) in the models themselves.
import type Complex from 'complex.js';
import { conductivityMsPerMFromIacs, MU0_H_PER_M, standardDepthMm } from '../physics';
import { coilGeometry } from '../fields/geometry';
import { lineAngleDeg, solvePlanar } from '../fields/planar';
import { solveLongCoil } from '../fields/cylinder';
import type { CoilGeometry, PlanarLayer } from '../fields/types';
import { insideDiameterMm, type Coil, type Flaw, type Part, type Technique } from '../../schemas/technique';

export type FieldModel = 'planar' | 'long-coil';

export interface CoilFieldAtDepth {
  model: FieldModel;
  /** |J| of this coil's field at the flaw over |J| at the surface it faces (under the winding; at the flaw's radius in a bar or tube). */
  densityRatio: number;
  /** e^(−x/δ): what a plane wave (an infinitely large coil) would give. */
  planeWaveRatio: number;
  /** Change of the normalised impedance for a small loss of metal at the flaw's depth. */
  flawResponse: Complex;
  /** The lift-off direction on the normalised impedance plane (fill-factor direction for a long coil). */
  liftOffDirection: Complex;
  /** Angle between the lift-off line and the flaw's response, 0–90°. */
  phaseSeparationDeg: number;
}

/** The material and part as the field models see them. */
export interface FieldSetting {
  technique: Technique;
  /** μr the field models use (the incremental permeability of a saturated part). */
  relativePermeability: number;
}

export function isLongCoil(coil: Coil): boolean {
  return coil.type === 'encircling' || coil.type === 'bobbin';
}

/**
 * The planar layers under a scanning coil, top down. The metal a plate, tube wall or bore
 * wall offers; a flaw with metalAboveMm < depthMm sits under a layered structure: the
 * metal above it, then the air gap (depth − metal above), then the metal the flaw lies in
 * (the usual second-layer crack at the faying surface).
 */
export function planarLayers(part: Part, conductivityIacs: number, relativePermeability: number, flaw?: Pick<Flaw, 'depthMm' | 'metalAboveMm'>): PlanarLayer[] {
  const conductivityMsPerM = conductivityMsPerMFromIacs(conductivityIacs);
  const metal = (thicknessMm: number): PlanarLayer => ({ thicknessMm, conductivityMsPerM, relativePermeability });
  let totalMm: number;
  if (part.form === 'plate') totalMm = part.thicknessMm ?? Infinity;
  else if (part.form === 'tube') totalMm = part.wallMm ?? Infinity;
  else if (part.form === 'bore') totalMm = part.thicknessMm ?? Infinity;
  else totalMm = part.diameterMm ?? Infinity;
  if (flaw && flaw.metalAboveMm !== undefined && flaw.metalAboveMm < flaw.depthMm) {
    const gapMm = flaw.depthMm - flaw.metalAboveMm;
    const layers: PlanarLayer[] = [];
    if (flaw.metalAboveMm > 0) layers.push(metal(flaw.metalAboveMm));
    layers.push({ thicknessMm: gapMm, conductivityMsPerM: 0, relativePermeability: 1 });
    const restMm = totalMm - flaw.depthMm;
    layers.push(metal(restMm > 1e-9 ? restMm : Infinity));
    return layers;
  }
  return [metal(totalMm)];
}

/** The long-coil problem of an encircling or bobbin coil on this part (null when the part lacks a diameter). */
export function longCoilInput(coil: Coil, part: Part, setting: FieldSetting, frequencyHz: number) {
  const placement = coil.type === 'encircling' ? ('encircling' as const) : ('internal' as const);
  if (part.diameterMm === undefined) return null;
  const conductivityMsPerM = conductivityMsPerMFromIacs(setting.technique.material.conductivityIacs);
  const base = { conductivityMsPerM, relativePermeability: setting.relativePermeability, frequencyHz };
  const coilRadiusMm = coil.diameterMm / 2;
  if (part.form === 'bar') return { ...base, placement, outerRadiusMm: part.diameterMm / 2, coilRadiusMm };
  if (part.form === 'tube') {
    const innerMm = insideDiameterMm(part);
    if (innerMm === undefined) return null;
    return { ...base, placement, outerRadiusMm: part.diameterMm / 2, innerRadiusMm: innerMm / 2, coilRadiusMm };
  }
  // A bore in a large part: the wall is thick; model it as a tube of twice the bore's diameter.
  if (part.form === 'bore') {
    const wallMm = part.thicknessMm ?? part.diameterMm;
    return { ...base, placement, outerRadiusMm: part.diameterMm / 2 + wallMm, innerRadiusMm: part.diameterMm / 2, coilRadiusMm };
  }
  return null;
}

/** The coil's field at `depthMm` below the surface it faces, at one frequency. */
export function coilFieldAtDepth(
  setting: FieldSetting,
  coil: Coil,
  frequencyHz: number,
  depthMm: number,
  options: { flaw?: Pick<Flaw, 'depthMm' | 'metalAboveMm'>; geometry?: CoilGeometry } = {},
): CoilFieldAtDepth {
  const { technique, relativePermeability } = setting;
  const { material, part } = technique;
  const deltaMm = standardDepthMm(frequencyHz, material.conductivityIacs, relativePermeability);
  const metalMm = options.flaw?.metalAboveMm ?? depthMm;
  const planeWaveRatio = Math.exp(-metalMm / deltaMm);
  if (isLongCoil(coil)) {
    const input = longCoilInput(coil, part, setting, frequencyHz);
    if (input) {
      const solution = solveLongCoil(input);
      const flawResponse = solution.flawResponseAtDepth(depthMm);
      const liftOffDirection = solution.fillFactorDirection;
      return {
        model: 'long-coil',
        densityRatio: solution.densityRatioAtDepth(depthMm),
        planeWaveRatio,
        flawResponse,
        liftOffDirection,
        phaseSeparationDeg: lineAngleDeg(liftOffDirection, flawResponse),
      };
    }
  }
  const geometry = options.geometry ?? coilGeometry(coil, part);
  const layers = planarLayers(part, material.conductivityIacs, relativePermeability, options.flaw);
  // A flaw at the very bottom of the stack is taken just inside the metal.
  const totalMm = layers.reduce((sum, layer) => sum + layer.thicknessMm, 0);
  const atMm = Math.min(depthMm, totalMm * (1 - 1e-9));
  const solution = solvePlanar(geometry, layers, frequencyHz);
  const flawResponse = solution.flawResponseAtDepth(atMm);
  const liftOffDirection = solution.liftOffDirection;
  return {
    model: 'planar',
    densityRatio: solution.densityRatioUnderWinding(atMm),
    planeWaveRatio,
    flawResponse,
    liftOffDirection,
    phaseSeparationDeg: lineAngleDeg(liftOffDirection, flawResponse),
  };
}

/** Frequencies spread evenly on a log scale, both ends included. */
function logSpace(fromHz: number, toHz: number, count: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < count; i++) out.push(fromHz * (toHz / fromHz) ** (i / (count - 1)));
  return out;
}

/**
 * The highest frequency at which this coil's density at the depth is still at least
 * `densityRatioMin` of the surface value (bisection in log f; the density falls as f rises).
 * null when even a very low frequency does not reach: the coil itself is too small.
 */
export function highestReachingFrequencyHz(
  setting: FieldSetting,
  coil: Coil,
  depthMm: number,
  densityRatioMin: number,
  flaw?: Pick<Flaw, 'depthMm' | 'metalAboveMm'>,
): number | null {
  const metalMm = flaw?.metalAboveMm ?? depthMm;
  // δ = 10·x: within a few per cent of the static field's reach; δ = x/20: far beyond reach.
  const lowHz = frequencyForDelta(setting, 10 * Math.max(metalMm, 0.01));
  const highHz = frequencyForDelta(setting, Math.max(metalMm, 0.01) / 20);
  const ratioAt = (f: number) => coilFieldAtDepth(setting, coil, f, depthMm, { flaw }).densityRatio;
  if (ratioAt(lowHz) < densityRatioMin) return null;
  if (ratioAt(highHz) >= densityRatioMin) return highHz;
  let lo = Math.log(lowHz);
  let hi = Math.log(highHz);
  for (let i = 0; i < 9; i++) {
    const mid = 0.5 * (lo + hi);
    if (ratioAt(Math.exp(mid)) >= densityRatioMin) lo = mid;
    else hi = mid;
  }
  return Math.exp(lo);
}

function frequencyForDelta(setting: FieldSetting, deltaMm: number): number {
  const { material } = setting.technique;
  const sigma = conductivityMsPerMFromIacs(material.conductivityIacs) * 1e6;
  const deltaM = deltaMm / 1000;
  return 1 / (Math.PI * MU0_H_PER_M * setting.relativePermeability * sigma * deltaM * deltaM);
}

export interface BestSeparation {
  frequencyHz: number;
  phaseSeparationDeg: number;
}

/**
 * The frequency, at most `ceilingHz`, that maximises the angle between lift-off and the
 * flaw's response at its depth: a log sweep from δ = 8x down to δ = x/4 (or the ceiling),
 * refined by golden-section search around the best point.
 */
export function bestPhaseSeparation(
  setting: FieldSetting,
  coil: Coil,
  depthMm: number,
  ceilingHz: number | null,
  flaw?: Pick<Flaw, 'depthMm' | 'metalAboveMm'>,
): BestSeparation {
  const metalMm = Math.max(flaw?.metalAboveMm ?? depthMm, 0.01);
  const lowHz = frequencyForDelta(setting, 8 * metalMm);
  let highHz = frequencyForDelta(setting, metalMm / 4);
  if (ceilingHz !== null) highHz = Math.min(highHz, ceilingHz);
  if (highHz <= lowHz) {
    const frequencyHz = highHz;
    return { frequencyHz, phaseSeparationDeg: coilFieldAtDepth(setting, coil, frequencyHz, depthMm, { flaw }).phaseSeparationDeg };
  }
  const angleAt = (f: number) => coilFieldAtDepth(setting, coil, f, depthMm, { flaw }).phaseSeparationDeg;
  const sweep = logSpace(lowHz, highHz, 7);
  let best = 0;
  const angles = sweep.map(angleAt);
  for (let i = 1; i < angles.length; i++) if (angles[i] > angles[best]) best = i;
  let a = Math.log(sweep[Math.max(0, best - 1)]);
  let b = Math.log(sweep[Math.min(sweep.length - 1, best + 1)]);
  const golden = (Math.sqrt(5) - 1) / 2;
  let c = b - golden * (b - a);
  let d = a + golden * (b - a);
  let fc = angleAt(Math.exp(c));
  let fd = angleAt(Math.exp(d));
  for (let i = 0; i < 4; i++) {
    if (fc >= fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - golden * (b - a);
      fc = angleAt(Math.exp(c));
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + golden * (b - a);
      fd = angleAt(Math.exp(d));
    }
  }
  const candidates: BestSeparation[] = [
    { frequencyHz: sweep[best], phaseSeparationDeg: angles[best] },
    { frequencyHz: Math.exp(c), phaseSeparationDeg: fc },
    { frequencyHz: Math.exp(d), phaseSeparationDeg: fd },
  ];
  return candidates.reduce((x, y) => (y.phaseSeparationDeg > x.phaseSeparationDeg ? y : x));
}

/** Depth at which a flaw is asked about: the middle of a crack open to the surface, else its depth below the surface. */
export function modelDepthMm(flaw: Flaw): number {
  return flaw.location === 'surface' ? flaw.depthMm / 2 : flaw.depthMm;
}

/** The layered-structure facts of a flaw the planar model needs (none for a flaw open to the surface). */
function flawLayers(flaw: Flaw): Pick<Flaw, 'depthMm' | 'metalAboveMm'> | undefined {
  return flaw.location === 'surface' ? undefined : flaw;
}

/** Per-evaluation memo of every field question the rules ask (several rules ask the same). */
export interface CoilFields {
  setting: FieldSetting;
  at(coilIndex: number, frequencyIndex: number, flawIndex: number): CoilFieldAtDepth;
  highestReachingHz(coilIndex: number, flawIndex: number, densityRatioMin: number): number | null;
  bestSeparation(coilIndex: number, flawIndex: number, ceilingHz: number | null): BestSeparation;
  /** The flaw's response at a coil's frequency with the coil at `liftOffMm` (planar coils). */
  flawResponseWithLiftOff(coilIndex: number, frequencyIndex: number, flawIndex: number, liftOffMm: number): Complex | null;
}

// Frequency searches outlive one evaluation: the editor re-evaluates the same coil and flaw on
// every keystroke elsewhere in the technique. Keyed by everything the search reads.
const searchCache = new Map<string, unknown>();
const SEARCH_CACHE_LIMIT = 2000;

function searchKey(technique: Technique, relativePermeability: number, coilIndex: number, flawIndex: number): string {
  const { part, material } = technique;
  const coil = technique.coils[coilIndex];
  const flaw = technique.flaws[flawIndex];
  return [
    material.conductivityIacs,
    relativePermeability,
    part.form,
    part.thicknessMm,
    part.diameterMm,
    part.wallMm,
    part.coatingMm,
    coil.type,
    coil.diameterMm,
    coil.innerDiameterMm,
    coil.lengthMm,
    coil.liftOffMm,
    flaw.location,
    flaw.depthMm,
    flaw.metalAboveMm,
  ].join('|');
}

export function createCoilFields(technique: Technique, relativePermeability: number): CoilFields {
  const setting: FieldSetting = { technique, relativePermeability };
  const memo = new Map<string, unknown>();
  const once = <T>(key: string, make: () => T): T => {
    if (memo.has(key)) return memo.get(key) as T;
    const value = make();
    memo.set(key, value);
    return value;
  };
  const lasting = <T>(key: string, make: () => T): T => {
    if (searchCache.has(key)) return searchCache.get(key) as T;
    const value = make();
    if (searchCache.size >= SEARCH_CACHE_LIMIT) searchCache.clear();
    searchCache.set(key, value);
    return value;
  };
  return {
    setting,
    at: (c, i, f) =>
      once(`at|${c}|${i}|${f}`, () => {
        const flaw = technique.flaws[f];
        return coilFieldAtDepth(setting, technique.coils[c], technique.coils[c].frequenciesHz[i], modelDepthMm(flaw), { flaw: flawLayers(flaw) });
      }),
    highestReachingHz: (c, f, min) =>
      lasting(`reach|${min}|${searchKey(technique, relativePermeability, c, f)}`, () => {
        const flaw = technique.flaws[f];
        return highestReachingFrequencyHz(setting, technique.coils[c], modelDepthMm(flaw), min, flawLayers(flaw));
      }),
    bestSeparation: (c, f, ceiling) =>
      lasting(`best|${ceiling}|${searchKey(technique, relativePermeability, c, f)}`, () => {
        const flaw = technique.flaws[f];
        return bestPhaseSeparation(setting, technique.coils[c], modelDepthMm(flaw), ceiling, flawLayers(flaw));
      }),
    flawResponseWithLiftOff: (c, i, f, liftOffMm) =>
      once(`lift|${c}|${i}|${f}|${liftOffMm}`, () => {
        const coil = technique.coils[c];
        if (isLongCoil(coil)) return null;
        const flaw = technique.flaws[f];
        const geometry = { ...coilGeometry(coil, {}), liftOffMm };
        return coilFieldAtDepth(setting, coil, coil.frequenciesHz[i], modelDepthMm(flaw), { flaw: flawLayers(flaw), geometry }).flawResponse;
      }),
  };
}

/** Ordinary probe and coil diameters, mm, tried when a coil is too small to reach a flaw. */
const PROBE_DIAMETERS_MM = [3, 4, 5, 6, 8, 10, 12.7, 16, 20, 25, 32, 40, 50, 64, 80, 100];

/**
 * The smallest ordinary diameter, larger than this coil's, whose field (same proportions and
 * lift-off) reaches the depth at a low frequency (δ = 10× the metal depth); null if none does.
 */
export function smallestReachingDiameterMm(fields: CoilFields, coilIndex: number, flawIndex: number, densityRatioMin: number): number | null {
  const { technique } = fields.setting;
  const coil = technique.coils[coilIndex];
  if (isLongCoil(coil)) return null;
  const flaw = technique.flaws[flawIndex];
  const metalMm = Math.max(flaw.metalAboveMm ?? modelDepthMm(flaw), 0.01);
  const lowHz = frequencyForDelta(fields.setting, 10 * metalMm);
  const base = coilGeometry(coil, technique.part);
  const candidates = PROBE_DIAMETERS_MM.filter((d) => d > coil.diameterMm);
  const reaches = (diameterMm: number) => {
    const scale = diameterMm / coil.diameterMm;
    const geometry: CoilGeometry = {
      innerRadiusMm: base.innerRadiusMm * scale,
      outerRadiusMm: base.outerRadiusMm * scale,
      lengthMm: base.lengthMm * scale,
      liftOffMm: base.liftOffMm,
    };
    return coilFieldAtDepth(fields.setting, coil, lowHz, modelDepthMm(flaw), { flaw: flawLayers(flaw), geometry }).densityRatio >= densityRatioMin;
  };
  let lo = 0;
  let hi = candidates.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (reaches(candidates[mid])) hi = mid;
    else lo = mid + 1;
  }
  return lo < candidates.length ? candidates[lo] : null;
}
