// A written eddy current technique, as the checklist engine reads it.
// Strict objects (an unknown field is an error, not silently dropped), units in the
// field names, and messages that name the field and say what is wrong.
import { z } from 'zod';
import { PolicyOverrideSchema } from '../domain/policy';

export const PART_FORMS = ['plate', 'bar', 'tube', 'bore'] as const;
export const COIL_TYPES = ['surface', 'pencil', 'rotating', 'encircling', 'bobbin', 'multidirectional'] as const;
export const COIL_MODES = ['absolute', 'differential'] as const;
export const FLAW_ORIENTATIONS = ['axial', 'circumferential', 'radial', 'laminar', 'longitudinal', 'transverse'] as const;
export const FLAW_LOCATIONS = ['surface', 'subsurface', 'far-side', 'center'] as const;

export type PartForm = (typeof PART_FORMS)[number];
export type CoilType = (typeof COIL_TYPES)[number];
export type FlawOrientation = (typeof FLAW_ORIENTATIONS)[number];
export type FlawLocation = (typeof FLAW_LOCATIONS)[number];

/** Coils that go round the part (encircling) or inside a tube or bore (bobbin). */
export const ENCIRCLING_COIL_TYPES: readonly CoilType[] = ['encircling'];
export const INTERNAL_COIL_TYPES: readonly CoilType[] = ['bobbin'];

const MAX_MM = 10_000;
const MAX_FREQUENCY_HZ = 100e6;

interface NumberOptions {
  field: string;
  label: string;
  unit: string;
  /** Exclusive lower bound (default 0). */
  greaterThan?: number;
  /** Inclusive lower bound, used instead of greaterThan. */
  atLeast?: number;
  max: number;
}

/** A bound as a person reads it: 100000000 Hz → "100 MHz". */
function boundText(value: number, unit: string): string {
  if (unit === 'Hz' && value >= 1e6 && Number.isInteger(value / 1e6)) return `${value / 1e6} MHz`;
  if (unit === 'Hz' && value >= 1e3 && Number.isInteger(value / 1e3)) return `${value / 1e3} kHz`;
  return `${value}${unit ? ` ${unit}` : ''}`;
}

function numberField({ field, label, unit, greaterThan = 0, atLeast, max }: NumberOptions) {
  const base = z.number({
    error: (issue) =>
      issue.input === undefined
        ? `${field} (${label}) is required${unit ? `, in ${unit}` : ''}`
        : `${field} (${label}) must be a finite number${unit ? ` in ${unit}` : ''}`,
  });
  const bounded =
    atLeast !== undefined
      ? base.min(atLeast, { error: `${field} (${label}) must be at least ${boundText(atLeast, unit)}` })
      : base.gt(greaterThan, { error: `${field} (${label}) must be greater than ${boundText(greaterThan, unit)}` });
  return bounded.max(max, { error: `${field} (${label}) must be at most ${boundText(max, unit)}` });
}

function textField(field: string, label: string, maxLength: number) {
  return z
    .string({
      error: (issue) =>
        issue.input === undefined ? `${field} (${label}) is required` : `${field} (${label}) must be text`,
    })
    .trim()
    .min(1, { error: `${field} (${label}) must not be empty` })
    .max(maxLength, { error: `${field} (${label}) must be at most ${maxLength} characters` });
}

function enumField<const T extends readonly [string, ...string[]]>(field: string, values: T) {
  return z.enum(values, {
    error: (issue) =>
      issue.input === undefined
        ? `${field} is required: one of ${values.join(', ')}`
        : `${field} must be one of ${values.join(', ')} (got ${JSON.stringify(issue.input)})`,
  });
}

function booleanField(field: string, label: string) {
  return z.boolean({ error: `${field} (${label}) must be true or false` });
}

