// Five invented techniques of Tarnbrook Aero Components, a fictional component-repair
// shop, for the demo seed. Invented data: not taken from any real technique.
// Some fail on purpose (an orientation gap, an uncontrolled edge, a core flaw).
import type { Technique } from '../schemas/technique';
import type { RuleId, Verdict } from './checklist/types';

export const DEMO_TECHNIQUES: readonly Technique[] = [
  {
    code: 'TAC-ET-004',
    title: 'Wheel half bead seat, surface scan',
    revision: 'C',
    material: { name: '2014-T6 forging', conductivityIacs: 40, relativePermeability: 1, saturated: false },
    part: { form: 'plate', thicknessMm: 12 },
    coils: [{ type: 'surface', diameterMm: 5, shielded: true, mode: 'absolute', frequenciesHz: [200_000] }],
    scan: { indexMm: 2, minEdgeDistanceMm: 1.5, edgeGuide: true },
    flaws: [
      { id: 'transverse-crack', orientation: 'transverse', location: 'surface', depthMm: 0.5, lengthMm: 3 },
      { id: 'longitudinal-crack', orientation: 'longitudinal', location: 'surface', depthMm: 0.5, lengthMm: 3 },
    ],
    reference: {
      conductivityIacs: 40,
      notches: [
        { orientation: 'transverse', location: 'surface', depthMm: 0.5, lengthMm: 3, edgeDistanceMm: 1.5 },
        { orientation: 'longitudinal', location: 'surface', depthMm: 0.5, lengthMm: 3 },
      ],
    },
  },
  {
    code: 'TAC-ET-011',
    title: 'Fastener-hole bores, rotating probe',
    revision: 'B',
    material: { name: '7075-T6 plate', conductivityIacs: 32, relativePermeability: 1, saturated: false },
    part: { form: 'bore', diameterMm: 6.35, thicknessMm: 6 },
    // The differential pair lies along the rotation (90° to the bore axis), so axial and radial cracks cross it.
    coils: [{ type: 'rotating', diameterMm: 1.5, shielded: true, mode: 'differential', frequenciesHz: [500_000], pairAxisDeg: 90 }],
    // Helical pitch per revolution; a depth stop holds the probe 0.5 mm from each end of the bore.
    scan: { indexMm: 0.5, minEdgeDistanceMm: 0.5, edgeGuide: true },
    flaws: [
      { id: 'bore-crack', orientation: 'axial', location: 'surface', depthMm: 0.5, lengthMm: 0.76 },
      { id: 'corner-crack', orientation: 'radial', location: 'surface', depthMm: 0.5, lengthMm: 0.76 },
    ],
    reference: {
      conductivityIacs: 31,
      notches: [{ orientation: 'axial', location: 'surface', depthMm: 0.5, lengthMm: 0.76, edgeDistanceMm: 0.5 }],
    },
  },
  {
    code: 'TAC-ET-017',
    title: 'Bar stock receiving inspection, encircling coil',
    revision: 'A',
    material: { name: '2024-T351 bar', conductivityIacs: 30, relativePermeability: 1, saturated: false },
    part: { form: 'bar', diameterMm: 25 },
    coils: [{ type: 'encircling', diameterMm: 28, shielded: false, mode: 'differential', frequenciesHz: [500] }],
    scan: { edgeGuide: false },
    flaws: [
      { id: 'surface-seam', orientation: 'axial', location: 'surface', depthMm: 0.3, lengthMm: 25 },
      // The deliberate gap: a centreline flaw that no encircling coil can see.
      { id: 'centreline-pipe', orientation: 'axial', location: 'center', depthMm: 12.5, lengthMm: 50 },
    ],
    reference: {
      conductivityIacs: 30,
      notches: [{ orientation: 'axial', location: 'surface', depthMm: 0.3, lengthMm: 25 }],
    },
  },
  {
    code: 'TAC-ET-023',
    title: 'Heat-exchanger tubes, internal bobbin coil',
    revision: 'A',
    material: { name: '70/30 brass', conductivityIacs: 28, relativePermeability: 1, saturated: false },
    part: { form: 'tube', diameterMm: 19.05, wallMm: 1.24 },
    coils: [{ type: 'bobbin', diameterMm: 15.5, shielded: false, mode: 'differential', frequenciesHz: [40_000, 160_000] }],
    scan: { edgeGuide: false },
    flaws: [
      { id: 'axial-crack', orientation: 'axial', location: 'far-side', depthMm: 1.0, lengthMm: 10 },
      // The deliberate gap: bobbin currents flow around the tube, along this crack.
      { id: 'circ-crack', orientation: 'circumferential', location: 'far-side', depthMm: 1.0, lengthMm: 10 },
    ],
    reference: {
      conductivityIacs: 28,
      // Outside-diameter notches: the cracks grow from the far side, 0.24 mm of the 1.24 mm wall.
      notches: [
        { orientation: 'axial', location: 'far-side', depthMm: 0.24, lengthMm: 10 },
        { orientation: 'circumferential', location: 'far-side', depthMm: 0.24, lengthMm: 10 },
      ],
    },
  },
  {
    code: 'TAC-ET-031',
    title: 'Lap joint second layer, low-frequency surface scan',
    revision: 'D',
    material: { name: '2024-T3 clad sheet', conductivityIacs: 30, relativePermeability: 1, saturated: false },
    // 1.6 mm skin over a 1.6 mm doubler with 0.1 mm of sealant between.
    part: { form: 'plate', thicknessMm: 3.3 },
    coils: [{ type: 'surface', diameterMm: 12.7, shielded: false, mode: 'differential', frequenciesHz: [2_000] }],
    // The deliberate gap: the fastener row runs 10 mm from the skin edge, scanned free-hand.
    scan: { indexMm: 6, minEdgeDistanceMm: 10, edgeGuide: false },
    flaws: [
      {
        id: 'second-layer-crack',
        orientation: 'transverse',
        location: 'subsurface',
        depthMm: 1.7,
        lengthMm: 5,
        metalAboveMm: 1.6,
        throughWallMm: 1.0,
      },
    ],
    reference: {
      conductivityIacs: 30,
      // A notch in the doubler of a reference lap joint, under the same skin and sealant.
      notches: [{ orientation: 'transverse', location: 'subsurface', depthBelowSurfaceMm: 1.7, depthMm: 1.0, lengthMm: 5 }],
    },
  },
];

