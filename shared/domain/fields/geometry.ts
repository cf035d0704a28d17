// The winding a technique's coil stands for, with documented defaults for what the
// technique does not say. Every technique written before the geometry fields existed
// keeps loading: all of them derive from the coil diameter.
import type { Coil, Part } from '../../schemas/technique';
import type { CoilGeometry } from './types';

/** Inside diameter of the winding as a fraction of its outside diameter, when not given. */
export const DEFAULT_INNER_TO_OUTER = 0.6;
/** Winding length as a fraction of its outside diameter, when not given. */
export const DEFAULT_LENGTH_TO_DIAMETER = 0.5;
/** Gap from winding to bare metal (probe wear face), when not given, in mm. */
export const DEFAULT_PROBE_LIFT_OFF_MM = 0.1;

/**
 * The winding of `coil` for the field models, and the lift-off it sees on `part`.
 *
 * - Outer radius = diameterMm / 2: the diameter a technique quotes is the coil's, i.e. the
 *   winding's outside diameter (for an encircling coil, its bore; for a bobbin, its outside).
 * - Inner radius = innerDiameterMm / 2, else 0.6 × the outer radius: a typical pencil or
 *   surface winding on a former leaves about that much of its diameter free. The density
 *   under the winding barely depends on it (it sits at the mean radius).
 * - Length = lengthMm, else 0.5 × diameterMm: a typical flat winding. A longer winding
 *   puts turns further from the part, so a shorter default keeps the field's reach on the
 *   generous side only slightly; the reach is set mostly by the diameter.
 * - Lift-off = liftOffMm (else 0.1 mm, a probe's wear face) plus part.coatingMm: a
 *   non-conductive coating is lift-off and nothing else.
 *
 * Common practice, no single source: the defaults are ordinary proportions, not a standard;
 * a technique that states the geometry overrides them.
 */
export function coilGeometry(coil: Coil, part: Pick<Part, 'coatingMm'>): CoilGeometry {
  const outerRadiusMm = coil.diameterMm / 2;
  const innerRadiusMm = coil.innerDiameterMm !== undefined ? coil.innerDiameterMm / 2 : DEFAULT_INNER_TO_OUTER * outerRadiusMm;
  const lengthMm = coil.lengthMm ?? DEFAULT_LENGTH_TO_DIAMETER * coil.diameterMm;
  const liftOffMm = (coil.liftOffMm ?? DEFAULT_PROBE_LIFT_OFF_MM) + (part.coatingMm ?? 0);
  return { innerRadiusMm, outerRadiusMm, lengthMm, liftOffMm };
}

/** The same winding with its lift-off on bare metal (no coating): the calibration's reference point. */
export function bareMetalGeometry(coil: Coil): CoilGeometry {
  return coilGeometry(coil, {});
}