function strictObject<T extends z.ZodRawShape>(what: string, shape: T) {
  return z.strictObject(shape, {
    error: (issue) => {
      if (issue.code === 'unrecognized_keys') {
        const keys = issue.keys.map((key) => `"${key}"`).join(', ');
        return `Unknown field ${keys} in ${what}; allowed fields: ${Object.keys(shape).join(', ')}`;
      }
      return issue.input === undefined ? `${what} is required` : `${what} must be an object`;
    },
  });
}

function arrayOf<T extends z.ZodType>(field: string, item: T, min: number, max: number) {
  return z
    .array(item, { error: (issue) => (issue.input === undefined ? `${field} is required (a list)` : `${field} must be a list`) })
    .min(min, { error: `${field} needs at least ${min} entr${min === 1 ? 'y' : 'ies'}` })
    .max(max, { error: `${field} may hold at most ${max} entries` });
}

const angleDeg = z
  .number({ error: 'angleDeg (angle of the crack to the part axis) must be a finite number of degrees' })
  .min(-180, { error: 'angleDeg (angle of the crack to the part axis) must be between -180 and 180°' })
  .max(180, { error: 'angleDeg (angle of the crack to the part axis) must be between -180 and 180°' });

export const MaterialSchema = strictObject('material', {
  name: textField('name', 'material name', 120),
  conductivityIacs: numberField({ field: 'conductivityIacs', label: 'conductivity', unit: '%IACS', max: 120 }),
  relativePermeability: numberField({
    field: 'relativePermeability',
    label: 'relative permeability μr',
    unit: '',
    atLeast: 1,
    max: 1_000_000,
  }).default(1),
  saturated: booleanField('saturated', 'magnetic saturation used').default(false),
  incrementalPermeability: numberField({
    field: 'incrementalPermeability',
    label: 'incremental relative permeability under magnetic saturation',
    unit: '',
    atLeast: 1,
    max: 1_000_000,
  }).optional(),
  ferromagneticJustification: z
    .string({ error: 'ferromagneticJustification must be text' })
    .trim()
    .max(2000, { error: 'ferromagneticJustification must be at most 2000 characters' })
    .optional(),
});

export const PartSchema = strictObject('part', {
  form: enumField('form', PART_FORMS),
  thicknessMm: numberField({ field: 'thicknessMm', label: 'part thickness', unit: 'mm', max: MAX_MM }).optional(),
  diameterMm: numberField({
    field: 'diameterMm',
    label: 'bar or tube outside diameter, or bore diameter',
    unit: 'mm',
    max: MAX_MM,
  }).optional(),
  wallMm: numberField({ field: 'wallMm', label: 'tube wall thickness', unit: 'mm', max: MAX_MM }).optional(),
  coatingMm: numberField({
    field: 'coatingMm',
    label: 'non-conductive coating (paint, anodising, sealant) on the inspected surface',
    unit: 'mm',
    atLeast: 0,
    max: 100,
  }).optional(),
}).superRefine((part, ctx) => {
  const need = (field: 'thicknessMm' | 'diameterMm' | 'wallMm', why: string) => {
    if (part[field] === undefined) ctx.addIssue({ code: 'custom', path: [field], message: `${field} is required for a ${part.form}: ${why}` });
  };
  switch (part.form) {
    case 'plate':
      need('thicknessMm', 'the plate or stack thickness');
      break;
    case 'bar':
      need('diameterMm', 'the bar diameter');
      break;
    case 'tube':
      need('diameterMm', 'the tube outside diameter');
      need('wallMm', 'the tube wall thickness');
      if (part.diameterMm !== undefined && part.wallMm !== undefined && part.wallMm * 2 >= part.diameterMm) {
        ctx.addIssue({
          code: 'custom',
          path: ['wallMm'],
          message: `wallMm (${part.wallMm} mm) must be less than half the outside diameter (${part.diameterMm} mm); for a solid section use form "bar"`,
        });
      }
      break;
    case 'bore':
      need('diameterMm', 'the bore diameter');
      break;
  }
});

