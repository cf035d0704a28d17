import type { TechniqueRevisionState } from '../schemas/technique-register';
import type { CERTIFICATION_SCHEMES } from '../schemas/certification';
import type { CoilType, FlawLocation, FlawOrientation, PartForm } from '../schemas/technique';

export const TECHNIQUE_STATE_LABELS: Record<TechniqueRevisionState, string> = {
  draft: 'Draft',
  approved: 'Approved',
  superseded: 'Superseded',
};

export const CERTIFICATION_SCHEME_LABELS: Record<(typeof CERTIFICATION_SCHEMES)[number], string> = {
  'ISO 9712': 'ISO 9712 (central certification)',
  'EN 4179': 'EN 4179 (aerospace)',
  'written practice': "Employer's written practice",
};

export const PART_FORM_LABELS: Record<PartForm, string> = {
  plate: 'Plate or sheet (flat or gently curved surface)',
  bar: 'Solid bar or rod',
  tube: 'Tube',
  bore: 'Bore or fastener hole',
};

export const COIL_TYPE_LABELS: Record<CoilType, string> = {
  surface: 'Surface (flat) coil',
  pencil: 'Pencil probe',
  rotating: 'Rotating probe',
  encircling: 'Encircling coil',
  bobbin: 'Internal bobbin coil',
  multidirectional: 'Multi-directional assembly',
};

export const ORIENTATION_LABELS: Record<FlawOrientation, string> = {
  axial: 'Axial',
  circumferential: 'Circumferential',
  radial: 'Radial',
  laminar: 'Laminar (parallel to the surface)',
  longitudinal: 'Longitudinal',
  transverse: 'Transverse',
};

export const LOCATION_LABELS: Record<FlawLocation, string> = {
  surface: 'Open to the inspected surface',
  subsurface: 'Below the surface',
  'far-side': 'Far side (opposite wall)',
  center: 'At the centre of a bar',
};
