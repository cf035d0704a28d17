// Shapes the coil field models read. Millimetres and SI otherwise; units in the names.

/**
 * One layer of a planar conductor, from the surface the coil faces downwards.
 * An air gap is a layer with conductivityMsPerM 0 and relativePermeability 1.
 */
export interface PlanarLayer {
  /** Layer thickness; Infinity for a half-space (only the last layer may be one). */
  thicknessMm: number;
  /** 0 for an air gap or a non-conductive layer. */
  conductivityMsPerM: number;
  relativePermeability: number;
}

/**
 * An air-core circular coil of rectangular cross-section, axis normal to the surface.
 * innerRadiusMm = outerRadiusMm and lengthMm = 0 make a single filament loop.
 */
export interface CoilGeometry {
  innerRadiusMm: number;
  outerRadiusMm: number;
  /** Winding length along the axis. */
  lengthMm: number;
  /** Gap between the winding's face and the first layer (probe wear face, coating, shim). */
  liftOffMm: number;
}