export const CoilSchema = strictObject('coil', {
  type: enumField('type', COIL_TYPES),
  diameterMm: numberField({ field: 'diameterMm', label: 'coil diameter', unit: 'mm', max: MAX_MM }),
  shielded: booleanField('shielded', 'shielded coil').default(false),
  mode: enumField('mode', COIL_MODES),
  frequenciesHz: arrayOf(
    'frequenciesHz',
    numberField({ field: 'frequenciesHz', label: 'test frequency', unit: 'Hz', max: MAX_FREQUENCY_HZ }),
    1,
    16,
  ),
  // Winding geometry for the coil field models; each is optional and defaults from diameterMm
  // (shared/domain/fields/geometry.ts says how and why). diameterMm is the winding's outside diameter.
  innerDiameterMm: numberField({ field: 'innerDiameterMm', label: 'winding inside diameter', unit: 'mm', atLeast: 0, max: MAX_MM }).optional(),
  lengthMm: numberField({ field: 'lengthMm', label: 'winding length along the coil axis', unit: 'mm', max: MAX_MM }).optional(),
  liftOffMm: numberField({
    field: 'liftOffMm',
    label: 'gap between the winding and the part with the probe on bare metal (wear face)',
    unit: 'mm',
    atLeast: 0,
    max: 100,
  }).optional(),
  spacingMm: numberField({
    field: 'spacingMm',
    label: 'centre-to-centre spacing of the two windings of a differential coil',
    unit: 'mm',
    max: MAX_MM,
  }).optional(),
  pairAxisDeg: z
    .number({ error: "pairAxisDeg (angle of a differential probe's coil pair to the part axis) must be a finite number of degrees" })
    .min(-180, { error: "pairAxisDeg (angle of a differential probe's coil pair to the part axis) must be between -180 and 180°" })
    .max(180, { error: "pairAxisDeg (angle of a differential probe's coil pair to the part axis) must be between -180 and 180°" })
    .optional(),
});

export const ScanSchema = strictObject('scan', {
  indexMm: numberField({ field: 'indexMm', label: 'scan index (step between passes)', unit: 'mm', max: MAX_MM }).optional(),
  minEdgeDistanceMm: numberField({
    field: 'minEdgeDistanceMm',
    label: 'closest coil-centre-to-edge distance in the scan area',
    unit: 'mm',
    atLeast: 0,
    max: MAX_MM,
  }).optional(),
  edgeGuide: booleanField('edgeGuide', 'guide or fixture holds the edge distance').default(false),
});

export const FlawSchema = strictObject('flaw', {
  id: textField('id', 'flaw identifier', 60),
  orientation: enumField('orientation', FLAW_ORIENTATIONS),
  angleDeg: angleDeg.optional(),
  location: enumField('location', FLAW_LOCATIONS),
  depthMm: numberField({
    field: 'depthMm',
    label: 'crack depth for a surface flaw; depth below the inspected surface otherwise',
    unit: 'mm',
    max: MAX_MM,
  }),
  lengthMm: numberField({ field: 'lengthMm', label: 'flaw length', unit: 'mm', max: MAX_MM }),
  metalAboveMm: numberField({
    field: 'metalAboveMm',
    label: 'metal above the flaw in a layered structure (air gaps excluded)',
    unit: 'mm',
    atLeast: 0,
    max: MAX_MM,
  }).optional(),
  throughWallMm: numberField({
    field: 'throughWallMm',
    label: "the flaw's own extent through the wall (default: depthMm for a surface flaw, the wall left below depthMm for a far-side flaw)",
    unit: 'mm',
    max: MAX_MM,
  }).optional(),
});

