// Rule 4: near an edge the edge signal swamps flaw signals unless the coil-to-edge
// distance is held constant (a guide or fixture) and calibrated on a reference
// notch at that same edge distance.
import { mm, sig } from '../format';
import type { Rule } from '../types';

const BASIS =
  '[mem] edge zone of policy edgeZoneUnshieldedDiameters (default 2) coil diameters unshielded, edgeZoneShieldedDiameters (default 0.5) shielded; guide and edge notch required inside it';

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
    const shieldedZoneMm = policy.edgeZoneShieldedDiameters * coil.diameterMm;
    const values = {
      minEdgeDistanceMm: edgeMm,
      edgeZoneMm: zoneMm,
      edgeGuide: scan.edgeGuide,
      edgeNotchDistanceMm: edgeNotch?.edgeDistanceMm ?? null,
    };
    if (edgeMm >= zoneMm) {
      results.push({
        rule: 'edge-effect',
        status: 'pass',
        coil: c,
        message: `The scan comes no closer than ${mm(edgeMm)} to an edge, outside the ${mm(zoneMm)} edge zone (${sig(factor)} × diameter) of ${coilNames[c]}.`,
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
          `The scan comes within ${mm(edgeMm)} of an edge, inside the ${mm(zoneMm)} edge zone of ${coilNames[c]}, ` +
          `but a guide holds the coil-to-edge distance and a reference notch sits ${mm(edgeNotch.edgeDistanceMm ?? edgeMm)} from an edge, so the edge signal is constant and calibrated.`,
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
      fixes.push(shieldedZoneMm <= edgeMm ? `use a shielded probe of this size (edge zone ${mm(shieldedZoneMm)}, clear of this edge)` : 'use a shielded probe');
    }
    fixes.push('use a higher frequency', `or keep the scan at least ${mm(zoneMm)} from the edge`);
    results.push({
      rule: 'edge-effect',
      status: 'fail',
      coil: c,
      message:
        `The scan comes within ${mm(edgeMm)} of an edge, inside the ${mm(zoneMm)} edge zone (${sig(factor)} × diameter) of ${coilNames[c]}, ` +
        `where the edge signal swamps flaw signals unless the coil-to-edge distance is held constant. Missing: ${missing.join('; ')}. ` +
        `To fix: ${fixes.join(', ')}.`,
      values,
      basis: BASIS,
    });
  }
};
