// Small invented techniques to test one rule at a time (invented test data, not
// check values: the check values and their sources are in the tests).
import { evaluateTechnique, type ChecklistOutput, type RuleId, type RuleResult, type TechniqueInput } from '../../../shared/domain/checklist/index';

type Patch = Partial<Omit<TechniqueInput, 'material' | 'part' | 'scan' | 'reference'>> & {
  material?: Partial<TechniqueInput['material']>;
  part?: TechniqueInput['part'];
  scan?: TechniqueInput['scan'];
  reference?: Partial<TechniqueInput['reference']>;
};

function build(base: TechniqueInput, patch: Patch): TechniqueInput {
  return {
    ...base,
    ...patch,
    material: { ...base.material, ...patch.material },
    part: patch.part ?? base.part,
    scan: patch.scan ?? base.scan,
    reference: { ...base.reference, ...patch.reference },
  } as TechniqueInput;
}

/** A 7075-T6 plate, 5 mm shielded surface coil at 100 kHz, one transverse surface crack. Conforms. */
export function plateTechnique(patch: Patch = {}): TechniqueInput {
  return build(
    {
      code: 'TEST-PLATE',
      title: 'Plate surface scan',
      revision: 'A',
      material: { name: '7075-T6', conductivityIacs: 32 },
      part: { form: 'plate', thicknessMm: 10 },
      coils: [{ type: 'surface', diameterMm: 5, shielded: true, mode: 'absolute', frequenciesHz: [100_000] }],
      scan: { indexMm: 2 },
      flaws: [{ id: 'crack', orientation: 'transverse', location: 'surface', depthMm: 0.5, lengthMm: 5 }],
      reference: { conductivityIacs: 32, notches: [{ orientation: 'transverse', depthMm: 0.5, lengthMm: 5 }] },
    },
    patch,
  );
}

/** A 2024 bar of 20 mm through a 22 mm encircling coil at 500 Hz, one axial surface seam. Conforms. */
export function barTechnique(patch: Patch = {}): TechniqueInput {
  return build(
    {
      code: 'TEST-BAR',
      title: 'Bar through an encircling coil',
      revision: 'A',
      material: { name: '2024-T351', conductivityIacs: 30 },
      part: { form: 'bar', diameterMm: 20 },
      coils: [{ type: 'encircling', diameterMm: 22, mode: 'differential', frequenciesHz: [500] }],
      scan: {},
      flaws: [{ id: 'seam', orientation: 'axial', location: 'surface', depthMm: 0.3, lengthMm: 20 }],
      reference: { conductivityIacs: 30, notches: [{ orientation: 'axial', depthMm: 0.3, lengthMm: 20 }] },
    },
    patch,
  );
}

/** A brass tube with a bobbin coil, one axial far-side crack (the shared heat-exchanger example, axial crack only). */
export function tubeTechnique(patch: Patch = {}): TechniqueInput {
  return build(
    {
      code: 'TEST-TUBE',
      title: 'Tube, bobbin coil',
      revision: 'A',
      material: { name: '70/30 brass', conductivityIacs: 28 },
      part: { form: 'tube', diameterMm: 19.05, wallMm: 1.24 },
      coils: [{ type: 'bobbin', diameterMm: 15.5, mode: 'differential', frequenciesHz: [10_000] }],
      scan: {},
      flaws: [{ id: 'axial-crack', orientation: 'axial', location: 'far-side', depthMm: 1.0, lengthMm: 10 }],
      // A far-side notch 0.24 mm deep: the wall left below the crack's 1.0 mm depth from the bore.
      reference: { conductivityIacs: 28, notches: [{ orientation: 'axial', location: 'far-side', depthMm: 0.24, lengthMm: 10 }] },
    },
    patch,
  );
}

export function evaluate(input: TechniqueInput, options?: Parameters<typeof evaluateTechnique>[1]): ChecklistOutput {
  return evaluateTechnique(input, options);
}

export function resultsOf(output: ChecklistOutput, rule: RuleId): RuleResult[] {
  return output.results.filter((result) => result.rule === rule);
}

/** The one result of `rule` (for `flaw` when given); fails the test when there is not exactly one. */
export function resultOf(output: ChecklistOutput, rule: RuleId, flaw?: string): RuleResult {
  const found = resultsOf(output, rule).filter((result) => flaw === undefined || result.flaw === flaw);
  if (found.length !== 1) throw new Error(`expected one ${rule} result${flaw ? ` for ${flaw}` : ''}, got ${found.length}`);
  return found[0];
}

export function statuses(output: ChecklistOutput, rule: RuleId): string[] {
  return resultsOf(output, rule).map((result) => result.status);
}
