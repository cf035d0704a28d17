// Rule 4: near an edge the edge signal swamps flaw signals unless the coil-to-edge
// distance is held constant (a guide or fixture) and calibrated on a reference
// notch at that same edge distance. The edge zone is measured from the winding's
// outer edge, so the coil centre must stay at least radius + zone from the edge
// (docs/domain-rules.md, "Edge effect").
import { mm, sig } from '../format';
import type { Rule } from '../types';

const BASIS =
  '[mem] edge zone beyond the winding of policy edgeZoneUnshieldedDiameters (default 2) coil diameters unshielded, edgeZoneShieldedDiameters (default 0.5) shielded, so the coil centre must stay radius + zone from the edge; guide and edge notch required inside it';

/** Closest coil-centre-to-edge distance clear of the edge zone: the coil's radius plus the zone beyond its winding. */
export function clearCentreDistanceMm(diameterMm: number, zoneDiameters: number): number {
  return diameterMm / 2 + zoneDiameters * diameterMm;
}

export const edgeEffect: Rule = ({ technique, policy, coilNames }, results) => {
  const { coils, scan, reference } = technique;
  const edgeMm = scan.minEdgeDistanceMm;
  const surfaceCoils = coils.flatMap((coil, c) => (coil.type === 'encircling' || coil.type === 'bobbin' ? [] : [c]));
  if (surfaceCoils.length === 0 || edgeMm === undefined) {
    results.push({
      rule: 'edge-effect',
      status: 'not_applicable',
      message:
        surfaceCoils.length === 0
          ? 'Only encircling or bobbin coils: no coil is scanned towards an edge (end effects at tube or bar ends are outside this rule).'
          : 'The technique states no edge in the scan area (scan.minEdgeDistanceMm absent).',
      values: {},
      basis: BASIS,
    });
    return;
  }

  const tolerance = policy.edgeNotchToleranceMm;
  const edgeNotch = reference.notches.find((notch) => notch.edgeDistanceMm !== undefined && Math.abs(notch.edgeDistanceMm - edgeMm) <= tolerance + 1e-9);

  for (const c of surfaceCoils) {
    const coil = coils[c];
    const factor = coil.shielded ? policy.edgeZoneShieldedDiameters : policy.edgeZoneUnshieldedDiameters;
    const zoneMm = factor * coil.diameterMm;
    const radiusMm = coil.diameterMm / 2;
    const clearMm = clearCentreDistanceMm(coil.diameterMm, factor);
    const shieldedClearMm = clearCentreDistanceMm(coil.diameterMm, policy.edgeZoneShieldedDiameters);
    const values = {
      minEdgeDistanceMm: edgeMm,
      edgeZoneMm: zoneMm,
      coilRadiusMm: radiusMm,
      clearCentreDistanceMm: clearMm,
      edgeGuide: scan.edgeGuide,
      edgeNotchDistanceMm: edgeNotch?.edgeDistanceMm ?? null,
    };
    const zoneWords = `an edge zone of ${mm(zoneMm)} (${sig(factor)} × diameter) beyond the winding of ${coilNames[c]}, so its centre must stay ${mm(clearMm)} from an edge (radius ${mm(radiusMm)} + ${mm(zoneMm)})`;
    const overhang = edgeMm < radiusMm ? ` At ${mm(edgeMm)} from the centre the winding itself overhangs the edge.` : '';
    if (edgeMm >= clearMm * (1 - 1e-9)) {
      results.push({
        rule: 'edge-effect',
        status: 'pass',
        coil: c,
        message: `The coil centre comes no closer than ${mm(edgeMm)} to an edge: clear of ${zoneWords}.`,
        values,
        basis: BASIS,
      });
      continue;
    }
    if (scan.edgeGuide && edgeNotch) {
      results.push({
        rule: 'edge-effect',
        status: 'pass',
        coil: c,
        message:
          `The coil centre comes within ${mm(edgeMm)} of an edge, inside ${zoneWords}.${overhang} ` +
          `A guide holds the coil-to-edge distance and a reference notch sits ${mm(edgeNotch.edgeDistanceMm ?? edgeMm)} from an edge, so the edge signal is constant and calibrated.`,
        values,
        basis: BASIS,
      });
      continue;
    }
    const missing = [
      ...(scan.edgeGuide ? [] : ['a guide or fixture holding the coil-to-edge distance constant']),
      ...(edgeNotch ? [] : [`a reference notch at ${mm(edgeMm)} from an edge (within ±${mm(tolerance)})`]),
    ];
    const fixes = ['add what is missing'];
    if (!coil.shielded) {
      fixes.push(
        shieldedClearMm <= edgeMm
          ? `use a shielded probe of this size (its centre needs only ${mm(shieldedClearMm)} from the edge)`
          : 'use a shielded probe',
      );
    }
    fixes.push('use a higher frequency', `or keep the coil centre at least ${mm(clearMm)} from the edge`);
    results.push({
      rule: 'edge-effect',
      status: 'fail',
      coil: c,
      message:
        `The coil centre comes within ${mm(edgeMm)} of an edge, inside ${zoneWords}.${overhang} ` +
        `There the edge signal swamps flaw signals unless the coil-to-edge distance is held constant. Missing: ${missing.join('; ')}. ` +
        `To fix: ${fixes.join(', ')}.`,
      values,
      basis: BASIS,
    });
  }
};