/**
 * A later bar technique written from TAC-ET-017 for thicker stock, and with the
 * same weakness: it claims a centreline flaw an encircling coil cannot see. In
 * the demo it is what an extent-of-condition run from TAC-ET-017's finding finds.
 * Kept out of DEMO_TECHNIQUES (the five of the audit scenario).
 */
export const DEMO_SISTER_TECHNIQUE: Technique = {
  code: 'TAC-ET-019',
  title: 'Bar stock 40 mm receiving inspection, encircling coil',
  revision: 'A',
  material: { name: '2024-T351 bar', conductivityIacs: 30, relativePermeability: 1, saturated: false },
  part: { form: 'bar', diameterMm: 40 },
  coils: [{ type: 'encircling', diameterMm: 44, shielded: false, mode: 'differential', frequenciesHz: [250] }],
  scan: { edgeGuide: false },
  flaws: [
    { id: 'surface-seam', orientation: 'axial', location: 'surface', depthMm: 0.3, lengthMm: 25 },
    { id: 'centreline-burst', orientation: 'axial', location: 'center', depthMm: 20, lengthMm: 60 },
  ],
  reference: {
    conductivityIacs: 30,
    notches: [{ orientation: 'axial', location: 'surface', depthMm: 0.3, lengthMm: 25 }],
  },
};

/**
 * A second-layer technique for the thick wing-skin lap joints, written from TAC-ET-031 with a small
 * pencil probe to reach between the fastener heads. By the plane-wave figures it reaches the doubler
 * (3δ = 11.4 mm at 1 kHz, 4 mm of metal above the crack), but the field of a 3 mm probe falls to about
 * 2 % of its surface density 4 mm down: the coil is too small for the second layer, whatever the
 * frequency. Approved long ago; the field-based penetration check finds it and the Structures Bay
 * audit raises a finding from it. Kept out of DEMO_TECHNIQUES (the five of the first audits).
 */
export const DEMO_SECOND_LAYER_TECHNIQUE: Technique = {
  code: 'TAC-ET-036',
  title: 'Wing skin lap joint, second layer at the fastener row, pencil probe',
  revision: 'A',
  material: { name: '2024-T3 sheet', conductivityIacs: 30, relativePermeability: 1, saturated: false },
  // 4 mm skin over a 4 mm doubler with 0.1 mm of sealant between.
  part: { form: 'plate', thicknessMm: 8.1 },
  coils: [{ type: 'pencil', diameterMm: 3, shielded: true, mode: 'absolute', frequenciesHz: [1_000] }],
  scan: { indexMm: 1.5, edgeGuide: false },
  flaws: [
    {
      id: 'doubler-crack',
      orientation: 'transverse',
      location: 'subsurface',
      depthMm: 4.1,
      lengthMm: 6,
      metalAboveMm: 4.0,
      throughWallMm: 1.5,
    },
  ],
  reference: {
    conductivityIacs: 30,
    // A notch in the doubler of a reference lap joint of the same stack.
    notches: [{ orientation: 'transverse', location: 'subsurface', depthBelowSurfaceMm: 4.1, depthMm: 1.5, lengthMm: 6 }],
  },
};

export interface DemoTechniqueNote {
  /** The demo area the technique belongs to. */
  area: 'Wheel and Brake Shop' | 'Structures Bay' | 'Receiving Inspection';
  /** What the checklist engine returns for it with the default policy. */
  expectedVerdict: Verdict;
  failingRules: readonly RuleId[];
}

export const DEMO_TECHNIQUE_NOTES: Readonly<Record<string, DemoTechniqueNote>> = {
  'TAC-ET-004': { area: 'Wheel and Brake Shop', expectedVerdict: 'conforms', failingRules: [] },
  'TAC-ET-011': { area: 'Structures Bay', expectedVerdict: 'conforms', failingRules: [] },
  // The surface notch cannot stand for the centreline flaw either, and the differential coil sees the 25 mm seam only at its ends (a warning).
  'TAC-ET-017': { area: 'Receiving Inspection', expectedVerdict: 'does-not-conform', failingRules: ['center-effect', 'reference-standard'] },
  'TAC-ET-023': { area: 'Receiving Inspection', expectedVerdict: 'does-not-conform', failingRules: ['orientation-coverage'] },
  'TAC-ET-031': { area: 'Structures Bay', expectedVerdict: 'does-not-conform', failingRules: ['edge-effect'] },
  // Conformed by the plane-wave figures; the field of its 3 mm probe does not reach the doubler.
  'TAC-ET-036': { area: 'Structures Bay', expectedVerdict: 'does-not-conform', failingRules: ['penetration-depth'] },
  'TAC-ET-019': { area: 'Receiving Inspection', expectedVerdict: 'does-not-conform', failingRules: ['center-effect', 'reference-standard'] },
};
