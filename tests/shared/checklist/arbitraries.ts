// fast-check generators of valid techniques, for property tests.
import fc from 'fast-check';
import type { TechniqueInput } from '../../../shared/domain/checklist/index';
import { FLAW_LOCATIONS, FLAW_ORIENTATIONS, type CoilType, type PartForm } from '../../../shared/schemas/technique';

const positive = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

const COILS_FOR_FORM: Record<PartForm, CoilType[]> = {
  plate: ['surface', 'pencil', 'rotating', 'multidirectional'],
  bar: ['surface', 'pencil', 'rotating', 'multidirectional', 'encircling'],
  tube: ['surface', 'pencil', 'rotating', 'multidirectional', 'encircling', 'bobbin'],
  bore: ['surface', 'pencil', 'rotating', 'multidirectional', 'bobbin'],
};

const partArbitrary = fc.oneof(
  fc.record({ form: fc.constant('plate' as const), thicknessMm: positive(0.5, 50) }),
  fc.record({ form: fc.constant('bar' as const), diameterMm: positive(2, 200) }),
  positive(5, 100).chain((diameterMm) =>
    fc.record({ form: fc.constant('tube' as const), diameterMm: fc.constant(diameterMm), wallMm: positive(0.2, diameterMm * 0.45) }),
  ),
  fc.record({ form: fc.constant('bore' as const), diameterMm: positive(2, 60) }),
);

type PartInput = TechniqueInput['part'];

function depthLimitMm(part: PartInput): number {
  if (part.form === 'plate') return part.thicknessMm as number;
  if (part.form === 'tube') return part.wallMm as number;
  if (part.form === 'bar') return (part.diameterMm as number) / 2;
  return 20;
}

function coilArbitrary(part: PartInput) {
  return fc.constantFrom(...COILS_FOR_FORM[part.form]).chain((type) => {
    const outside = part.diameterMm ?? 10;
    const inside = part.form === 'tube' ? outside - 2 * (part.wallMm as number) : outside;
    const diameter =
      type === 'encircling' ? positive(1, 1.6).map((k) => outside * k) : type === 'bobbin' ? positive(0.3, 1).map((k) => inside * k) : positive(0.5, 30);
    return fc.record({
      type: fc.constant(type),
      diameterMm: diameter,
      shielded: fc.boolean(),
      mode: fc.constantFrom('absolute' as const, 'differential' as const),
      frequenciesHz: fc.array(positive(10, 5e6), { minLength: 1, maxLength: 4 }),
    });
  });
}

function flawArbitrary(part: PartInput, id: number) {
  const limit = depthLimitMm(part);
  return fc
    .record({
      orientation: fc.constantFrom(...FLAW_ORIENTATIONS),
      angleDeg: fc.option(positive(-180, 180), { nil: undefined }),
      location: fc.constantFrom(...FLAW_LOCATIONS),
      depthMm: positive(0.01, 1).map((k) => k * limit),
      lengthMm: positive(0.1, 100),
    })
    .map((flaw) => ({
      id: `flaw-${id}`,
      ...flaw,
      angleDeg: flaw.orientation === 'laminar' ? undefined : flaw.angleDeg,
    }));
}

const notchArbitrary = fc.record({
  orientation: fc.constantFrom(...FLAW_ORIENTATIONS),
  depthMm: positive(0.05, 3),
  lengthMm: positive(0.5, 50),
  edgeDistanceMm: fc.option(positive(0, 20), { nil: undefined }),
});

/** Any technique TechniqueSchema accepts (undefined optional fields are dropped by JSON anyway). */
export const validTechniqueArbitrary: fc.Arbitrary<TechniqueInput> = partArbitrary.chain((part) =>
  fc.record({
    code: fc.constant('PROP-1'),
    title: fc.constant('Generated technique'),
    revision: fc.constant('A'),
    material: fc.record({
      name: fc.constant('generated alloy'),
      conductivityIacs: positive(0.5, 105),
      relativePermeability: fc.oneof(fc.constant(1), positive(1, 500)),
      saturated: fc.boolean(),
    }),
    part: fc.constant(part),
    coils: fc.array(coilArbitrary(part), { minLength: 1, maxLength: 3 }),
    scan: fc.record({
      indexMm: fc.option(positive(0.05, 20), { nil: undefined }),
      minEdgeDistanceMm: fc.option(positive(0, 50), { nil: undefined }),
      edgeGuide: fc.boolean(),
    }),
    flaws: fc.integer({ min: 1, max: 4 }).chain((count) => fc.tuple(...Array.from({ length: count }, (_, i) => flawArbitrary(part, i)))),
    reference: fc.record({ conductivityIacs: positive(0.5, 105), notches: fc.array(notchArbitrary, { maxLength: 3 }) }),
  }),
) as fc.Arbitrary<TechniqueInput>;

/** Every path into a plain JSON value, for mutation. */
export function pathsOf(value: unknown, prefix: (string | number)[] = []): (string | number)[][] {
  const paths: (string | number)[][] = [prefix];
  if (Array.isArray(value)) value.forEach((item, index) => paths.push(...pathsOf(item, [...prefix, index])));
  else if (value && typeof value === 'object') for (const [key, item] of Object.entries(value)) paths.push(...pathsOf(item, [...prefix, key]));
  return paths;
}

/** A deep copy with the value at `path` replaced (or deleted when `replacement` is the DELETE marker). */
export const DELETE = Symbol('delete');
export function replaceAt(value: unknown, path: (string | number)[], replacement: unknown): unknown {
  if (path.length === 0) return replacement === DELETE ? undefined : replacement;
  const [head, ...rest] = path;
  if (Array.isArray(value)) {
    const copy = [...value];
    if (rest.length === 0 && replacement === DELETE) copy.splice(head as number, 1);
    else copy[head as number] = replaceAt(copy[head as number], rest, replacement);
    return copy;
  }
  const copy: Record<string, unknown> = { ...(value as Record<string, unknown>) };
  if (rest.length === 0 && replacement === DELETE) delete copy[head];
  else copy[head] = replaceAt(copy[head], rest, replacement);
  return copy;
}