export const NotchSchema = strictObject('notch', {
  orientation: enumField('orientation', FLAW_ORIENTATIONS),
  angleDeg: angleDeg.optional(),
  // Where the notch sits, as for a flaw; a notch written without it is on the inspected surface.
  location: enumField('location', FLAW_LOCATIONS).default('surface'),
  depthBelowSurfaceMm: numberField({
    field: 'depthBelowSurfaceMm',
    label: 'depth of a subsurface notch below the inspected surface of the standard',
    unit: 'mm',
    max: MAX_MM,
  }).optional(),
  depthMm: numberField({ field: 'depthMm', label: "notch depth (its own extent through the wall)", unit: 'mm', max: MAX_MM }),
  lengthMm: numberField({ field: 'lengthMm', label: 'notch length', unit: 'mm', max: MAX_MM }),
  edgeDistanceMm: numberField({
    field: 'edgeDistanceMm',
    label: 'notch distance from an edge of the reference standard',
    unit: 'mm',
    atLeast: 0,
    max: MAX_MM,
  }).optional(),
}).superRefine((notch, ctx) => {
  if (notch.location === 'subsurface' && notch.depthBelowSurfaceMm === undefined) {
    ctx.addIssue({ code: 'custom', path: ['depthBelowSurfaceMm'], message: 'depthBelowSurfaceMm is required for a subsurface notch: how far below the inspected surface it sits' });
  }
  if (notch.location !== 'subsurface' && notch.depthBelowSurfaceMm !== undefined) {
    ctx.addIssue({ code: 'custom', path: ['depthBelowSurfaceMm'], message: `depthBelowSurfaceMm applies to a subsurface notch; this notch's location is "${notch.location}"` });
  }
});

export const ReferenceStandardSchema = strictObject('reference', {
  conductivityIacs: numberField({
    field: 'conductivityIacs',
    label: 'reference standard conductivity',
    unit: '%IACS',
    max: 120,
  }),
  notches: arrayOf('notches', NotchSchema, 0, 50),
  shimMm: numberField({
    field: 'shimMm',
    label: 'non-conductive shim laid over the reference standard at calibration',
    unit: 'mm',
    atLeast: 0,
    max: 100,
  }).optional(),
});

const TechniqueObjectSchema = strictObject('technique', {
  code: textField('code', 'technique code', 40),
  title: textField('title', 'technique title', 200),
  revision: textField('revision', 'technique revision', 20),
  material: MaterialSchema,
  part: PartSchema,
  coils: arrayOf('coils', CoilSchema, 1, 20),
  scan: ScanSchema,
  flaws: arrayOf('flaws', FlawSchema, 1, 100),
  reference: ReferenceStandardSchema,
  policy: PolicyOverrideSchema.optional(),
});

type TechniqueShape = z.infer<typeof TechniqueObjectSchema>;

/** Inside diameter an internal coil works in: the tube bore or the bore itself. */
export function insideDiameterMm(part: TechniqueShape['part']): number | undefined {
  if (part.form === 'tube' && part.diameterMm !== undefined && part.wallMm !== undefined) return part.diameterMm - 2 * part.wallMm;
  if (part.form === 'bore') return part.diameterMm;
  return undefined;
}

