// The chart data the technique screens draw, checked against limits of the physics
// rather than against numbers the code produced itself.
import { describe, expect, it } from 'vitest';
import { parseTechnique, type Technique } from '../../../shared/domain/checklist';
import { densityMap, depthCurves, impedancePlane } from '../../../shared/domain/fields/charts';
import { standardDepthMm } from '../../../shared/domain/physics';

function plate(diameterMm: number, frequenciesHz: number[]): Technique {
  const parsed = parseTechnique({
    code: 'CHART-1',
    title: 'Chart check',
    revision: 'A',
    material: { name: 'Aluminium alloy, 32 %IACS', conductivityIacs: 32 },
    part: { form: 'plate', thicknessMm: 40 },
    coils: [{ type: 'surface', diameterMm, mode: 'absolute', frequenciesHz }],
    scan: { indexMm: diameterMm / 4 },
    flaws: [{ id: 'deep', orientation: 'transverse', location: 'subsurface', depthMm: 2, lengthMm: 10 }],
    reference: { conductivityIacs: 32, notches: [] },
  });
  if (!parsed.success) throw new Error(JSON.stringify(parsed.issues));
  return parsed.data;
}

describe('chart data from the coil field models', () => {
  it('when the coil is very much larger than δ, then its density curve follows the plane wave e^(−x/δ) (the plane-wave limit: standard ET formula sheets)', () => {
    const technique = plate(400, [20_000]);
    const deltaMm = standardDepthMm(20_000, 32);
    const [curve] = depthCurves({ technique, relativePermeability: 1 }, 3 * deltaMm, 12);
    for (const point of curve.points) expect(point.coilRatio!).toBeCloseTo(Math.exp(-point.depthMm / deltaMm), 2);
  });

  it('when the coil is small against δ, then its density falls faster with depth than the plane wave (the finite coil’s field spreads: Dodd & Deeds 1968)', () => {
    const technique = plate(2, [200]);
    const [curve] = depthCurves({ technique, relativePermeability: 1 }, 5, 10);
    const at5 = curve.points.at(-1)!;
    expect(at5.depthMm).toBeCloseTo(5, 9);
    expect(at5.coilRatio!).toBeLessThan(at5.planeWaveRatio / 10);
  });

  it('when the chart reaches past a plate’s far side, then the coil’s curve stops there while the plane wave goes on', () => {
    const technique = plate(400, [20_000]);
    const [curve] = depthCurves({ technique, relativePermeability: 1 }, 80, 8);
    expect(curve.points.filter((point) => point.depthMm <= 40).every((point) => point.coilRatio !== null)).toBe(true);
    expect(curve.points.filter((point) => point.depthMm > 40).every((point) => point.coilRatio === null)).toBe(true);
    expect(curve.points.every((point) => point.planeWaveRatio > 0)).toBe(true);
  });

  it('when the frequency falls far below the test frequency, then the locus ends near the coil in air at (0, 1): ΔZ → 0 as f → 0', () => {
    const technique = plate(10, [1_000]);
    const plane = impedancePlane({ technique, relativePermeability: 1 }, 0, 12);
    const lowest = plane.locus[0];
    expect(Math.hypot(lowest.resistance, lowest.reactance - 1)).toBeLessThan(0.05);
    // A non-magnetic conductor lowers the reactance as the frequency rises (eddy currents oppose the coil's flux).
    expect(plane.locus.at(-1)!.reactance).toBeLessThan(lowest.reactance);
    const [point] = plane.testPoints;
    expect(point.flaws).toHaveLength(1);
    expect(point.flaws[0].separationDeg).toBeGreaterThanOrEqual(0);
    expect(point.flaws[0].separationDeg).toBeLessThanOrEqual(90);
  });

  it('when the density map is drawn, then no current flows on the coil’s axis and the densest cell lies near the winding’s radius at the surface (the induced current follows the winding)', () => {
    const technique = plate(10, [100_000]);
    const map = densityMap({ technique, relativePermeability: 1 }, 0, 0, { columns: 20, rows: 8 })!;
    const top = map.relative[0];
    expect(top[0]).toBeLessThan(0.15);
    const peak = map.radiiMm[top.indexOf(Math.max(...top))];
    expect(peak).toBeGreaterThan(map.winding.innerRadiusMm * 0.7);
    expect(peak).toBeLessThan(map.winding.outerRadiusMm * 1.4);
    // Deeper rows carry less current than the surface row.
    expect(Math.max(...map.relative.at(-1)!)).toBeLessThan(Math.max(...top));
  });
});
