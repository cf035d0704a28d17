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
 * For screens (React components call these directly; all cached):
 *   planarDensityProfile(coil, layers, f, maxDepthMm, points?) → [{ depthMm, densityRatio, phaseDeg }]   density against depth
 *   planarImpedanceLocus(coil, layers, frequenciesHz) → [{ frequencyHz, impedanceNormalised, liftOffDirection }]
 *   planarFlawDirections(coil, layers, f, depthsMm) → [{ depthMm, flawResponse, phaseSeparationDeg }]
 *   planarDensityMap(coil, layers, f, { maxRadiusMm, maxDepthMm, columns?, rows? }) → { radiiMm, depthsMm, densityRatio[row][col] }
 * For a technique, checklist/coil-field.ts builds the layers (planarLayers) and answers per coil,
 * frequency and flaw (coilFieldAtDepth).
 */
export type { CoilGeometry, PlanarLayer } from './types';
export { solvePlanar, airCoilInductanceH, lineAngleDeg, planarProblem } from './planar';
export type { PlanarSolution, PlanarOptions } from './planar';
export { coilGeometry, bareMetalGeometry, DEFAULT_INNER_TO_OUTER, DEFAULT_LENGTH_TO_DIAMETER, DEFAULT_PROBE_LIFT_OFF_MM } from './geometry';
export { planarDensityProfile, planarImpedanceLocus, planarFlawDirections, planarDensityMap } from './planar-charts';
export type { PlanarDensityPoint, PlanarLocusPoint, FlawDirection } from './planar-charts';
export { gaussLegendreRule, integrateAdaptive, integrateAdaptiveComplex, integrateToInfinity } from './quadrature';
// Long coils (encircling, bobbin):
export { solveLongCoil, densityProfile, impedanceLocus } from './cylinder';
export type { LongCoilInput, LongCoilSolution, LongCoilPlacement, DensityPoint } from './cylinder';
export { tubeLimitFrequencyHz } from './tube-limit-frequency';