function checkCrossFields(technique: TechniqueShape, ctx: z.RefinementCtx) {
  const { part } = technique;
  const innerMm = insideDiameterMm(part);

  technique.coils.forEach((coil, index) => {
    if (coil.innerDiameterMm !== undefined && coil.innerDiameterMm >= coil.diameterMm) {
      ctx.addIssue({
        code: 'custom',
        path: ['coils', index, 'innerDiameterMm'],
        message: `innerDiameterMm (winding inside diameter, ${coil.innerDiameterMm} mm) must be smaller than the coil diameter, diameterMm (${coil.diameterMm} mm)`,
      });
    }
    if (coil.spacingMm !== undefined && coil.mode !== 'differential') {
      ctx.addIssue({
        code: 'custom',
        path: ['coils', index, 'spacingMm'],
        message: 'spacingMm (spacing of the two windings) applies to a differential coil; this coil is absolute',
      });
    }
    if (coil.type === 'encircling') {
      if (part.form !== 'bar' && part.form !== 'tube') {
        ctx.addIssue({
          code: 'custom',
          path: ['coils', index, 'type'],
          message: `type "encircling" needs a bar or tube part to go round, but part.form is "${part.form}"`,
        });
      } else if (part.diameterMm !== undefined && part.diameterMm > coil.diameterMm) {
        ctx.addIssue({
          code: 'custom',
          path: ['coils', index, 'diameterMm'],
          message: `diameterMm (${coil.diameterMm} mm) of the encircling coil is smaller than the part (${part.diameterMm} mm): fill factor ${((part.diameterMm / coil.diameterMm) ** 2).toFixed(2)} > 1 is impossible geometry`,
        });
      }
    }
    if (coil.type === 'bobbin') {
      if (part.form !== 'tube' && part.form !== 'bore') {
        ctx.addIssue({
          code: 'custom',
          path: ['coils', index, 'type'],
          message: `type "bobbin" is an internal coil and needs a tube or bore, but part.form is "${part.form}"`,
        });
      } else if (innerMm !== undefined && coil.diameterMm > innerMm) {
        ctx.addIssue({
          code: 'custom',
          path: ['coils', index, 'diameterMm'],
          message: `diameterMm (${coil.diameterMm} mm) of the bobbin coil is larger than the inside diameter (${Number(innerMm.toFixed(3))} mm): fill factor ${((coil.diameterMm / innerMm) ** 2).toFixed(2)} > 1 is impossible geometry`,
        });
      }
    }
  });

  const seen = new Set<string>();
  technique.flaws.forEach((flaw, index) => {
    if (seen.has(flaw.id)) {
      ctx.addIssue({ code: 'custom', path: ['flaws', index, 'id'], message: `id "${flaw.id}" is used by another flaw; flaw ids must be unique` });
    }
    seen.add(flaw.id);
    if (flaw.orientation === 'laminar' && flaw.angleDeg !== undefined) {
      ctx.addIssue({
        code: 'custom',
        path: ['flaws', index, 'angleDeg'],
        message: 'angleDeg applies to cracks across the surface; a laminar flaw lies parallel to the surface and has no angle',
      });
    }
    if (flaw.metalAboveMm !== undefined) {
      if (flaw.location === 'surface') {
        ctx.addIssue({
          code: 'custom',
          path: ['flaws', index, 'metalAboveMm'],
          message: 'metalAboveMm applies to a flaw below the surface; a surface flaw has no metal above it',
        });
      } else if (flaw.metalAboveMm > flaw.depthMm) {
        ctx.addIssue({
          code: 'custom',
          path: ['flaws', index, 'metalAboveMm'],
          message: `metalAboveMm (${flaw.metalAboveMm} mm) cannot exceed the flaw's depth below the surface, depthMm (${flaw.depthMm} mm)`,
        });
      }
    }
    const limit = depthLimitMm(part);
    if (limit && flaw.depthMm > limit.mm) {
      ctx.addIssue({
        code: 'custom',
        path: ['flaws', index, 'depthMm'],
        message: `depthMm (${flaw.depthMm} mm) is deeper than the part: ${limit.what} is ${Number(limit.mm.toFixed(3))} mm`,
      });
    }
  });
}

function depthLimitMm(part: TechniqueShape['part']): { mm: number; what: string } | undefined {
  if (part.form === 'plate' && part.thicknessMm !== undefined) return { mm: part.thicknessMm, what: 'part.thicknessMm' };
  if (part.form === 'tube' && part.wallMm !== undefined) return { mm: part.wallMm, what: 'part.wallMm' };
  if (part.form === 'bar' && part.diameterMm !== undefined) return { mm: part.diameterMm / 2, what: 'the bar radius' };
  return undefined;
}

export const TechniqueSchema = TechniqueObjectSchema.superRefine(checkCrossFields);

/** A technique after validation, defaults applied. */
export type Technique = z.infer<typeof TechniqueSchema>;
/** What a caller may send: defaults (relativePermeability 1, saturated false, shielded false, edgeGuide false) optional. */
export type TechniqueInput = z.input<typeof TechniqueSchema>;
export type Coil = Technique['coils'][number];
export type Flaw = Technique['flaws'][number];
export type Notch = Technique['reference']['notches'][number];
export type Part = Technique['part'];
