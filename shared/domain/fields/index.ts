/**
 * Coil field models: pure TypeScript, no I/O, usable in the browser. Physics, assumptions and
 * accuracy: docs/domain.md ("Coil fields").
 *
 * Planar (surface, pencil, rotating coils over plates and walls; Dodd–Deeds):
 *   solvePlanar(coil: CoilGeometry, layers: PlanarLayer[], frequencyHz) → PlanarSolution
 *       { impedanceNormalised (ΔZ/ωL0), impedanceChangeOhm, liftOffDirection, airInductancePerTurnSquaredH,
 *         densityAt(rMm, depthMm) (A/m² per ampere-turn), densityUnderWindingRelative(depthMm) (complex),
 *         densityRatioUnderWinding(depthMm), flawResponseAtDepth(depthMm) }
 *   coilGeometry(coil, part) → CoilGeometry   (the technique's coil, defaults from diameterMm)
 * For screens (React components call these, deferred; the solutions they use are cached):
 *   depthCurves({ technique, relativePermeability }, maxDepthMm, points?) → per coil and frequency, this coil's density and the plane wave against depth
 *   impedancePlane(setting, coilIndex) → { locus over frequency, test points with the lift-off and each flaw's direction and their angle }
 *   densityMap(setting, coilIndex, frequencyIndex) → |J| in the r–z plane under a probe (null for a long coil)
 * For a technique, checklist/coil-field.ts builds the layers (planarLayers) and answers per coil,
 * frequency and flaw (coilFieldAtDepth).
 */
export type { CoilGeometry, PlanarLayer } from './types';
export { solvePlanar, airCoilInductanceH, lineAngleDeg, planarProblem } from './planar';
export type { PlanarSolution, PlanarOptions } from './planar';
export { coilGeometry, bareMetalGeometry, DEFAULT_INNER_TO_OUTER, DEFAULT_LENGTH_TO_DIAMETER, DEFAULT_PROBE_LIFT_OFF_MM } from './geometry';
// What the technique screens draw (density against depth, the impedance plane, the r–z density map), for every coil type.
export { depthCurves, impedancePlane, densityMap } from './charts';
export type { DepthCurve, DepthCurvePoint, ImpedancePlane, PlanePoint, FlawDirection, DensityMap } from './charts';
export { gaussLegendreRule, integrateAdaptive, integrateAdaptiveComplex, integrateToInfinity } from './quadrature';
// Long coils (encircling, bobbin):
export { solveLongCoil, densityProfile, impedanceLocus } from './cylinder';
export type { LongCoilInput, LongCoilSolution, LongCoilPlacement, DensityPoint } from './cylinder';
export { tubeLimitFrequencyHz } from './tube-limit-frequency';
