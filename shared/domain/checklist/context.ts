// Works out, once per evaluation, the values several rules and the UI read.
import {
  conductivityMsPerMFromIacs,
  fillFactorEncircling,
  fillFactorInternal,
  limitFrequencyHz,
  limitFrequencyThinWallTubeHz,
  resistivityMicroOhmCmFromIacs,
  standardDepthMm,
} from '../physics';
import { flawNormal, orientationSensitivity, type Vec3 } from '../orientation';
import { tubeLimitFrequencyHz } from '../fields/tube-limit-frequency';
import { fieldRelativePermeability } from './permeability';
import { insideDiameterMm, type Coil, type Part, type Technique } from '../../schemas/technique';
import type { Policy } from '../policy';
import type { RegisterFacts } from './registers';
import type { ChecklistValues, RuleContext } from './types';
import { coilName } from './format';
import { createCoilFields } from './coil-field';

/** Coils that go round the part or inside it: fill factor and limit frequency apply. */
export function isEncirclingOrInternal(coil: Coil): boolean {
  return coil.type === 'encircling' || coil.type === 'bobbin';
}

/** Coils scanned over a surface (by hand, scanner or rotation): scan index, coil size and edge effect apply. */
export function isScanningCoil(coil: Coil): boolean {
  return coil.type === 'surface' || coil.type === 'pencil' || coil.type === 'rotating';
}

export interface LimitFrequency {
  hz: number;
  /** Bars: Förster's solid-cylinder formula. Tubes: the long-coil tube model (45° lag of the field reaching the bore). */
  formula: 'solid-cylinder' | 'tube-model' | 'thin-wall-tube';
  /** Tubes: the thin-wall formula's figure, kept beside the model's for comparison. */
  thinWallHz?: number;
}

export function partLimitFrequency(part: Part, conductivityIacs: number, relativePermeability: number): LimitFrequency | null {
  if (part.form === 'bar' && part.diameterMm !== undefined) {
    return { hz: limitFrequencyHz(part.diameterMm, conductivityIacs, relativePermeability), formula: 'solid-cylinder' };
  }
  const innerMm = insideDiameterMm(part);
  if (part.form === 'tube' && innerMm !== undefined && part.wallMm !== undefined && part.diameterMm !== undefined) {
    const hz = tubeLimitFrequencyHz(part.diameterMm / 2, innerMm / 2, conductivityMsPerMFromIacs(conductivityIacs), relativePermeability);
    const thinWallHz = limitFrequencyThinWallTubeHz(innerMm, part.wallMm, conductivityIacs, relativePermeability);
    // A degenerate wall where the model finds no 45° point keeps the thin-wall figure.
    return Number.isFinite(hz) ? { hz, formula: 'tube-model', thinWallHz } : { hz: thinWallHz, formula: 'thin-wall-tube', thinWallHz };
  }
  return null;
}

export function coilFillFactor(coil: Coil, part: Part): number | null {
  if (coil.type === 'encircling' && part.diameterMm !== undefined) return fillFactorEncircling(part.diameterMm, coil.diameterMm);
  if (coil.type === 'bobbin') {
    const innerMm = insideDiameterMm(part);
    return innerMm === undefined ? null : fillFactorInternal(coil.diameterMm, innerMm);
  }
  return null;
}

export function buildContext(technique: Technique, policy: Policy, registers: RegisterFacts | undefined, now: Date): RuleContext {
  const { material, part, coils, flaws } = technique;
  const fieldMu = fieldRelativePermeability(technique, policy);
  const limit = partLimitFrequency(part, material.conductivityIacs, fieldMu);

  const standardDepth: number[][] = [];
  const effectiveDepth: number[][] = [];
  const frequencyRatio: (number | null)[][] = [];
  const fillFactor: (number | null)[] = [];
  for (const coil of coils) {
    const depths: number[] = [];
    const effective: number[] = [];
    const ratios: (number | null)[] = [];
    const ratioApplies = limit !== null && isEncirclingOrInternal(coil);
    for (const frequencyHz of coil.frequenciesHz) {
      const delta = standardDepthMm(frequencyHz, material.conductivityIacs, fieldMu);
      depths.push(delta);
      effective.push(policy.penetrationDepthFactor * delta);
      ratios.push(ratioApplies ? frequencyHz / limit.hz : null);
    }
    standardDepth.push(depths);
    effectiveDepth.push(effective);
    frequencyRatio.push(ratios);
    fillFactor.push(coilFillFactor(coil, part));
  }

  const flawNormals: Vec3[] = [];
  const sensitivity: number[][] = [];
  for (const flaw of flaws) {
    const normal = flawNormal(flaw.orientation, flaw.angleDeg);
    flawNormals.push(normal);
    sensitivity.push(coils.map((coil) => orientationSensitivity(coil.type, normal)));
  }

  const values: ChecklistValues = {
    conductivityMsPerM: conductivityMsPerMFromIacs(material.conductivityIacs),
    resistivityMicroOhmCm: resistivityMicroOhmCmFromIacs(material.conductivityIacs),
    standardDepthMm: standardDepth,
    effectiveDepthMm: effectiveDepth,
    limitFrequencyHz: limit?.hz ?? null,
    frequencyRatio,
    fillFactor,
    orientationSensitivity: sensitivity,
    fieldRelativePermeability: fieldMu,
  };
  const coilNames = coils.map(coilName);
  return { technique, policy, registers, now, values, flawNormals, coilNames, fields: createCoilFields(technique, fieldMu) };
}
