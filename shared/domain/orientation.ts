// Flaw orientation against induced-current direction, in the part's local frame:
// u = axial or longitudinal, v = circumferential or transverse, n = surface normal.
// A flaw is found when the current crosses its plane, i.e. when the current has a
// component along the plane's normal; it is missed when the current runs along it.
import type { CoilType, FlawOrientation } from '../schemas/technique';

export type Vec3 = readonly [u: number, v: number, n: number];

export const U: Vec3 = [1, 0, 0];
export const V: Vec3 = [0, 1, 0];
export const N: Vec3 = [0, 0, 1];

/** Normal of the flaw's plane for each named orientation. */
const ORIENTATION_NORMALS: Readonly<Record<FlawOrientation, Vec3>> = {
  axial: V, // crack plane holds the axis and the surface normal
  radial: V, // radial-axial plane, as a seam in a bar or a crack from a bore
  longitudinal: V,
  circumferential: U, // crack plane holds the circumference and the normal
  transverse: U,
  laminar: N, // parallel to the surface
};

/** The normal of a crack's plane: from its angle to the part axis when given, else from its orientation. */
export function flawNormal(orientation: FlawOrientation, angleDeg?: number): Vec3 {
  if (angleDeg !== undefined && orientation !== 'laminar') {
    const a = (angleDeg * Math.PI) / 180;
    return [-Math.sin(a), Math.cos(a), 0];
  }
  return ORIENTATION_NORMALS[orientation];
}

/**
 * Directions the coil's induced current takes: every direction in the u–v plane
 * (surface, pencil, rotating), or a fixed set (encircling and bobbin: v only;
 * multidirectional assemblies: u and v). For the UI's current-direction diagram.
 */
export type CurrentDirections = { kind: 'in-plane' } | { kind: 'set'; directions: readonly Vec3[] };

const IN_PLANE: CurrentDirections = { kind: 'in-plane' };
const CIRCUMFERENTIAL_ONLY: CurrentDirections = { kind: 'set', directions: [V] };
const AXIAL_AND_CIRCUMFERENTIAL: CurrentDirections = { kind: 'set', directions: [U, V] };

export const COIL_CURRENT_DIRECTIONS: Readonly<Record<CoilType, CurrentDirections>> = {
  surface: IN_PLANE,
  pencil: IN_PLANE,
  rotating: IN_PLANE,
  encircling: CIRCUMFERENTIAL_ONLY,
  bobbin: CIRCUMFERENTIAL_ONLY,
  multidirectional: AXIAL_AND_CIRCUMFERENTIAL,
};

/** Plain words for each coil's current directions, for messages. */
export const COIL_CURRENT_WORDS: Readonly<Record<CoilType, string>> = {
  surface: 'in every direction parallel to the surface',
  pencil: 'in every direction parallel to the surface',
  rotating: 'in every direction parallel to the surface',
  encircling: 'around the part (along v) only',
  bobbin: 'around the tube or bore (along v) only',
  multidirectional: 'along u and along v',
};

/** Sensitivity = max over the coil's current directions of |current · normal| (0 = current runs along the flaw, 1 = square across it). */
export function orientationSensitivity(coilType: CoilType, normal: Vec3): number {
  const directions = COIL_CURRENT_DIRECTIONS[coilType];
  if (directions.kind === 'in-plane') {
    // The best in-plane unit vector is the normal's in-plane projection, normalised.
    return Math.hypot(normal[0], normal[1]);
  }
  let best = 0;
  for (const direction of directions.directions) {
    const dot = Math.abs(direction[0] * normal[0] + direction[1] * normal[1] + direction[2] * normal[2]);
    if (dot > best) best = dot;
  }
  return best;
}

/** |cos| of the angle between two flaw planes, via their normals. */
export function normalAlignment(a: Vec3, b: Vec3): number {
  return Math.abs(a[0] * b[0] + a[1] * b[1] + a[2] * b[2]);
}
